import { childrenOf, type Expr, type NameExpr } from './ast';
import { BUILTIN_CONSTANTS } from './functions';

/**
 * The identifiers a formula reads that are not built in: variables and named constants, sorted
 * alphabetically (by UTF-16 code units, so `x` before `y` and `B` before `a`), each once. Function
 * names (which only appear as calls) and `pi`, `e` are not included.
 */
export function freeNames(ast: Expr): string[] {
  const names = new Set<string>();
  for (const use of nameUses(ast)) names.add(use.name);
  return [...names].sort();
}

/** Every free-name node in text order (a name used three times appears three times). */
export function nameUses(ast: Expr): NameExpr[] {
  const uses: NameExpr[] = [];
  const visit = (node: Expr): void => {
    if (node.kind === 'name') {
      if (!BUILTIN_CONSTANTS.has(node.name)) uses.push(node);
      return;
    }
    childrenOf(node).forEach(visit);
  };
  visit(ast);
  return uses;
}
