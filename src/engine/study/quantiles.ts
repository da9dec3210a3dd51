/**
 * Quantile bands of many runs' loss curves, step by step: at each step, the q-quantiles of the losses
 * of all runs, where a run that has ended keeps its last loss (it is still "at" that loss; common
 * practice for curves of unequal length). Quantiles by linear interpolation between order statistics
 * (Hyndman & Fan, "Sample quantiles in statistical packages", Am. Stat. 1996, definition 7, the default
 * of R and NumPy). Non-finite losses (diverged runs) sort above every finite one as +Infinity.
 */
export function quantile(sorted: ArrayLike<number>, q: number): number {
  const m = sorted.length;
  if (m === 0) return Number.NaN;
  const h = (m - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(m - 1, lo + 1);
  const a = sorted[lo];
  const b = sorted[hi];
  if (a === b || h === lo) return a;
  return a + (h - lo) * (b - a);
}

export interface LossBands {
  steps: number;
  /** bands[k][t]: the qs[k]-quantile of the losses at step t. */
  bands: Float64Array[];
}

/** `curves[r]` holds run r's loss at steps 0, 1, ... until it ended. */
export function lossBands(curves: readonly ArrayLike<number>[], qs: readonly number[] = [0.25, 0.5, 0.75]): LossBands {
  for (const q of qs) if (!(q >= 0 && q <= 1)) throw new RangeError(`lossBands: quantiles must be in [0, 1], got ${q}`);
  const steps = curves.reduce((m, c) => Math.max(m, c.length), 0);
  const bands = qs.map(() => new Float64Array(steps));
  const column = new Float64Array(curves.length);
  for (let t = 0; t < steps; t++) {
    let m = 0;
    for (const c of curves) {
      if (c.length === 0) continue;
      const v = c[Math.min(t, c.length - 1)];
      column[m++] = Number.isNaN(v) ? Infinity : v;
    }
    const sorted = column.subarray(0, m).sort();
    qs.forEach((q, k) => (bands[k][t] = quantile(sorted, q)));
  }
  return { steps, bands };
}
