import { compileModel, type CompiledModel } from '../../engine';
import { LruCache } from '../datasets';
import type { Design } from './design';
import { penaltyMask, RowLossSurface } from './row-loss';
import type { RegressionLoss } from './spec';

/**
 * A typed model formula f(x; b) with named parameters, fitted by least squares: residual
 * r_i = f(x_i; b) - y_i, per-row loss r_i^2, summed (RSS) or averaged (MSE), plus lambda/2 |b|^2 on
 * every parameter. The engine's formula compiler gives f, its gradient J_i = df/db and its Hessian
 * d2f/db2 at one row, so the loss's derivatives are exact:
 *   gradient 2 scale sum_i r_i J_i,   Hessian 2 scale sum_i (J_i J_i^T + r_i d2f_i/db2),
 *   Hessian-vector product 2 scale sum_i (J_i (J_i . v) + r_i (d2f_i/db2) v).
 * (Gauss-Newton methods drop the second term; Newton here keeps it.) Standardised inputs are not
 * offered: the formula's parameters refer to its inputs in their own units.
 *
 * Layout: the parameters in the spec's order; each parameter is its own group (a formula does not
 * say which parameters form a filter), so filter-wise normalisation becomes per-parameter scaling.
 */
export class FormulaModelSurface extends RowLossSurface {
  readonly model = 'formula' as const;
  readonly lossName: string;
  private readonly inputRow: Float64Array;
  private readonly rowGrad: Float64Array;
  private readonly rowHess: Float64Array;

  constructor(
    design: Design,
    readonly compiled: CompiledModel,
    readonly loss: RegressionLoss,
    l2: number,
  ) {
    const names = [...compiled.parameters];
    super(
      design,
      names,
      names.map((name, j) => ({ name, indices: [j], kind: 'weights' as const })),
      loss === 'rss' ? 'sum' : 'mean',
      l2,
      penaltyMask(names.length, []),
    );
    this.lossName = loss === 'rss' ? 'residual sum of squares' : 'mean squared error';
    this.inputRow = new Float64Array(design.p);
    this.rowGrad = new Float64Array(names.length);
    this.rowHess = new Float64Array(names.length * names.length);
  }

  private loadRow(i: number): Float64Array {
    const { x, p } = this.design;
    const row = this.inputRow;
    for (let j = 0, o = i * p; j < p; j++) row[j] = x[o + j];
    return row;
  }

  protected sumValue(w: Float64Array, rows: Int32Array | null, count: number): number {
    const { y } = this.design;
    const f = this.compiled;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const r = f.value(w, this.loadRow(i)) - y[i];
      s += r * r;
    }
    return s;
  }

  protected sumGradient(w: Float64Array, g: Float64Array, rows: Int32Array | null, count: number): number {
    const { y } = this.design;
    const f = this.compiled;
    const n = this.dimension;
    const jac = this.rowGrad;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const r = f.valueGradient(w, this.loadRow(i), jac) - y[i];
      s += r * r;
      for (let j = 0; j < n; j++) g[j] += 2 * r * jac[j];
    }
    return s;
  }

  protected sumHessian(w: Float64Array, g: Float64Array, h: Float64Array, rows: Int32Array | null, count: number): number {
    const { y } = this.design;
    const f = this.compiled;
    const n = this.dimension;
    const jac = this.rowGrad;
    const hf = this.rowHess;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const r = f.valueGradientHessian(w, this.loadRow(i), jac, hf) - y[i];
      s += r * r;
      for (let a = 0; a < n; a++) {
        g[a] += 2 * r * jac[a];
        for (let b = 0; b < n; b++) h[a * n + b] += 2 * (jac[a] * jac[b] + r * hf[a * n + b]);
      }
    }
    return s;
  }

  /**
   * H v = 2 sum_i (J_i (J_i . v) + r_i (d2f_i/db2) v), row by row: the per-row Hessian of f comes from
   * the compiled formula (a formula model has a handful of parameters), the n x n loss Hessian is
   * never summed.
   */
  protected sumHessianVector(w: Float64Array, v: Float64Array, out: Float64Array): void {
    const { y, rows } = this.design;
    const f = this.compiled;
    const n = this.dimension;
    const jac = this.rowGrad;
    const hf = this.rowHess;
    for (let i = 0; i < rows; i++) {
      const r = f.valueGradientHessian(w, this.loadRow(i), jac, hf) - y[i];
      let jv = 0;
      for (let b = 0; b < n; b++) jv += jac[b] * v[b];
      for (let a = 0; a < n; a++) {
        let hv = 0;
        for (let b = 0; b < n; b++) hv += hf[a * n + b] * v[b];
        out[a] += 2 * (jac[a] * jv + r * hv);
      }
    }
  }

  /** Formula parameters have no standardised form: a copy. */
  toOriginalUnits(params: ArrayLike<number>): number[] {
    return Array.from(params);
  }

  fromOriginalUnits(params: ArrayLike<number>): number[] {
    return Array.from(params);
  }

  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number {
    return this.compiled.value(params, inputRow);
  }
}

/** Compiled model formulas by text and names; new constant values reuse the compiled code. */
const COMPILED = new LruCache<CompiledModel>(32);

export function compiledModelFor(text: string, parameters: readonly string[], inputNames: readonly string[], constants: Record<string, number> | undefined): CompiledModel {
  const constantNames = Object.keys(constants ?? {}).sort();
  const key = JSON.stringify([text, parameters, inputNames, constantNames]);
  const base = COMPILED.getOrMake(key, () =>
    compileModel(text, { parameters: [...parameters], inputs: [...inputNames], constants: constants ? { ...constants } : undefined }),
  );
  return constants && constantNames.length > 0 ? base.withConstants(constants) : base;
}
