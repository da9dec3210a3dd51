import { childrenOf, type Expr, type NameExpr } from './ast';
import { BUILTIN_CONSTANTS } from './functions';

/**
 * The identifiers a formula reads that are not built in: variables and named constants, each once, in
 * natural order (`naturalNameOrder`: x1, x2, ..., x10; `x` before `y`, `B` before `a`). Function
 * names (which only appear as calls) and `pi`, `e` are not included.
 */
export function freeNames(ast: Expr): string[] {
  const names = new Set<string>();
  for (const use of nameUses(ast)) names.add(use.name);
  return [...names].sort(naturalNameOrder);
}

const CHUNK = /\d+|\D+/g;

/**
 * Names compared chunk by chunk: runs of digits by their value (then by length, so `x01` follows `x1`),
 * other runs by UTF-16 code units. So x2 comes before x10 and w_9 before w_10.
 */
export function naturalNameOrder(a: string, b: string): number {
  const xs = a.match(CHUNK) ?? [];
  const ys = b.match(CHUNK) ?? [];
  for (let k = 0; k < Math.min(xs.length, ys.length); k++) {
    const x = xs[k];
    const y = ys[k];
    if (x === y) continue;
    const dx = x.charCodeAt(0) >= 48 && x.charCodeAt(0) <= 57;
    const dy = y.charCodeAt(0) >= 48 && y.charCodeAt(0) <= 57;
    if (dx && dy) {
      const tx = x.replace(/^0+(?=\d)/, '');
      const ty = y.replace(/^0+(?=\d)/, '');
      if (tx.length !== ty.length) return tx.length - ty.length;
      if (tx !== ty) return tx < ty ? -1 : 1;
      return x.length - y.length;
    }
    return x < y ? -1 : 1;
  }
  return xs.length - ys.length;
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
