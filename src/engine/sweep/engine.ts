import { buildOptimizer } from '../optim/build';
import { applyTransforms, isChainOptimizer, learningRateStage, type ChainOptimizer, type ChainState, type GradientTransform } from '../optim/transform';
import type { Optimizer, Oracle, StepContext, StepReport } from '../optim/types';
import { createRng, type RngState } from '../rng';
import { nextCalmSteps, pointFinding, pointFindingAt, pointOutcome, progressTrigger, startOutcome, type PointFinding } from '../run/checks';
import { judgeEnd, type EndFacts, type EndTrigger } from '../run/end-state';
import { addNoise, addNoiseAt, countingSurface, noisyOracle } from '../run/oracle';
import type { RunOutcome } from '../run/outcome';
import { MILESTONES, RECENT_POINTS, recordMilestoneAt, recordRecentAt, type RecentPath } from '../run/recent';
import type { StopRules } from '../run/settings';
import type { Surface } from '../surface';
import { norm2 } from '../vector';
import { fusedKernel, type FusedHost, type FusedKernel } from './fused';
import { validateSweepPlan, type SweepPlan, type SweepProgress, type SweepResult } from './plan';

/**
 * Runs per block on the block path: one optimizer state per block of consecutive runs. Small enough
 * that a block with few live runs wastes little, large enough that the per-call cost of the
 * transforms (Adam's two powers of beta per step) is spread thin.
 */
const BLOCK = 64;

/** Rounds per batch on the fused path: the step numbers of a batch are computed once for every block. */
const FUSED_BATCH = 256;

/** The block path's parts: the chain's transforms and one chain state per block of BLOCK runs. */
interface Blocks {
  transforms: readonly GradientTransform[];
  rate: { learningRate(t: number): number };
  states: ChainState[];
  x: Float64Array[];
  grad: Float64Array[];
  work: Float64Array[];
}

/** A run's mutable step context, made once (the optimizer reads t, loss and oracle). */
interface RunContext {
  t: number;
  loss: number;
  oracle: Oracle;
}

/**
 * Runs one configuration from many starts in lockstep: after each `advance(k)` every live run has
 * taken k more steps (one per round), so all live runs stand at the same step. State is structure-of-arrays: all points in one Float64Array (count x n), all exact
 * gradients in another, the optimizer's work buffers, start points, losses, step and calm counters,
 * evaluation counts, recent-point rings and distance milestones each in one typed array; per-run
 * subarray views, optimizer states, seeded noise generators and oracles are made once in the
 * constructor, so a step allocates nothing beyond what the optimizer's own step does. Runs that end
 * leave the live list. Each step follows the run loop (cursor.ts) operation for operation, with the
 * stop rules from run/checks.ts, so a run's end point, loss, steps, evaluations and outcome are
 * bit-identical to the same run done alone by a RunCursor. Outcomes are built (and the end point
 * judged) only when a run ends.
 *
 * The block path: when every run shares one optimizer that is a chain of elementwise transforms
 * (transform.ts; every first-order kind without gradient clipping), the transforms run once per round
 * over each block of BLOCK consecutive runs, on one chain state for the block, instead of once per
 * run, and each block takes all the rounds of a call before the next block starts (it stays in
 * cache; runs are independent, so no number changes). An elementwise transform gives every entry the
 * numbers it would get alone, so the results are the same bits; a block whose runs have all ended is skipped (an ended run's entries in a block still
 * in use are transformed and ignored; its point no longer moves). Other optimizers (L-BFGS, Newton,
 * Nesterov momentum's 'record-base-point' form, clipped chains, several learning rates) step run by run
 * with a state per run.
 *
 * The fused path (fused.ts), tried first: on a compiled formula surface, with every transform of the
 * chain offering lockstep code (optim/lockstep.ts) and no gradient noise, one generated function
 * takes a block's round, each run's whole step inline (transforms, move, the formula's value and
 * gradient, ring, stop rules), with the same operations in the same order as the block path. A rule
 * that fires hands the run back here (FusedHost), where its outcome is built as on the block path.
 * `path` says which of the three a sweep took.
 *
 * Stream it with `advance(rounds)` or `advanceFor(ms, clock)` and read `result()` between calls.
 */
export class Sweep implements FusedHost {
  readonly count: number;
  readonly dimension: number;
  readonly surface: Surface;
  readonly stop: StopRules;
  /** How the runs step: the fused kernel (fused.ts), the block path, or run by run. */
  readonly path: 'fused' | 'blocks' | 'runs';
  private readonly noise: number;
  private readonly lossTolerance: number;
  private readonly lossTarget: number;
  private readonly stationarityTolerance: number | undefined;

  private readonly x: Float64Array;
  private readonly grad: Float64Array;
  private readonly work: Float64Array;
  private readonly x0: Float64Array;
  private readonly loss: Float64Array;
  private readonly initialLoss: Float64Array;
  private readonly initialGradNorm: Float64Array;
  private readonly steps: Int32Array;
  private readonly calm: Int32Array;
  private readonly evaluations: Float64Array;
  private readonly stepsToTolerance: Int32Array;
  private readonly ringPoints: Float64Array;
  private readonly ringLoss: Float64Array;
  private readonly milestones: Float64Array;
  private readonly outcomes: (RunOutcome | null)[];
  /** Indices of the runs still going, in plan order, in [0, liveCount). */
  private readonly live: Int32Array;
  private liveCount = 0;
  private totalSteps = 0;
  private rounds = 0;

  private readonly xs: Float64Array[] = [];
  private readonly grads: Float64Array[] = [];
  private readonly works: Float64Array[] = [];
  private readonly x0s: Float64Array[] = [];
  private readonly optimizers: Optimizer[] = [];
  private readonly states: unknown[] = [];
  private readonly rngs: RngState[] = [];
  private readonly contexts: RunContext[] = [];
  private readonly blocks: Blocks | null;
  private readonly fused: FusedKernel | null;
  /** The fused path's step numbers and learning rates for one batch of rounds. */
  private readonly batchNumbers: Float64Array;
  private readonly batchRates: Float64Array;
  private readonly scratchX: Float64Array;
  private readonly scratchGrad: Float64Array;
  /** The surface counting into `counter`, which `counted` loads with a run's count and reads back. */
  private readonly counter = { evaluations: 0 };
  private readonly countedSurface: Surface;
  /** What `facts` hands the end judgement, refilled for each run that ends (see facts). */
  private readonly judgementBuffers: { x: Float64Array; x0: Float64Array; grad: Float64Array; points: Float64Array; loss: Float64Array; distanceAt: Float64Array };

  constructor(plan: SweepPlan) {
    const count = validateSweepPlan(plan);
    const surface = plan.surface;
    const n = surface.dimension;
    this.count = count;
    this.dimension = n;
    this.surface = surface;
    this.stop = plan.stop;
    this.noise = plan.gradientNoise ?? 0;
    this.lossTolerance = plan.lossTolerance ?? Number.NaN;
    this.lossTarget = plan.lossTarget ?? 0;
    this.stationarityTolerance = plan.stop.stationarityTolerance;
    this.x = Float64Array.from(plan.starts);
    this.grad = new Float64Array(count * n);
    this.work = new Float64Array(count * n);
    this.x0 = Float64Array.from(plan.starts);
    this.loss = new Float64Array(count);
    this.initialLoss = new Float64Array(count);
    this.initialGradNorm = new Float64Array(count);
    this.steps = new Int32Array(count);
    this.calm = new Int32Array(count);
    this.evaluations = new Float64Array(count);
    this.stepsToTolerance = new Int32Array(count).fill(-1);
    this.ringPoints = new Float64Array(count * RECENT_POINTS * n);
    this.ringLoss = new Float64Array(count * RECENT_POINTS);
    this.milestones = new Float64Array(count * MILESTONES).fill(Number.NaN);
    this.outcomes = new Array<RunOutcome | null>(count).fill(null);
    this.live = new Int32Array(count);
    this.scratchX = new Float64Array(n);
    this.scratchGrad = new Float64Array(n);
    this.countedSurface = countingSurface(surface, this.counter);
    this.judgementBuffers = {
      x: new Float64Array(n),
      x0: new Float64Array(n),
      grad: new Float64Array(n),
      points: new Float64Array(RECENT_POINTS * n),
      loss: new Float64Array(RECENT_POINTS),
      distanceAt: new Float64Array(MILESTONES),
    };

    // One optimizer per distinct learning rate: an Optimizer keeps its run's state in `state`, its
    // closures only scratch buffers that each step fills before reading, so runs can share it.
    const byRate = new Map<number, Optimizer>();
    for (let r = 0; r < count; r++) {
      const lr = plan.learningRates ? plan.learningRates[r] : plan.optimizer.learningRate;
      let o = byRate.get(lr);
      if (!o) byRate.set(lr, (o = buildOptimizer({ ...plan.optimizer, learningRate: lr })));
      this.optimizers.push(o);
    }
    const shared = byRate.size === 1 ? [...byRate.values()][0] : null;
    const blockPath = shared !== null && isChainOptimizer(shared) && shared.transforms.every((tr) => tr.elementwise);
    // Each run's generator, seeded as RunCursor seeds it (drawn from only for gradient noise).
    if (!blockPath || this.noise > 0) for (let r = 0; r < count; r++) this.rngs.push(createRng(plan.seeds ? plan.seeds[r] : (plan.seed ?? 0)));
    // Run by run, each run gets its views, step context and oracle now; on the block path only runs
    // that end get views, when they end (facts), so thousands of runs make no objects up front.
    if (!blockPath)
      for (let r = 0; r < count; r++) {
        this.views(r);
        this.contexts.push({ t: 0, loss: 0, oracle: noisyOracle(surface, this.noise, { rng: this.rngs[r] }) });
      }
    const sx = this.scratchX;
    const sg = this.scratchGrad;
    for (let r = 0; r < count; r++) {
      // The start, as RunCursor's constructor evaluates and checks it (through a scratch copy).
      const o = r * n;
      for (let i = 0; i < n; i++) sx[i] = this.x[o + i];
      const loss = surface.valueGradient(sx, sg);
      for (let i = 0; i < n; i++) this.grad[o + i] = sg[i];
      this.loss[r] = loss;
      this.initialLoss[r] = loss;
      this.initialGradNorm[r] = norm2(sg);
      this.evaluations[r] = 1;
      recordRecentAt(this.ringPoints, o, count * n, this.ringLoss, r, count, this.milestones, r * MILESTONES, 0, this.x, o, n, loss, this.x0, o);
      if (loss - this.lossTarget <= this.lossTolerance) this.stepsToTolerance[r] = 0;
      let outcome = startOutcome(surface, sx, loss, sg);
      if (!outcome) {
        const finding = pointFindingAt(this.x, this.grad, o, n, loss, loss, this.stop);
        if (finding !== 'ok') outcome = this.pointEnd(r, finding);
      }
      this.outcomes[r] = outcome;
      if (!outcome) this.live[this.liveCount++] = r;
    }
    this.fused = blockPath && this.noise === 0 ? this.makeFused(shared as ChainOptimizer) : null;
    this.blocks = blockPath && !this.fused ? this.makeBlocks(shared as ChainOptimizer) : null;
    this.path = this.fused ? 'fused' : this.blocks ? 'blocks' : 'runs';
    this.batchNumbers = new Float64Array(this.fused ? FUSED_BATCH * this.fused.stepNumbers : 0);
    this.batchRates = new Float64Array(this.fused ? FUSED_BATCH : 0);
    if (this.path === 'runs') for (let r = 0; r < count; r++) this.states.push(this.optimizers[r].init(Float64Array.from(this.xs[r])));
  }

  /** Run r's subarray views and recent-path record over the flat arrays, made on first use. */
  private views(r: number): void {
    if (this.xs[r]) return;
    const n = this.dimension;
    const lo = r * n;
    const hi = lo + n;
    this.xs[r] = this.x.subarray(lo, hi);
    this.grads[r] = this.grad.subarray(lo, hi);
    this.works[r] = this.work.subarray(lo, hi);
    this.x0s[r] = this.x0.subarray(lo, hi);
  }

  private makeFused(o: ChainOptimizer): FusedKernel | null {
    const arrays = {
      grad: this.grad,
      initialLoss: this.initialLoss,
      stepsToTolerance: this.stepsToTolerance,
      ringPoints: this.ringPoints,
      ringLoss: this.ringLoss,
      calm: this.calm,
      live: this.live,
    };
    return fusedKernel(this.surface, o.transforms, this.stop, { tolerance: this.lossTolerance, target: this.lossTarget }, this.count, arrays, this);
  }

  private makeBlocks(o: ChainOptimizer): Blocks {
    const n = this.dimension;
    const b: Blocks = { transforms: o.transforms, rate: learningRateStage(o.transforms, o.label), states: [], x: [], grad: [], work: [] };
    for (let lo = 0; lo < this.count; lo += BLOCK) {
      const hi = Math.min(this.count, lo + BLOCK);
      const x = this.x.subarray(lo * n, hi * n);
      b.x.push(x);
      b.grad.push(this.grad.subarray(lo * n, hi * n));
      b.work.push(this.work.subarray(lo * n, hi * n));
      b.states.push(o.init(Float64Array.from(x)));
    }
    return b;
  }

  get progress(): SweepProgress {
    return { done: this.count - this.liveCount, total: this.count, steps: this.totalSteps, rounds: this.rounds };
  }

  /** Whether every run has ended. */
  get finished(): boolean {
    return this.liveCount === 0;
  }

  /** Takes up to `maxRounds` lockstep rounds (one step of every live run each) and reports progress. */
  advance(maxRounds: number): SweepProgress {
    const rounds = Math.max(0, Math.floor(maxRounds));
    if (this.fused && this.liveCount > 0 && rounds > 0) this.fusedRounds(this.fused, rounds);
    else if (this.blocks && this.liveCount > 0 && rounds > 0) this.blockRounds(this.blocks, rounds);
    else for (let k = 0; k < rounds && this.liveCount > 0; k++) this.round();
    return this.progress;
  }

  /**
   * Takes rounds until `ms` milliseconds have passed on `clock` (checked after each round, so at
   * least one round is taken) or every run has ended. The clock is passed in: the engine reads none.
   */
  advanceFor(ms: number, clock: () => number): SweepProgress {
    const t0 = clock();
    // Rounds go in batches (the block path then keeps each block in cache for the whole batch); a
    // batch doubles while four of it still fit in the time left.
    let batch = 1;
    for (;;) {
      const s = clock();
      this.advance(batch);
      const now = clock();
      if (this.liveCount === 0 || now - t0 >= ms) break;
      if (4 * (now - s) < ms - (now - t0)) batch *= 2;
      else batch = Math.max(1, batch >> 1);
    }
    return this.progress;
  }

  /** Ends every live run where it stands, each judged as a cancelled RunCursor would be. */
  cancel(): SweepProgress {
    for (let k = 0; k < this.liveCount; k++) {
      const r = this.live[k];
      this.outcomes[r] = this.judge(r, 'cancelled');
    }
    this.liveCount = 0;
    return this.progress;
  }

  /** The runs' results so far, copied (safe to transfer or keep while the sweep goes on). */
  result(): SweepResult {
    return {
      count: this.count,
      dimension: this.dimension,
      endPoints: this.x.slice(),
      losses: this.loss.slice(),
      steps: this.steps.slice(),
      evaluations: this.evaluations.slice(),
      stepsToTolerance: this.stepsToTolerance.slice(),
      outcomes: this.outcomes.slice(),
    };
  }

  /** One step of every live run, in plan order; runs that end leave the live list. */
  private round(): void {
    const live = this.live;
    const liveCount = this.liveCount;
    let kept = 0;
    for (let k = 0; k < liveCount; k++) {
      const r = live[k];
      if (this.stepRun(r)) live[kept++] = r;
    }
    this.totalSteps += liveCount;
    this.liveCount = kept;
    this.rounds += 1;
  }

  /**
   * `rounds` rounds on the block path, block by block: each block of runs takes all its rounds before
   * the next block starts (runs are independent, so the order across runs changes no number, and a
   * block's state stays in cache). In each round the block's work buffer gets the exact gradients
   * (plus each live run's noise, from its own generator), the transforms run over the block, then each
   * live run moves by its entries of the update and is evaluated and checked. Afterwards every live
   * run has taken the same number of steps again.
   */
  private blockRounds(b: Blocks, rounds: number): void {
    const live = this.live;
    const liveCount = this.liveCount;
    const noise = this.noise;
    const n = this.dimension;
    const t0 = this.rounds;
    let kept = 0;
    let used = 0;
    let k = 0;
    while (k < liveCount) {
      const block = (live[k] / BLOCK) | 0;
      const end = (block + 1) * BLOCK;
      let segmentEnd = k;
      while (segmentEnd < liveCount && live[segmentEnd] < end) segmentEnd++;
      const work = b.work[block];
      const grad = b.grad[block];
      const x = b.x[block];
      const state = b.states[block];
      // The block's live runs stay in live[k..alive), compacted as they end.
      let alive = segmentEnd;
      let q = 0;
      for (; q < rounds && alive > k; q++) {
        const t = t0 + q + 1;
        work.set(grad);
        if (noise > 0) for (let j = k; j < alive; j++) addNoiseAt(work, (live[j] - block * BLOCK) * n, n, noise, this.rngs[live[j]]);
        applyTransforms(b.transforms, state, work, x, t);
        this.totalSteps += alive - k;
        alive = this.blockSteps(k, alive, k, t, b.rate.learningRate(t));
      }
      used = Math.max(used, q);
      for (let j = k; j < alive; j++) live[kept++] = live[j];
      k = segmentEnd;
    }
    this.liveCount = kept;
    this.rounds += used;
  }

  /**
   * `rounds` rounds on the fused path, in batches of up to FUSED_BATCH rounds: the batch's step
   * numbers and learning rates are computed once (the same calls the transforms make per step), then
   * each block of runs takes the batch's rounds through the kernel, block by block as on the block path.
   */
  private fusedRounds(kernel: FusedKernel, rounds: number): void {
    const live = this.live;
    const numbers = this.batchNumbers;
    const rates = this.batchRates;
    const width = kernel.stepNumbers;
    const chain = this.optimizers[0] as ChainOptimizer;
    const learningRate = learningRateStage(chain.transforms, chain.label);
    let done = 0;
    while (done < rounds && this.liveCount > 0) {
      const batch = Math.min(FUSED_BATCH, rounds - done);
      const t0 = this.rounds;
      for (let q = 0; q < batch; q++) {
        kernel.writeStepNumbers(t0 + q + 1, numbers, q * width);
        rates[q] = learningRate.learningRate(t0 + q + 1);
      }
      const liveCount = this.liveCount;
      let kept = 0;
      let used = 0;
      let k = 0;
      while (k < liveCount) {
        const end = ((live[k] / BLOCK) | 0) * BLOCK + BLOCK;
        let segmentEnd = k;
        while (segmentEnd < liveCount && live[segmentEnd] < end) segmentEnd++;
        let alive = segmentEnd;
        let q = 0;
        for (; q < batch && alive > k; q++) {
          const t = t0 + q + 1;
          this.totalSteps += alive - k;
          alive = kernel.round(kernel.state, k, alive, k, t, rates[q], numbers, q * width, t % RECENT_POINTS);
          if ((t & (t - 1)) === 0) for (let j = k; j < alive; j++) this.recordFusedMilestone(live[j], t);
        }
        used = Math.max(used, q);
        for (let j = k; j < alive; j++) live[kept++] = live[j];
        k = segmentEnd;
      }
      this.liveCount = kept;
      this.rounds += used;
      done += batch;
    }
    for (let k = 0; k < this.liveCount; k++) this.syncFused(live[k], this.rounds);
  }

  /** For the fused kernel (FusedHost): a point rule ended run r at step t; the outcome as the block path builds it. */
  endFusedPoint(r: number, t: number): void {
    this.syncFused(r, t);
    const n = this.dimension;
    if ((t & (t - 1)) === 0) recordMilestoneAt(this.milestones, r * MILESTONES, t, this.x, r * n, n, this.x0, r * n);
    const finding = pointFindingAt(this.x, this.grad, r * n, n, this.loss[r], this.initialLoss[r], this.stop);
    this.endFlat(r, finding as Exclude<PointFinding, 'ok'>, null);
  }

  /** For the fused kernel (FusedHost): the loss-change rule or the step limit ended run r at step t. */
  endFusedProgress(r: number, t: number): void {
    this.syncFused(r, t);
    const n = this.dimension;
    if ((t & (t - 1)) === 0) recordMilestoneAt(this.milestones, r * MILESTONES, t, this.x, r * n, n, this.x0, r * n);
    this.endFlat(r, null, progressTrigger(this.stop, this.calm[r], t));
  }

  /**
   * A fused run's state at step t into the flat arrays: its point and loss from the ring's slot for t
   * (the kernel's record of them), its step count and evaluations (one per step after the start's).
   */
  private syncFused(r: number, t: number): void {
    const n = this.dimension;
    const slot = (t % RECENT_POINTS) * this.count + r;
    for (let i = 0; i < n; i++) this.x[r * n + i] = this.ringPoints[slot * n + i];
    this.loss[r] = this.ringLoss[slot];
    this.steps[r] = t;
    this.evaluations[r] = t + 1;
  }

  /** A fused run's distance milestone at step t (a power of 2), as recordRecentAt records it (after the kernel's round). */
  private recordFusedMilestone(r: number, t: number): void {
    this.syncFused(r, t);
    const n = this.dimension;
    recordMilestoneAt(this.milestones, r * MILESTONES, t, this.x, r * n, n, this.x0, r * n);
  }

  /**
   * The rest of a chain step for the live runs live[from..to) of one block, on the flat arrays (no
   * per-run objects: at thousands of runs those views would not stay in cache): move by the update,
   * evaluate the new point (through a scratch copy, so the surface sees a vector of its own), record
   * it and apply the stop rules. Returns the new count of kept runs.
   */
  private blockSteps(from: number, to: number, kept: number, t: number, learningRate: number): number {
    const live = this.live;
    const n = this.dimension;
    const X = this.x;
    const G = this.grad;
    const W = this.work;
    const X0 = this.x0;
    const losses = this.loss;
    const sx = this.scratchX;
    const sg = this.scratchGrad;
    const surface = this.surface;
    const stopRules = this.stop;
    const calmRule = stopRules.lossChangeTolerance !== undefined;
    const tol = this.lossTolerance;
    const target = this.lossTarget;
    const ringStride = this.count * n;
    const count = this.count;
    const evaluations = this.evaluations;
    const steps = this.steps;
    const toTolerance = this.stepsToTolerance;
    const ringPoints = this.ringPoints;
    const ringLoss = this.ringLoss;
    const milestones = this.milestones;
    const initialLoss = this.initialLoss;
    const calm = this.calm;
    for (let j = from; j < to; j++) {
      const r = live[j];
      const o = r * n;
      for (let i = 0; i < n; i++) sx[i] = X[o + i] += W[o + i];
      const loss = surface.valueGradient(sx, sg);
      for (let i = 0; i < n; i++) G[o + i] = sg[i];
      const previousLoss = losses[r];
      losses[r] = loss;
      evaluations[r] += 1;
      steps[r] = t;
      if (loss - target <= tol && toTolerance[r] < 0) toTolerance[r] = t;
      recordRecentAt(ringPoints, o, ringStride, ringLoss, r, count, milestones, r * MILESTONES, t, X, o, n, loss, X0, o);
      const finding = pointFindingAt(X, G, o, n, loss, initialLoss[r], stopRules);
      if (finding !== 'ok') {
        this.endFlat(r, finding, null);
        continue;
      }
      // Without the loss-change rule the counter never moves (checks.ts), so it is not updated.
      if (calmRule) calm[r] = nextCalmSteps(stopRules, calm[r], loss, previousLoss, learningRate);
      const trigger = progressTrigger(stopRules, calm[r], t);
      if (trigger) {
        this.endFlat(r, null, trigger);
        continue;
      }
      live[kept++] = r;
    }
    return kept;
  }

  private endFlat(r: number, finding: Exclude<PointFinding, 'ok'> | null, trigger: EndTrigger | null): void {
    this.end(r, finding ? this.pointEnd(r, finding) : this.judge(r, trigger!));
  }

  /** One step of run r, as RunCursor.advance takes it; false when the run ended. */
  private stepRun(r: number): boolean {
    const x = this.xs[r];
    const grad = this.grads[r];
    const work = this.works[r];
    const n = x.length;
    const previousLoss = this.loss[r];
    for (let i = 0; i < n; i++) work[i] = grad[i];
    const noise = this.noise;
    if (noise > 0) addNoise(work, noise, this.rngs[r]);
    const t = this.steps[r] + 1;
    this.steps[r] = t;
    const ctx = this.contexts[r];
    ctx.t = t;
    ctx.loss = previousLoss;
    const report: StepReport = this.optimizers[r].step(x, work, this.states[r], ctx as StepContext);
    this.evaluations[r] += report.extraEvaluations;
    let loss: number;
    if (report.lossAtNewPoint !== undefined && noise === 0) {
      loss = report.lossAtNewPoint;
      for (let i = 0; i < n; i++) grad[i] = work[i];
    } else {
      loss = this.surface.valueGradient(x, grad);
      this.evaluations[r] += 1;
    }
    this.loss[r] = loss;
    if (loss - this.lossTarget <= this.lossTolerance && this.stepsToTolerance[r] < 0) this.stepsToTolerance[r] = t;
    recordRecentAt(this.ringPoints, r * n, this.count * n, this.ringLoss, r, this.count, this.milestones, r * MILESTONES, t, x, 0, n, loss, this.x0, r * n);
    const finding = pointFinding(x, grad, loss, this.initialLoss[r], this.stop);
    if (finding !== 'ok') return this.end(r, this.pointEnd(r, finding));
    if (report.noDescent) return this.end(r, this.judge(r, { rule: 'no-step' }));
    const calm = nextCalmSteps(this.stop, this.calm[r], loss, previousLoss, report.learningRate);
    this.calm[r] = calm;
    const trigger = progressTrigger(this.stop, calm, t);
    if (trigger) return this.end(r, this.judge(r, trigger));
    return true;
  }

  private end(r: number, outcome: RunOutcome): false {
    this.outcomes[r] = outcome;
    return false;
  }

  /** The facts the end judgement reads, for run r (made only when the run ends). */
  private facts(r: number): EndFacts {
    // Run by run, the run's own views; otherwise copies into the sweep's judgement buffers (the
    // judgement only reads them and its outcome keeps none of them, so one set serves every run that
    // ends, and thousands of runs ending at once make no arrays).
    const n = this.dimension;
    const own = this.xs[r] !== undefined;
    const b = this.judgementBuffers;
    return {
      t: this.steps[r],
      x: own ? this.xs[r] : copyInto(b.x, this.x, r * n),
      x0: own ? this.x0s[r] : copyInto(b.x0, this.x0, r * n),
      grad: own ? this.grads[r] : copyInto(b.grad, this.grad, r * n),
      loss: this.loss[r],
      initialLoss: this.initialLoss[r],
      initialGradNorm: this.initialGradNorm[r],
      recent: this.recentPath(r),
      stationarityTolerance: this.stationarityTolerance,
    };
  }

  /**
   * Run r's recent path as the end judgement reads it (one run's ring, RecentPath layout), gathered
   * from the slot-major rings; made only when the run ends. Every run is recorded at each step from
   * 0, so the ring holds min(RECENT_POINTS, t + 1) points.
   */
  private recentPath(r: number): RecentPath {
    const n = this.dimension;
    const { points, loss, distanceAt } = this.judgementBuffers;
    const ring = this.ringPoints;
    const ringLoss = this.ringLoss;
    const count = this.count;
    for (let slot = 0; slot < RECENT_POINTS; slot++) {
      const from = (slot * count + r) * n;
      for (let i = 0; i < n; i++) points[slot * n + i] = ring[from + i];
      loss[slot] = ringLoss[slot * count + r];
    }
    return { points, loss, filled: Math.min(RECENT_POINTS, this.steps[r] + 1), distanceAt: copyInto(distanceAt, this.milestones, r * MILESTONES) };
  }

  /** Runs `f` on the surface counting into run r's evaluations, as the cursor's judgement counts. */
  private counted<T>(r: number, f: (surface: Surface) => T): T {
    const counter = this.counter;
    counter.evaluations = this.evaluations[r];
    const out = f(this.countedSurface);
    this.evaluations[r] = counter.evaluations;
    return out;
  }

  private pointEnd(r: number, finding: Exclude<PointFinding, 'ok'>): RunOutcome {
    return this.counted(r, (s) => pointOutcome(finding, s, this.facts(r), this.stop));
  }

  private judge(r: number, trigger: EndTrigger): RunOutcome {
    return this.counted(r, (s) => judgeEnd(s, this.facts(r), trigger));
  }
}

/** Copies a[at .. at + out.length) into out (a plain loop: for a few numbers far cheaper than set()). */
function copyInto(out: Float64Array, a: Float64Array, at: number): Float64Array {
  for (let i = 0; i < out.length; i++) out[i] = a[at + i];
  return out;
}
