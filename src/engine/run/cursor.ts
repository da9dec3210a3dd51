import { isRowwiseSurface, type RowwiseSurface, type Surface } from '../surface';
import type { Optimizer, Oracle } from '../optim/types';
import { createRng, nextGaussian, type RngState } from '../rng';
import { allFinite, norm2 } from '../vector';
import { createMinibatchState, nextMinibatch, type MinibatchState } from './minibatch';
import { describeEndPoint, judgeEnd, type EndTrigger } from './end-state';
import type { RunOutcome } from './outcome';
import { createRecentPath, recordRecent, type RecentPath } from './recent';
import {
  DEFAULT_BLOW_UP_FACTOR,
  DEFAULT_LOSS_CHANGE_PATIENCE,
  validateRunSettings,
  type RunSettings,
} from './settings';
import { allocateBatch, trimBatch, type TrajectoryBatch } from './trajectory';

/** Everything a run needs to resume, as plain data (structuredClone-able). */
export interface RunState {
  /** Steps taken so far. */
  t: number;
  x: Float64Array;
  /** Exact gradient at x. */
  grad: Float64Array;
  loss: number;
  /** The start point, its loss and gradient norm (the stationarity test is relative to it). */
  x0: Float64Array;
  initialLoss: number;
  initialGradNorm: number;
  /** The last few points and the distance from the start at steps 1, 2, 4, ... (end-state judgement). */
  recent: RecentPath;
  optimizerState: unknown;
  rng: RngState;
  /** Consecutive steps that met the loss-change test. */
  calmSteps: number;
  /** Surface evaluations so far; a minibatch evaluation counts as one. */
  evaluations: number;
  /** Epoch order and position, for minibatch runs; null otherwise. */
  minibatch: MinibatchState | null;
  /** Whether step 0 has been handed out in a batch. */
  startReported: boolean;
  outcome: RunOutcome | null;
}

/**
 * Steps one run forward in batches. The cursor binds a surface and an optimizer to a plain-data
 * `RunState`; `advance(n)` takes up to n steps and returns them as a batch, the first batch also
 * holding step 0 (the start). Same settings and seed, same numbers. On a minibatch run the optimizer
 * steps on the next batch's loss and gradient (minibatch.ts) while the recorded loss and gradient norm
 * stay the exact full-data ones.
 */
export class RunCursor {
  readonly state: RunState;
  private readonly oracle: Oracle;
  private readonly work: Float64Array;
  /** The current minibatch (row indices, count), shared with the oracle. */
  private readonly batch: RowBatch;

  constructor(
    readonly surface: Surface,
    readonly optimizer: Optimizer,
    readonly settings: RunSettings,
  ) {
    const rowwise = isRowwiseSurface(surface) ? surface : null;
    validateRunSettings(settings, surface.dimension, rowwise?.rows);
    const n = surface.dimension;
    const x = Float64Array.from(settings.start);
    const grad = new Float64Array(n);
    const loss = surface.valueGradient(x, grad);
    this.state = {
      t: 0,
      x,
      grad,
      loss,
      x0: Float64Array.from(x),
      initialLoss: loss,
      initialGradNorm: norm2(grad),
      recent: createRecentPath(x, loss),
      optimizerState: optimizer.init(Float64Array.from(x)),
      rng: createRng(settings.seed),
      calmSteps: 0,
      evaluations: 1,
      minibatch: settings.minibatch && rowwise ? createMinibatchState(rowwise.rows) : null,
      startReported: false,
      outcome: null,
    };
    this.work = new Float64Array(n);
    this.batch = { indices: new Int32Array(settings.minibatch?.size ?? 0), count: 0 };
    const noise = settings.gradientNoise ?? 0;
    this.oracle = this.state.minibatch && rowwise ? batchOracle(rowwise, this.batch, noise, this.state) : noisyOracle(surface, noise, this.state);
    this.state.outcome = this.checkStart() ?? this.checkPoint();
  }

  get outcome(): RunOutcome | null {
    return this.state.outcome;
  }

  /** Takes up to `maxSteps` steps (fewer if the run ends) and returns the recorded rows. */
  advance(maxSteps: number): TrajectoryBatch {
    const s = this.state;
    const n = this.surface.dimension;
    const limit = this.settings.stop.maxSteps;
    const steps = s.outcome ? 0 : Math.max(0, Math.min(maxSteps, limit - s.t));
    const withStart = !s.startReported;
    const batch = allocateBatch(withStart ? 0 : s.t + 1, steps + (withStart ? 1 : 0), n);
    if (withStart) {
      this.record(batch, Number.NaN);
      s.startReported = true;
    }
    const noise = this.settings.gradientNoise ?? 0;
    for (let k = 0; k < steps && !s.outcome; k++) {
      const previousLoss = s.loss;
      // The optimizer sees the next batch's loss and gradient on a minibatch run, the exact ones otherwise.
      let stepLoss = s.loss;
      if (s.minibatch) stepLoss = this.drawBatch(s.minibatch);
      else this.work.set(s.grad);
      if (noise > 0) addNoise(this.work, noise, s.rng);
      s.t += 1;
      const report = this.optimizer.step(s.x, this.work, s.optimizerState, { t: s.t, loss: stepLoss, oracle: this.oracle });
      s.evaluations += report.extraEvaluations;
      if (report.lossAtNewPoint !== undefined && noise === 0 && !s.minibatch) {
        s.loss = report.lossAtNewPoint;
        s.grad.set(this.work);
      } else {
        s.loss = this.surface.valueGradient(s.x, s.grad);
        s.evaluations += 1;
      }
      this.record(batch, report.learningRate);
      recordRecent(s.recent, s.t, s.x, s.loss, s.x0);
      s.outcome = this.checkPoint() ?? (report.noDescent ? this.judge({ rule: 'no-step' }) : this.checkProgress(previousLoss, report.learningRate));
    }
    batch.outcome = s.outcome;
    return trimBatch(batch);
  }

  /** Runs to the end in batches of `batchSize` steps (for tests and the command line). */
  runToEnd(batchSize = 4096): TrajectoryBatch[] {
    const batches: TrajectoryBatch[] = [];
    do batches.push(this.advance(batchSize));
    while (!this.state.outcome);
    return batches;
  }

  /** Draws the next minibatch, writes its gradient into `work` and returns its loss. */
  private drawBatch(minibatch: MinibatchState): number {
    const surface = this.surface as RowwiseSurface;
    const b = this.batch;
    b.count = nextMinibatch(minibatch, b.indices.length, this.state.rng, b.indices);
    this.state.evaluations += 1;
    return surface.valueGradientOnRows(this.state.x, this.work, b.indices, b.count);
  }

  private record(batch: TrajectoryBatch, learningRate: number): void {
    const s = this.state;
    const row = batch.count++;
    batch.points.set(s.x, row * s.x.length);
    batch.loss[row] = s.loss;
    batch.gradNorm[row] = norm2(s.grad);
    batch.learningRate[row] = learningRate;
  }

  /** Ends the run where it stands, judged like any other end (the point's state is reported). */
  cancel(): RunOutcome {
    if (!this.state.outcome) this.state.outcome = this.judge('cancelled');
    return this.state.outcome;
  }

  /** The state of the current point (gradient, stationarity test, Hessian class if stationary). */
  endPoint() {
    return describeEndPoint(countingSurface(this.surface, this.state), this.endFacts());
  }

  private endFacts() {
    const s = this.state;
    return { ...s, stationarityTolerance: this.settings.stop.stationarityTolerance };
  }

  /** Judges the end; the Hessian evaluations the judgement makes count as the run's evaluations. */
  private judge(trigger: EndTrigger): RunOutcome {
    return judgeEnd(countingSurface(this.surface, this.state), this.endFacts(), trigger);
  }

  /**
   * A start where the loss or its gradient does not exist is not a divergence: the surface is
   * undefined there (outside a formula's domain, or at a cusp), and the outcome says why.
   */
  private checkStart(): RunOutcome | null {
    const s = this.state;
    if (!allFinite(s.x)) return null;
    if (!Number.isFinite(s.loss)) {
      const why = this.surface.explainUndefined?.(s.x, 'value');
      return { kind: 'undefined', step: 0, detail: `the loss is not defined at the start (${why ?? `it is ${s.loss}`})` };
    }
    if (!allFinite(s.grad)) {
      const why = this.surface.explainUndefined?.(s.x, 'gradient');
      return { kind: 'undefined', step: 0, detail: `the gradient does not exist at the start: the loss is finite but not differentiable here (a kink or cusp${why ? `: ${why}` : ''})` };
    }
    return null;
  }

  /** Non-finite values, blow-up and the gradient-norm rule, at every point the run reaches. */
  private checkPoint(): RunOutcome | null {
    const s = this.state;
    const step = s.t;
    if (!allFinite(s.x)) {
      if (s.loss < s.initialLoss && this.movingAway()) return { kind: 'escaping', step, detail: 'a coordinate overflowed to infinity while the loss kept falling', point: this.endPoint() };
      return { kind: 'diverged', reason: 'non-finite', step, detail: 'a coordinate became non-finite' };
    }
    if (s.loss === -Infinity) return { kind: 'escaping', step, detail: 'the loss fell without bound (it reached -Infinity)', point: this.endPoint() };
    if (!Number.isFinite(s.loss)) {
      const why = s.loss !== s.loss ? this.surface.explainUndefined?.(s.x, 'value') : null;
      if (why) return { kind: 'undefined', step, detail: `the step left the surface's domain: ${why}` };
      return { kind: 'diverged', reason: 'non-finite', step, detail: `the loss became ${s.loss}` };
    }
    if (!allFinite(s.grad)) {
      const why = this.surface.explainUndefined?.(s.x, 'gradient');
      return { kind: 'undefined', step, detail: `the run reached a point where the gradient does not exist${why ? `: ${why}` : ''}` };
    }
    const blowUp = this.settings.stop.blowUpFactor ?? DEFAULT_BLOW_UP_FACTOR;
    if (s.loss - s.initialLoss > blowUp * Math.max(1, Math.abs(s.initialLoss)))
      return { kind: 'diverged', reason: 'blow-up', step, detail: `the loss rose to ${s.loss.toPrecision(4)} from ${s.initialLoss.toPrecision(4)} at the start` };
    const gTol = this.settings.stop.gradientNormTolerance;
    if (gTol !== undefined && norm2(s.grad) <= gTol) return this.judge({ rule: 'gradient-norm', tolerance: gTol });
    return null;
  }

  /** Whether the distance from the start has been growing over the recorded doublings of steps. */
  private movingAway(): boolean {
    const d = this.state.recent.distanceAt;
    const k = Math.floor(Math.log2(Math.max(1, this.state.t)));
    return k >= 2 && d[k] > d[k - 1] && d[k - 1] > d[k - 2];
  }

  /**
   * The loss-change rule and the step limit. A step taken at learning rate 0 (a schedule decayed to
   * nothing) does not count as calm: the loss stopped changing because the run stopped moving, not
   * because it reached a minimum. Whichever rule fires, the end point is judged (end-state.ts).
   */
  private checkProgress(previousLoss: number, learningRate: number): RunOutcome | null {
    const s = this.state;
    const { lossChangeTolerance, lossChangePatience = DEFAULT_LOSS_CHANGE_PATIENCE, maxSteps } = this.settings.stop;
    if (lossChangeTolerance !== undefined && learningRate === 0) s.calmSteps = 0;
    else if (lossChangeTolerance !== undefined) {
      const scale = Math.max(1, Math.abs(s.loss), Math.abs(previousLoss));
      s.calmSteps = Math.abs(s.loss - previousLoss) / scale <= lossChangeTolerance ? s.calmSteps + 1 : 0;
      if (s.calmSteps >= lossChangePatience) return this.judge({ rule: 'loss-change', tolerance: lossChangeTolerance, patience: lossChangePatience });
    }
    if (s.t >= maxSteps) return this.judge('step-limit');
    return null;
  }
}

/** The surface with every evaluation added to the run's count. */
function countingSurface(surface: Surface, counter: { evaluations: number }): Surface {
  const counted: Surface = {
    dimension: surface.dimension,
    variables: surface.variables,
    value: (x) => (counter.evaluations++, surface.value(x)),
    valueGradient: (x, g) => (counter.evaluations++, surface.valueGradient(x, g)),
    valueGradientHessian: (x, g, h) => (counter.evaluations++, surface.valueGradientHessian(x, g, h)),
  };
  const withProducts = surface as Surface & { hessianVector?: (x: ArrayLike<number>, v: ArrayLike<number>, out: Float64Array) => void };
  if (withProducts.hessianVector) {
    const hv = withProducts.hessianVector.bind(surface);
    (counted as typeof withProducts).hessianVector = (x, v, out) => (counter.evaluations++, hv(x, v, out));
  }
  return counted;
}

function addNoise(g: Float64Array, std: number, rng: RngState): void {
  for (let i = 0; i < g.length; i++) g[i] += std * nextGaussian(rng);
}

interface RowBatch {
  indices: Int32Array;
  count: number;
}

/** The surface as optimizers see it: with the run's gradient noise, counting evaluations. */
function noisyOracle(surface: Surface, std: number, state: { rng: RngState }): Oracle {
  return {
    dimension: surface.dimension,
    value(x) {
      return surface.value(x);
    },
    valueGradient(x, grad) {
      const f = surface.valueGradient(x, grad);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
    valueGradientHessian(x, grad, hessian) {
      const f = surface.valueGradientHessian(x, grad, hessian);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
  };
}

/**
 * The surface as optimizers see it on a minibatch run: the current batch's loss (line searches and
 * Newton steps work on the same batch the step's gradient came from), with the run's gradient noise.
 */
function batchOracle(surface: RowwiseSurface, batch: RowBatch, std: number, state: { rng: RngState }): Oracle {
  const scratch = new Float64Array(surface.dimension);
  return {
    dimension: surface.dimension,
    value(x) {
      return surface.valueGradientOnRows(x, scratch, batch.indices, batch.count);
    },
    valueGradient(x, grad) {
      const f = surface.valueGradientOnRows(x, grad, batch.indices, batch.count);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
    valueGradientHessian(x, grad, hessian) {
      const f = surface.valueGradientHessianOnRows(x, grad, hessian, batch.indices, batch.count);
      if (std > 0) addNoise(grad, std, state.rng);
      return f;
    },
  };
}
