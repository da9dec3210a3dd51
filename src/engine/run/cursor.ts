import { isRowwiseSurface, type RowwiseSurface, type Surface } from '../surface';
import type { Optimizer, Oracle } from '../optim/types';
import { createRng, type RngState } from '../rng';
import { norm2 } from '../vector';
import { nextCalmSteps, pointFinding, pointOutcome, progressTrigger, startOutcome } from './checks';
import { createMinibatchState, nextMinibatch, type MinibatchState } from './minibatch';
import { describeEndPoint, judgeEnd, type EndTrigger } from './end-state';
import type { RunOutcome } from './outcome';
import { createRecentPath, recordRecent, type RecentPath } from './recent';
import { addNoise, batchOracle, countingSurface, noisyOracle, type RowBatch } from './oracle';
import { validateRunSettings, type RunSettings } from './settings';
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
      else for (let i = 0; i < n; i++) this.work[i] = s.grad[i]; // a plain loop: far cheaper than set() for a few numbers
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
    const n = s.x.length;
    for (let i = 0; i < n; i++) batch.points[row * n + i] = s.x[i];
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

  /** A start where the loss or its gradient does not exist (checks.ts, startOutcome). */
  private checkStart(): RunOutcome | null {
    const s = this.state;
    return startOutcome(this.surface, s.x, s.loss, s.grad);
  }

  /** Non-finite values, blow-up and the gradient-norm rule, at every point the run reaches (checks.ts). */
  private checkPoint(): RunOutcome | null {
    const s = this.state;
    const finding = pointFinding(s.x, s.grad, s.loss, s.initialLoss, this.settings.stop);
    return finding === 'ok' ? null : pointOutcome(finding, countingSurface(this.surface, s), this.endFacts(), this.settings.stop);
  }

  /**
   * The loss-change rule (a step at learning rate 0 is not calm) and the step limit (checks.ts).
   * Whichever rule fires, the end point is judged (end-state.ts).
   */
  private checkProgress(previousLoss: number, learningRate: number): RunOutcome | null {
    const s = this.state;
    const stop = this.settings.stop;
    s.calmSteps = nextCalmSteps(stop, s.calmSteps, s.loss, previousLoss, learningRate);
    const trigger = progressTrigger(stop, s.calmSteps, s.t);
    return trigger ? this.judge(trigger) : null;
  }
}
