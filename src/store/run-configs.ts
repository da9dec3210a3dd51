import { defaultOptimizerSpec, optimizerLabel, type OptimizerKind } from '../engine';
import { freshId } from './ids';
import type { RunConfig } from './workspace';

/** Stop rules a new run gets: generous enough to watch, tight enough to end. */
export const DEFAULT_STOP = { maxSteps: 3000, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-8 };

/** The lowest style index no other run uses, so each run keeps a distinct colour and marker. */
export function nextStyle(runs: readonly RunConfig[]): number {
  const used = new Set(runs.map((r) => r.style));
  let k = 0;
  while (used.has(k)) k++;
  return k;
}

/**
 * The optimizer a new run gets on the page: the engine's defaults, except that "Newton's method" starts
 * as the robust variant (saddle-free with backtracking): plain Newton is drawn to saddle points and
 * maxima as readily as to minima, which is worth seeing but a poor first choice. Plain Newton stays one
 * setting away (variant 'plain', line search 'none').
 */
export function pageDefaultSpec(kind: OptimizerKind) {
  const spec = defaultOptimizerSpec(kind);
  if (kind === 'newton') spec.hyper = { ...spec.hyper, variant: 'saddle-free', lineSearch: 'backtracking' };
  return spec;
}

/** A new run with the optimizer's defaults, a label not used yet, and its own style. */
export function newRunConfig(kind: OptimizerKind, existing: readonly RunConfig[], start: number[]): RunConfig {
  const optimizer = pageDefaultSpec(kind);
  const base = optimizerLabel(optimizer);
  const labels = new Set(existing.map((r) => r.label));
  let label = base;
  for (let k = 2; labels.has(label); k++) label = `${base} ${k}`;
  return {
    id: freshId('c'),
    label,
    optimizer,
    settings: { start: start.slice(), seed: 1, stop: { ...DEFAULT_STOP } },
    style: nextStyle(existing),
  };
}
