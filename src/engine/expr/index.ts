// The formula language: parse, print, evaluate and compile formulas (see README.md here).
export type { BinaryExpr, BinaryOperator, CallExpr, Expr, NameExpr, NumberExpr, Span, UnaryExpr, UnaryOperator } from './ast';
export { sameTree } from './ast';
export { FormulaSyntaxError, type FormulaError } from './errors';
export { parseFormula, MAX_FORMULA_LENGTH, type ParseOptions } from './parser';
export { printFormula, prettyFormula } from './printer';
export { freeNames, naturalNameOrder } from './names';
export { evaluateFormula, type Environment } from './evaluate';
export { FUNCTIONS, BUILTIN_CONSTANTS, type Arity, type FunctionInfo } from './functions';
export {
  compileFormula,
  compileModel,
  type CompiledModel,
  type FormulaOptions,
  type FormulaSurface,
  type ModelOptions,
} from './compile';
export { KERNEL_TABLE, isKernelName, UNARY_PRIMITIVES, VARIADIC_PRIMITIVES, type UnaryPrimitive, type VariadicPrimitive } from './primitives';
export { formatNumber } from './codegen';
export { nearestName } from './suggest';
