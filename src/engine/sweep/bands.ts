import type { SweepPlan, SweepResult } from './plan';

/** A contiguous range of run indices [lo, hi) of a sweep, for one worker of a pool. */
export interface SweepBand {
  lo: number;
  hi: number;
}

/**
 * Cuts runs 0..count-1 into `parts` contiguous bands of as equal a size as whole runs allow (the first
 * count mod parts bands get one run more), dropping empty bands. Every run lies in exactly one band,
 * in index order.
 */
export function splitBands(count: number, parts: number): SweepBand[] {
  if (!Number.isInteger(count) || count < 0) throw new Error(`splitBands: count must be a whole number >= 0, got ${count}`);
  if (!Number.isInteger(parts) || parts < 1) throw new Error(`splitBands: parts must be a whole number >= 1, got ${parts}`);
  const bands: SweepBand[] = [];
  const base = Math.floor(count / parts);
  const extra = count % parts;
  let lo = 0;
  for (let b = 0; b < parts && lo < count; b++) {
    const hi = lo + base + (b < extra ? 1 : 0);
    if (hi > lo) bands.push({ lo, hi });
    lo = hi;
  }
  return bands;
}

/**
 * The plan of one band: the same configuration with that band's starts, learning rates and seeds
 * (views, no copy). Runs are independent, so the band's runs give the numbers they give in the whole.
 */
export function bandPlan(plan: SweepPlan, band: SweepBand): SweepPlan {
  const n = plan.surface.dimension;
  return {
    ...plan,
    starts: plan.starts.subarray(band.lo * n, band.hi * n),
    learningRates: plan.learningRates?.subarray(band.lo, band.hi),
    seeds: plan.seeds?.subarray(band.lo, band.hi),
  };
}

/**
 * Joins band results in index order into the result of the whole sweep. `bands[k]` says where
 * `results[k]` belongs; together the bands must cover 0..count-1 once each.
 */
export function mergeBandResults(bands: readonly SweepBand[], results: readonly SweepResult[], dimension: number): SweepResult {
  if (bands.length !== results.length) throw new Error(`mergeBandResults: ${bands.length} bands but ${results.length} results`);
  const order = bands.map((_, k) => k).sort((a, b) => bands[a].lo - bands[b].lo);
  let count = 0;
  for (const k of order) {
    const b = bands[k];
    if (b.lo !== count) throw new Error(`mergeBandResults: band [${b.lo}, ${b.hi}) does not follow run ${count - 1}`);
    if (results[k].count !== b.hi - b.lo) throw new Error(`mergeBandResults: band [${b.lo}, ${b.hi}) has ${results[k].count} results`);
    count = b.hi;
  }
  const n = dimension;
  const out: SweepResult = {
    count,
    dimension: n,
    endPoints: new Float64Array(count * n),
    losses: new Float64Array(count),
    steps: new Int32Array(count),
    evaluations: new Float64Array(count),
    stepsToTolerance: new Int32Array(count),
    outcomes: new Array(count).fill(null),
  };
  bands.forEach((b, k) => {
    const r = results[k];
    out.endPoints.set(r.endPoints, b.lo * n);
    out.losses.set(r.losses, b.lo);
    out.steps.set(r.steps, b.lo);
    out.evaluations.set(r.evaluations, b.lo);
    out.stepsToTolerance.set(r.stepsToTolerance, b.lo);
    for (let i = 0; i < r.count; i++) out.outcomes[b.lo + i] = r.outcomes[i];
  });
  return out;
}
