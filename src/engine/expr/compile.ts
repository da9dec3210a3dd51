import { explainNoDerivative, explainNonFiniteValue } from './explain';
import type { Surface } from '../surface';
import type { Expr } from './ast';
import { buildFactory, generateSource, type CodeShape, type ModelKernels, type SurfaceKernels } from './codegen';
import { Differentiator } from './derive';
import { FormulaSyntaxError, errorAt, optionError, type FormulaError } from './errors';
import { BUILTIN_CONSTANTS, FUNCTIONS } from './functions';
import { Graph, type NodeId } from './graph';
import { inlineGradient, type InlineGradient } from './inline';
import { lowerFormula } from './lower';
import { freeNames, nameUses } from './names';
import { parseFormula } from './parser';

/**
 * The compilers: formula text -> validated tree -> expression graph with symbolic first and second
 * derivatives (derive.ts) -> straight-line JavaScript (codegen.ts).
 */

export interface FormulaOptions {
  /** The surface's coordinates in order. Default: the formula's free names that are not constants, sorted. */
  variables?: string[];
  /** Named constants and their values (e.g. `{ a: 1, b: 100 }`); new values later via `withConstants`. */
  constants?: Record<string, number>;
}

/** A surface compiled from a formula. */
export interface FormulaSurface extends Surface {
  readonly text: string;
  readonly ast: Expr;
  readonly constants: Readonly<Record<string, number>>;
  /**
   * The same formula with some constants changed (others keep their values), reusing the compiled code.
   * Throws FormulaSyntaxError for an unknown name or a non-finite value.
   */
  withConstants(values: Readonly<Record<string, number>>): FormulaSurface;
  /**
   * The value and gradient as statements for generated code to inline (inline.ts), with the bound
   * constant values the statements read as `c[i]` (a copy).
   */
  inlineGradient(): { code: InlineGradient; constants: Float64Array };
}

export interface ModelOptions {
  /** The differentiated parameters, in gradient order. */
  parameters: string[];
  /** Per-row data values the formula reads (not differentiated). */
  inputs: string[];
  constants?: Record<string, number>;
}

/** A data-fit model f(params; input row), with exact derivatives with respect to the parameters. */
export interface CompiledModel {
  readonly text: string;
  readonly ast: Expr;
  readonly parameters: readonly string[];
  readonly inputs: readonly string[];
  readonly constants: Readonly<Record<string, number>>;
  value(p: ArrayLike<number>, input: ArrayLike<number>): number;
  /** Writes d f / d params into `grad` and returns f. */
  valueGradient(p: ArrayLike<number>, input: ArrayLike<number>, grad: Float64Array): number;
  /** Also writes the Hessian with respect to the parameters (row-major, symmetric). */
  valueGradientHessian(p: ArrayLike<number>, input: ArrayLike<number>, grad: Float64Array, hessian: Float64Array): number;
  withConstants(values: Readonly<Record<string, number>>): CompiledModel;
}

const IDENTIFIER = /^[A-Za-z_][A-Za-z0-9_]*$/;

/** Problems with a list of names supplied beside the text ("variable", "parameter", "input"). */
function checkNames(role: string, names: readonly string[], errors: FormulaError[]): void {
  const seen = new Set<string>();
  for (const name of names) {
    if (typeof name !== 'string' || !IDENTIFIER.test(name)) errors.push(optionError(`${role} name '${String(name)}' is not a valid identifier`));
    else if (FUNCTIONS.has(name)) errors.push(optionError(`${role} name '${name}' is a function`));
    else if (BUILTIN_CONSTANTS.has(name)) errors.push(optionError(`${role} name '${name}' is a built-in constant`));
    else if (seen.has(name)) errors.push(optionError(`${role} '${name}' is listed twice`));
    seen.add(name);
  }
}

/** Validated named constants: names sorted, values in that order. */
interface ConstantTable {
  readonly names: readonly string[];
  readonly values: Float64Array;
}

function checkConstants(constants: Readonly<Record<string, number>> | undefined, errors: FormulaError[]): ConstantTable {
  const record = constants ?? {};
  const names = Object.keys(record).sort();
  checkNames('constant', names, errors);
  const values = new Float64Array(names.length);
  names.forEach((name, i) => {
    const value = record[name];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      errors.push(optionError(`constant '${name}' must be a finite number, got ${String(value)}`));
    } else {
      values[i] = value;
    }
  });
  return { names, values };
}

function overlap(a: readonly string[], b: readonly string[], message: (name: string) => string, errors: FormulaError[]): void {
  const inB = new Set(b);
  for (const name of a) if (inB.has(name)) errors.push(optionError(message(name)));
}

function describeNames(label: string, names: readonly string[]): string {
  return names.length > 0 ? `${label}: ${names.join(', ')}` : `no ${label}`;
}

/** The names a formula may use, for error messages: each role, then the constants when there are any. */
function describeRoles(roles: readonly [label: string, names: readonly string[]][], constantNames: readonly string[]): string {
  const parts = roles.map(([label, names]) => describeNames(label, names));
  if (constantNames.length > 0) parts.push(describeNames('constants', constantNames));
  return parts.join('; ');
}

/** Everything compiled about one formula, before binding constant values. */
export interface Program<K> {
  readonly text: string;
  readonly ast: Expr;
  /** The differentiated names (variables or parameters), in order. */
  readonly differentiated: readonly string[];
  readonly inputs: readonly string[];
  readonly constantNames: readonly string[];
  /** The generated JavaScript (for inspection and the safety tests). */
  readonly source: string;
  /** The value and gradient as inlinable statements (inline.ts); surfaces only (a model reads data rows). */
  readonly inline: InlineGradient | null;
  readonly instantiate: (constants: Float64Array) => K;
}

interface Roles {
  differentiated: readonly string[];
  inputs: readonly string[];
  constants: ConstantTable;
}

function parseOrThrow(text: string): Expr {
  const parsed = parseFormula(text);
  if (!parsed.ok) throw new FormulaSyntaxError(parsed.errors);
  return parsed.ast;
}

function buildProgram<K extends SurfaceKernels | ModelKernels>(text: string, ast: Expr, roles: Roles, shape: CodeShape, describe: string): Program<K> {
  const index = new Map<string, (g: Graph) => NodeId>();
  roles.differentiated.forEach((name, i) => index.set(name, (g) => g.variable(i)));
  roles.inputs.forEach((name, i) => index.set(name, (g) => g.input(i)));
  roles.constants.names.forEach((name, i) => index.set(name, (g) => g.param(i)));

  const unknown = nameUses(ast)
    .filter((use) => !index.has(use.name))
    .map((use) => errorAt(`unknown ${shape === 'model' ? 'name' : 'variable'} '${use.name}'`, use.span, describe));
  if (unknown.length > 0) throw new FormulaSyntaxError(unknown);

  const g = new Graph();
  const value = lowerFormula(g, ast, (name) => index.get(name)!(g));
  const differentiator = new Differentiator(g);
  const gradient = differentiator.gradient(value, roles.differentiated.length);
  const hessianUpper = differentiator.hessianUpper(gradient);
  const source = generateSource(g, { value, gradient, hessianUpper }, shape);
  return {
    text,
    ast,
    differentiated: roles.differentiated,
    inputs: roles.inputs,
    constantNames: roles.constants.names,
    source,
    inline: shape === 'surface' ? inlineGradient(g, value, gradient) : null,
    instantiate: buildFactory<K>(source),
  };
}

/** Parses and checks a surface formula and generates its code (no constant values bound yet). */
export function formulaProgram(text: string, options: FormulaOptions = {}): { program: Program<SurfaceKernels>; constants: Float64Array } {
  const ast = parseOrThrow(text);
  const errors: FormulaError[] = [];
  const constants = checkConstants(options.constants, errors);
  const variables = options.variables ?? freeNames(ast).filter((name) => !constants.names.includes(name));
  checkNames('variable', variables, errors);
  overlap(variables, constants.names, (name) => `'${name}' is both a variable and a constant`, errors);
  if (errors.length > 0) throw new FormulaSyntaxError(errors);
  const describe = describeRoles([['variables', variables]], constants.names);
  const program = buildProgram<SurfaceKernels>(text, ast, { differentiated: [...variables], inputs: [], constants }, 'surface', describe);
  return { program, constants: constants.values };
}

/** Parses and checks a model formula and generates its code (no constant values bound yet). */
export function modelProgram(text: string, options: ModelOptions): { program: Program<ModelKernels>; constants: Float64Array } {
  const ast = parseOrThrow(text);
  const errors: FormulaError[] = [];
  const constants = checkConstants(options.constants, errors);
  checkNames('parameter', options.parameters, errors);
  checkNames('input', options.inputs, errors);
  overlap(options.parameters, options.inputs, (name) => `'${name}' is both a parameter and an input`, errors);
  overlap(options.parameters, constants.names, (name) => `'${name}' is both a parameter and a constant`, errors);
  overlap(options.inputs, constants.names, (name) => `'${name}' is both an input and a constant`, errors);
  if (errors.length > 0) throw new FormulaSyntaxError(errors);
  const describe = describeRoles([['parameters', options.parameters], ['inputs', options.inputs]], constants.names);
  const roles = { differentiated: [...options.parameters], inputs: [...options.inputs], constants };
  const program = buildProgram<ModelKernels>(text, ast, roles, 'model', describe);
  return { program, constants: constants.values };
}

/** New constant values merged over the current ones, checked. */
function mergeConstants(names: readonly string[], current: Float64Array, values: Readonly<Record<string, number>>): Float64Array {
  const next = Float64Array.from(current);
  const errors: FormulaError[] = [];
  for (const name of Object.keys(values)) {
    const i = names.indexOf(name);
    const value = values[name];
    if (i < 0) errors.push(optionError(`'${name}' is not a constant of this formula (${describeNames('constants', names)})`));
    else if (typeof value !== 'number' || !Number.isFinite(value)) errors.push(optionError(`constant '${name}' must be a finite number, got ${String(value)}`));
    else next[i] = value;
  }
  if (errors.length > 0) throw new FormulaSyntaxError(errors);
  return next;
}

function constantRecord(names: readonly string[], values: Float64Array): Readonly<Record<string, number>> {
  const record: Record<string, number> = Object.create(null);
  names.forEach((name, i) => (record[name] = values[i]));
  return Object.freeze(record);
}

/**
 * What a compiled surface and a compiled model share: the text, the tree, the bound constants and
 * the three kernels of one program instantiated with them (own properties, so a call reaches the
 * generated function directly).
 */
abstract class BoundProgram<K extends SurfaceKernels | ModelKernels> {
  readonly text: string;
  readonly ast: Expr;
  readonly constants: Readonly<Record<string, number>>;
  readonly value: K['value'];
  readonly valueGradient: K['valueGradient'];
  readonly valueGradientHessian: K['valueGradientHessian'];

  constructor(
    protected readonly program: Program<K>,
    protected readonly constantValues: Float64Array,
  ) {
    const kernels = program.instantiate(constantValues);
    this.text = program.text;
    this.ast = program.ast;
    this.constants = constantRecord(program.constantNames, constantValues);
    this.value = kernels.value;
    this.valueGradient = kernels.valueGradient;
    this.valueGradientHessian = kernels.valueGradientHessian;
  }

  /** This program's constant values with `values` merged over them, checked. */
  protected mergedConstants(values: Readonly<Record<string, number>>): Float64Array {
    return mergeConstants(this.program.constantNames, this.constantValues, values);
  }
}

class CompiledFormulaSurface extends BoundProgram<SurfaceKernels> implements FormulaSurface {
  readonly dimension: number;
  readonly variables: readonly string[];

  constructor(program: Program<SurfaceKernels>, constantValues: Float64Array) {
    super(program, constantValues);
    this.dimension = program.differentiated.length;
    this.variables = Object.freeze([...program.differentiated]);
  }

  withConstants(values: Readonly<Record<string, number>>): FormulaSurface {
    return new CompiledFormulaSurface(this.program, this.mergedConstants(values));
  }

  inlineGradient(): { code: InlineGradient; constants: Float64Array } {
    return { code: this.program.inline!, constants: Float64Array.from(this.constantValues) };
  }

  explainUndefined(x: ArrayLike<number>, what: 'value' | 'gradient'): string | null {
    const env = new Map(Object.entries(this.constants));
    this.variables.forEach((name, i) => env.set(name, x[i]));
    const found = what === 'value' ? explainNonFiniteValue(this.ast, env) : explainNoDerivative(this.ast, env);
    return found?.message ?? null;
  }
}

class CompiledFormulaModel extends BoundProgram<ModelKernels> implements CompiledModel {
  readonly parameters: readonly string[];
  readonly inputs: readonly string[];

  constructor(program: Program<ModelKernels>, constantValues: Float64Array) {
    super(program, constantValues);
    this.parameters = Object.freeze([...program.differentiated]);
    this.inputs = Object.freeze([...program.inputs]);
  }

  withConstants(values: Readonly<Record<string, number>>): CompiledModel {
    return new CompiledFormulaModel(this.program, this.mergedConstants(values));
  }
}

/**
 * Compiles a formula surface. Variables default to the free names that are not constants, in
 * alphabetical order (so x before y). Throws FormulaSyntaxError listing every problem: parse errors,
 * unknown variables (when `variables` is given), a name that is both a variable and a constant, a name
 * that is a function or `pi`/`e`, a non-finite constant.
 */
export function compileFormula(text: string, options?: FormulaOptions): FormulaSurface {
  const { program, constants } = formulaProgram(text, options);
  return new CompiledFormulaSurface(program, constants);
}

/**
 * Compiles a data-fit model: `parameters` are differentiated, `inputs` are the values of one data row.
 * E.g. compileModel('b1 * (1 - exp(-b2 * x))', { parameters: ['b1', 'b2'], inputs: ['x'] }).
 */
export function compileModel(text: string, options: ModelOptions): CompiledModel {
  const { program, constants } = modelProgram(text, options);
  return new CompiledFormulaModel(program, constants);
}
