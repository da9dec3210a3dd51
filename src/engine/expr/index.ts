// The formula language: parse, print, evaluate and compile formulas (see DEVELOPERS.md, "The formula language").
export type { BinaryExpr, BinaryOperator, CallExpr, Expr, NameExpr, NumberExpr, Span, UnaryExpr, UnaryOperator } from './ast';
export { sameTree } from './ast';
export { FormulaSyntaxError, type FormulaError } from './errors';
export { parseFormula, MAX_FORMULA_LENGTH } from './parser';
export { printFormula, prettyFormula } from './printer';
export { freeNames } from './names';
export { evaluateFormula, type Environment } from './evaluate';
export { FUNCTIONS, BUILTIN_CONSTANTS, type FunctionInfo } from './functions';
export {
  compileFormula,
  compileModel,
  type CompiledModel,
  type FormulaOptions,
  type FormulaSurface,
  type ModelOptions,
} from './compile';
