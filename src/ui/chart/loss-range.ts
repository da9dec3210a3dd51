/**
 * Running summaries of a loss series that only grows (a streaming run's buffer): the extremes the
 * loss chart needs for its axis choice and range, kept per loss array and extended by the rows added
 * since the last redraw, so a redraw costs the new steps, not all of them. A shorter count or another
 * array (the buffer grew) starts over. The results are those of a scan over all rows (tested).
 */

/** Extremes over the rows scanned so far, by the sets the three axis kinds read. */
export interface LossExtremes {
  rows: number;
  /** Over values that are neither NaN nor +Infinity (the gap axis: -Infinity counts, at the floor). */
  minBelowInf: number;
  maxBelowInf: number;
  /** Over finite values (the linear axis). */
  minFinite: number;
  maxFinite: number;
  /** Over finite positive values (the log axis). */
  minPositive: number;
  maxPositive: number;
  /** Whether a finite value is at most 0 (then the log axis cannot show it). */
  nonPositive: boolean;
}

const SUMMARIES = new WeakMap<ArrayLike<number>, LossExtremes>();

function emptyExtremes(): LossExtremes {
  return { rows: 0, minBelowInf: Infinity, maxBelowInf: -Infinity, minFinite: Infinity, maxFinite: -Infinity, minPositive: Infinity, maxPositive: -Infinity, nonPositive: false };
}

/** The extremes of loss[0 .. count), extended from the last call's for the same array. */
export function lossExtremes(loss: ArrayLike<number>, count: number): LossExtremes {
  let e = SUMMARIES.get(loss);
  if (!e || e.rows > count) SUMMARIES.set(loss, (e = emptyExtremes()));
  for (let k = e.rows; k < count; k++) {
    const v = loss[k];
    if (Number.isNaN(v) || v === Infinity) continue;
    if (v < e.minBelowInf) e.minBelowInf = v;
    if (v > e.maxBelowInf) e.maxBelowInf = v;
    if (v === -Infinity) continue;
    if (v < e.minFinite) e.minFinite = v;
    if (v > e.maxFinite) e.maxFinite = v;
    if (v > 0) {
      if (v < e.minPositive) e.minPositive = v;
      if (v > e.maxPositive) e.maxPositive = v;
    } else e.nonPositive = true;
  }
  e.rows = Math.max(e.rows, count);
  return e;
}
