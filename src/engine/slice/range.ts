/** The (a, b) box of a grid request. */
export interface PlaneRange {
  a: [number, number];
  b: [number, number];
}

/**
 * Grid ranges that cover a projected path (count x 2 row-major (a, b) pairs, as `pcaPlane` returns)
 * and the plane's origin (0, 0), widened on each side by `margin` times the span (default 0.15).
 * An axis with no extent borrows the other axis's span; with no extent at all the box is [-1, 1]^2.
 * Non-finite pairs are skipped. The two axes keep their own spans (no equal-scale squaring).
 */
export function gridRangeForProjection(projected: ArrayLike<number>, margin = 0.15): PlaneRange {
  if (!(Number.isFinite(margin) && margin >= 0)) throw new Error(`gridRangeForProjection: margin must be a finite number >= 0, got ${margin}`);
  if (projected.length % 2 !== 0) throw new Error(`gridRangeForProjection: expected (a, b) pairs, got ${projected.length} numbers`);
  let aLo = 0, aHi = 0, bLo = 0, bHi = 0;
  for (let i = 0; i < projected.length; i += 2) {
    const a = projected[i];
    const b = projected[i + 1];
    if (!(Number.isFinite(a) && Number.isFinite(b))) continue;
    aLo = Math.min(aLo, a);
    aHi = Math.max(aHi, a);
    bLo = Math.min(bLo, b);
    bHi = Math.max(bHi, b);
  }
  let aSpan = aHi - aLo;
  let bSpan = bHi - bLo;
  if (aSpan === 0 && bSpan === 0) return { a: [-1, 1], b: [-1, 1] };
  if (aSpan === 0) {
    aSpan = bSpan;
    aLo -= aSpan / 2;
    aHi += aSpan / 2;
  }
  if (bSpan === 0) {
    bSpan = aSpan;
    bLo -= bSpan / 2;
    bHi += bSpan / 2;
  }
  return { a: [aLo - margin * aSpan, aHi + margin * aSpan], b: [bLo - margin * bSpan, bHi + margin * bSpan] };
}
