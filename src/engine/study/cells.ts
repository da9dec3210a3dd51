import { buildOptimizer } from '../optim/build';
import { SettingError } from '../optim/types';
import type { RunOutcome } from '../run/outcome';
import { hasParameterGroups, type Surface } from '../surface';
import { Sweep } from '../sweep/engine';
import { coarseToFineOrder } from '../sweep/grid';
import type { SweepPlan } from '../sweep/plan';
import { logSpaced } from '../sweep/rates';
import { validateLearningRateSweep, validateMultiStart, type StudySpec } from './spec';
import { cellStart, validateStartMap } from './start-map';
import { drawStarts } from './starts';

/**
 * A study's cells (one run each) as sweep plans: the one home of "cell index -> start, optimizer,
 * learning rate", shared by the page's study worker and the command line, so both make the same runs
 * (each Sweep run is bit for bit its RunCursor twin, whatever other runs share the sweep).
 * Cell indices: a map's i + j * resolution, a multi-start's start index, a sweep's o * count + k.
 */

/** How many cells (runs) a study has. */
export function studySize(spec: StudySpec): number {
  if (spec.kind === 'start-map') return spec.resolution * spec.resolution;
  if (spec.kind === 'lr-sweep') return spec.optimizers.length * spec.count;
  return spec.count;
}

/**
 * The order the cells run in, which is also the order their basins are assigned (engine/study/basins.ts
 * leader rule): a map coarse to fine (sweep/grid.ts coarseToFineOrder), other studies by index.
 */
export function studyOrder(spec: StudySpec): Int32Array {
  if (spec.kind === 'start-map') return coarseToFineOrder(spec.resolution, spec.resolution);
  return Int32Array.from({ length: studySize(spec) }, (_, k) => k);
}

/** Throws a SettingError naming the field (or a RangeError from drawStarts) if the study cannot run on `surface`. */
export function validateStudy(spec: StudySpec, surface: Surface): void {
  const n = surface.dimension;
  if (spec.kind === 'start-map') validateStartMap(spec, n);
  else if (spec.kind === 'lr-sweep') validateLearningRateSweep(spec, n);
  else {
    validateMultiStart(spec);
    drawStarts(spec.distribution, n, 1, spec.startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
  }
  const optimizers = spec.kind === 'lr-sweep' ? spec.optimizers.map((o) => o.spec) : [spec.optimizer];
  optimizers.forEach((o, q) => {
    try {
      buildOptimizer(o);
    } catch (e) {
      if (!(e instanceof SettingError)) throw e;
      throw new SettingError(spec.kind === 'lr-sweep' ? `optimizers.${q}.spec.${e.field}` : `optimizer.${e.field}`, e.message);
    }
  });
}

/**
 * What a study's steps to tolerance are measured against: the first step whose loss - value <=
 * tolerance, value being the lowest known minimum's value of the surface (the run summary's rule,
 * io/run-summary.ts). A study on a surface without a known minimum has none (null): its steps to
 * tolerance are not measured, not measured against some other target.
 */
export interface ToleranceTarget {
  value: number;
  tolerance: number;
}

/** One sweep of a study: the plan and, for each of its runs, the cell it computes. */
export interface CellPlan {
  indices: Int32Array;
  plan: SweepPlan;
}

/**
 * The sweeps that run the given cells (validated first): one for a map or a multi-start, one per
 * optimizer that has cells among them for a learning-rate sweep. Runs keep the order of `cells`.
 */
export function cellPlans(spec: StudySpec, surface: Surface, cells: ArrayLike<number>, target: ToleranceTarget | null = null): CellPlan[] {
  validateStudy(spec, surface);
  const reach = target ? { lossTarget: target.value, lossTolerance: target.tolerance } : {};
  const n = surface.dimension;
  const size = studySize(spec);
  for (let k = 0; k < cells.length; k++)
    if (!(Number.isInteger(cells[k]) && cells[k] >= 0 && cells[k] < size)) throw new RangeError(`study cells: cell ${cells[k]} is outside 0..${size - 1}`);
  const starts = (indices: ArrayLike<number>, startOf: (cell: number, out: Float64Array) => void) => {
    const out = new Float64Array(indices.length * n);
    for (let k = 0; k < indices.length; k++) startOf(indices[k], out.subarray(k * n, (k + 1) * n));
    return out;
  };
  switch (spec.kind) {
    case 'start-map': {
      const indices = Int32Array.from(cells);
      return [{ indices, plan: { surface, optimizer: spec.optimizer, stop: spec.stop, seed: spec.seed, starts: starts(indices, (c, out) => cellStart(spec, c, out)), ...reach } }];
    }
    case 'multi-start': {
      const all = drawStarts(spec.distribution, n, spec.count, spec.startSeed, hasParameterGroups(surface) ? surface.parameterGroups : undefined);
      const indices = Int32Array.from(cells);
      return [{ indices, plan: { surface, optimizer: spec.optimizer, stop: spec.stop, seed: spec.seed, starts: starts(indices, (c, out) => out.set(all.subarray(c * n, (c + 1) * n))), ...reach } }];
    }
    case 'lr-sweep': {
      const rates = logSpaced(spec.range[0], spec.range[1], spec.count);
      return spec.optimizers.flatMap((o, q) => {
        const indices = Int32Array.from(Array.from(cells).filter((c) => Math.floor(c / spec.count) === q));
        if (!indices.length) return [];
        const learningRates = Float64Array.from(indices, (c) => rates[c % spec.count]);
        return [{ indices, plan: { surface, optimizer: o.spec, stop: spec.stop, seed: spec.seed, starts: starts(indices, (_, out) => out.set(spec.start)), learningRates, ...reach } }];
      });
    }
  }
}

/** Ended cells of a study, in one order (typed arrays; end points row-major). Plain data. */
export interface StudyCellResults {
  indices: Int32Array;
  steps: Int32Array;
  loss: Float64Array;
  endPoints: Float64Array;
  /** First step within the tolerance of the target (ToleranceTarget), -1 if never or without a target. */
  stepsToTolerance: Int32Array;
  outcomes: RunOutcome[];
}

/** Runs the given cells to their ends on the sweep engine; results in the order of `cells`. */
export function runStudyCells(spec: StudySpec, surface: Surface, cells: ArrayLike<number>, target: ToleranceTarget | null = null): StudyCellResults {
  const n = surface.dimension;
  const position = new Map<number, number>();
  for (let k = 0; k < cells.length; k++) position.set(cells[k], k);
  if (position.size !== cells.length) throw new RangeError('study cells: a cell is listed twice');
  const out: StudyCellResults = {
    indices: Int32Array.from(cells), steps: new Int32Array(cells.length), loss: new Float64Array(cells.length), endPoints: new Float64Array(cells.length * n),
    stepsToTolerance: new Int32Array(cells.length).fill(-1), outcomes: new Array(cells.length),
  };
  for (const { indices, plan } of cellPlans(spec, surface, cells, target)) {
    const sweep = new Sweep(plan);
    while (!sweep.finished) sweep.advance(256);
    const r = sweep.result();
    indices.forEach((cell, k) => {
      const at = position.get(cell)!;
      out.steps[at] = r.steps[k];
      out.loss[at] = r.losses[k];
      out.stepsToTolerance[at] = r.stepsToTolerance[k];
      out.endPoints.set(r.endPoints.subarray(k * n, (k + 1) * n), at * n);
      out.outcomes[at] = r.outcomes[k]!;
    });
  }
  return out;
}
