import type { Surface } from '../surface';

/**
 * Hessian-vector products, H(x) v, for any surface.
 *
 * A surface with `hessianVector` computes the product exactly without forming H (data-fit surfaces:
 * one pass over the rows; networks by Pearlmutter's R-operator, B. A. Pearlmutter, "Fast exact
 * multiplication by the Hessian", Neural Computation 6(1), 1994). Any other surface is multiplied
 * through its full exact Hessian, formed with `valueGradientHessian` into scratch buffers: O(n^2)
 * memory and the cost of one Hessian per product, meant for small surfaces (catalogue functions,
 * typed formulas). Pass the same `scratch` to repeated calls to allocate nothing per product.
 */
export interface HessianScratch {
  /** Length n. */
  grad: Float64Array;
  /** Length n * n. */
  hessian: Float64Array;
}

export function hessianScratch(n: number): HessianScratch {
  return { grad: new Float64Array(n), hessian: new Float64Array(n * n) };
}

/** Writes H(x) v into `out` (length n; must not alias `v`). */
export function hessianVectorProduct(surface: Surface, x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array, scratch?: HessianScratch): void {
  const n = surface.dimension;
  if (x.length !== n || v.length !== n || out.length !== n)
    throw new RangeError(`hessianVectorProduct: expected x, v and out of length ${n}, got ${x.length}, ${v.length} and ${out.length}`);
  if (surface.hessianVector) {
    surface.hessianVector(x, v, out);
    return;
  }
  const s = scratch ?? hessianScratch(n);
  surface.valueGradientHessian(x, s.grad, s.hessian);
  multiplyDense(s.hessian, n, v, out);
}

/** out = A v for a dense row-major n x n matrix. */
export function multiplyDense(a: ArrayLike<number>, n: number, v: ArrayLike<number>, out: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let s = 0;
    const o = i * n;
    for (let j = 0; j < n; j++) s += a[o + j] * v[j];
    out[i] = s;
  }
}
