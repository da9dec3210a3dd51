/** Small dense-vector helpers on Float64Array. Kept allocation-free where a result buffer is given. */

export type Vector = Float64Array;

export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/** Euclidean norm, scaled to avoid overflow for very large entries. */
export function norm2(a: ArrayLike<number>): number {
  return norm2At(a, 0, a.length);
}

/** norm2 of the n entries a[at..at+n) (a vector inside flat storage). */
export function norm2At(a: ArrayLike<number>, at: number, n: number): number {
  let scale = 0;
  for (let i = at; i < at + n; i++) scale = Math.max(scale, Math.abs(a[i]));
  if (scale === 0 || !Number.isFinite(scale)) return scale;
  let s = 0;
  for (let i = at; i < at + n; i++) {
    const r = a[i] / scale;
    s += r * r;
  }
  return scale * Math.sqrt(s);
}

/** out = a + alpha * b. `out` may alias `a`. */
export function axpy(out: Float64Array, a: ArrayLike<number>, alpha: number, b: ArrayLike<number>): Float64Array {
  for (let i = 0; i < out.length; i++) out[i] = a[i] + alpha * b[i];
  return out;
}

export function allFinite(a: ArrayLike<number>): boolean {
  for (let i = 0; i < a.length; i++) if (!Number.isFinite(a[i])) return false;
  return true;
}
