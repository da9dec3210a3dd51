import type { Expr, Span } from './ast';
import { evaluateFormula, type Environment } from './evaluate';

/**
 * Why a formula has no finite value, or no finite derivative, at a point: the innermost piece that
 * turns finite inputs into a non-finite result, named with its columns (1-based). Used to tell a start
 * outside the domain ("log of a negative number") or at a cusp from a run that diverged.
 */
export interface Explanation {
  message: string;
  span: Span;
}

/** The innermost node whose operands are finite but whose value is not; null when the value is finite. */
export function explainNonFiniteValue(ast: Expr, env: Environment): Explanation | null {
  let found: Explanation | null = null;
  const visit = (node: Expr): number => {
    const value = evaluateFormula(node, env);
    if (found || Number.isFinite(value)) return value;
    const operands = node.kind === 'binary' ? [node.left, node.right] : node.kind === 'unary' ? [node.operand] : node.kind === 'call' ? node.args : [];
    const values = operands.map(visit);
    if (!found && values.every(Number.isFinite)) found = { message: describeFault(node, values), span: node.span };
    return value;
  };
  visit(ast);
  return found;
}

/**
 * The innermost function whose argument is finite but whose derivative there is not (sqrt at 0, a
 * power below 1 of 0, log at 0, asin/acos at +-1): where the formula has a cusp or a vertical tangent.
 */
export function explainNoDerivative(ast: Expr, env: Environment): Explanation | null {
  let found: Explanation | null = null;
  const visit = (node: Expr): void => {
    if (found) return;
    const operands = node.kind === 'binary' ? [node.left, node.right] : node.kind === 'unary' ? [node.operand] : node.kind === 'call' ? node.args : [];
    operands.forEach(visit);
    if (found) return;
    const values = operands.map((o) => evaluateFormula(o, env));
    if (!values.every(Number.isFinite)) return;
    const [u, p] = values;
    const col = columns(node.span);
    if (node.kind === 'call' && node.name === 'sqrt' && u === 0) found = { message: `sqrt at 0 has no derivative (${col})`, span: node.span };
    else if (node.kind === 'call' && node.name === 'log' && u === 0) found = { message: `log at 0 has no derivative (${col})`, span: node.span };
    else if (node.kind === 'call' && (node.name === 'asin' || node.name === 'acos') && Math.abs(u) === 1) found = { message: `${node.name} at ${u} has no derivative (${col})`, span: node.span };
    else if (node.kind === 'binary' && node.op === '^' && u === 0 && p < 1 && p !== 0) found = { message: `0 raised to the power ${p} has no derivative (${col})`, span: node.span };
  };
  visit(ast);
  return found;
}

function describeFault(node: Expr, values: number[]): string {
  const col = columns(node.span);
  const [u, v] = values;
  if (node.kind === 'call') {
    if (node.name === 'log' && u < 0) return `log of a negative number (${u}) (${col})`;
    if (node.name === 'log' && u === 0) return `log of 0 (${col})`;
    if (node.name === 'sqrt' && u < 0) return `square root of a negative number (${u}) (${col})`;
    if ((node.name === 'asin' || node.name === 'acos') && Math.abs(u) > 1) return `${node.name} of ${u}, outside [-1, 1] (${col})`;
    if (node.name === 'log1p' && u <= -1) return `log1p of ${u} (needs > -1) (${col})`;
    return `${node.name}(${values.join(', ')}) is not a finite number (${col})`;
  }
  if (node.kind === 'binary' && node.op === '/' && v === 0) return `division by zero (${col})`;
  if (node.kind === 'binary' && node.op === '^' && u < 0 && !Number.isInteger(v)) return `a negative number (${u}) raised to the non-integer power ${v} (${col})`;
  if (node.kind === 'binary' && node.op === '^' && u === 0 && v < 0) return `0 raised to the negative power ${v} (${col})`;
  return `the value overflows (${col})`;
}

function columns(span: Span): string {
  return span.end - span.start <= 1 ? `column ${span.start + 1}` : `columns ${span.start + 1}-${span.end}`;
}
