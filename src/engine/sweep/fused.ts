import type { FormulaSurface } from '../expr/compile';
import { KERNEL_TABLE, isKernelName } from '../expr/primitives';
import type { LockstepCode } from '../optim/lockstep';
import type { GradientTransform } from '../optim/transform';
import { RECENT_POINTS } from '../run/recent';
import { DEFAULT_BLOW_UP_FACTOR, DEFAULT_LOSS_CHANGE_PATIENCE, type StopRules } from '../run/settings';
import type { Surface } from '../surface';
import { norm2At } from '../vector';

/**
 * The sweep's fused kernel: one generated function that takes one lockstep round for the live runs of
 * a block, each run's whole step inline: the chain's transforms entry by entry (each transform's
 * lockstep code, optim/lockstep.ts), the move, the formula's value and gradient (its inlinable
 * statements, expr/inline.ts), the bookkeeping, the recent-point ring and the per-step stop rules.
 * No call per run through the surface, per transform over a work buffer, or per rule.
 *
 * It applies when the surface is a compiled formula, every transform of the one shared chain has
 * lockstep code, and the gradient carries no noise; the engine (engine.ts) keeps its block path for
 * everything else. Each operation is the one the block path does, in the same order, so every number
 * is the same double: the transforms' code repeats their `update`, the point is the formula's own
 * statements, the rules are checks.ts's (rules 1-6, then the loss-change rule and the step limit) and
 * the ring write is recent.ts's (the ring also carries each run's point and loss from round to round,
 * see FusedArrays). A rule that fires hands the run back to the engine (FusedHost), which builds its
 * outcome as the block path does. test/engine/sweep/fused.test.ts checks the bits against the block
 * path and RunCursor.
 *
 * Safety: the source is made of this file's fixed text, the transforms' fixed code and the
 * formula's statements, which the formula compiler made from its graph alone and checked token by
 * token. Every number (hyperparameters, stop rules) passes as a value, not as text, so sweeps that
 * differ only in numbers share one compiled function (cached by source).
 */

/**
 * Where the kernel hands back the runs it ends (the sweep engine). Methods of one class, so every
 * sweep's kernel calls the same function (a fresh closure per sweep would make the optimised kernel
 * start over for each sweep). Distance milestones (t a power of 2) are not the kernel's: the engine
 * records them after the round for the runs that go on, and in these calls for a run that ends at
 * such a step, before judging it (a milestone reads only the run's own point at t and its start, so
 * the record is the same; keeping the call out of the loop makes the round faster).
 */
export interface FusedHost {
  /** A point rule of checks.ts (rules 1-6) ended run r at step t (its point and loss are in the ring's slot for t). */
  endFusedPoint(r: number, t: number): void;
  /** The loss-change rule or the step limit ended run r at step t. */
  endFusedProgress(r: number, t: number): void;
}

/**
 * The engine's flat arrays the kernel reads and writes (engine.ts, Sweep). The recent-point ring is
 * the kernel's record of each run's point and loss: a round reads them from the previous step's slot
 * and writes the new ones to this step's, so the engine's point and loss arrays are not written per
 * step; the engine copies the current slot into them when a run ends and after each call. Nor are the
 * step and evaluation counts, which on this path are t and t + 1 for every live run (one evaluation
 * per step after the start's).
 */
export interface FusedArrays {
  grad: Float64Array;
  initialLoss: Float64Array;
  stepsToTolerance: Int32Array;
  ringPoints: Float64Array;
  ringLoss: Float64Array;
  calm: Int32Array;
  live: Int32Array;
}

/**
 * One round for the live runs live[from..to) at step t (every transform's step numbers for t at
 * q[at..]): moves and checks each, keeps the runs that go on at live[kept..] and returns the new
 * kept count. `slot` is t mod RECENT_POINTS.
 */
export type FusedRound = (state: FusedState, from: number, to: number, kept: number, t: number, learningRate: number, q: Float64Array, at: number, slot: number) => number;

/** Everything one sweep's kernel reads: the engine's arrays, the transforms' states and numbers, the formula's constants. */
export interface FusedState extends FusedArrays {
  states: Float64Array[];
  /** Each transform's constants. */
  constants: Float64Array[];
  /** The formula's named constants (its statements read c[i]). */
  c: Float64Array;
  /** Per run, the blow-up rule's bound on f - f0: blowUpFactor * max(1, |f0|) (checks.ts). */
  blowUpBound: Float64Array;
  /** Loss tolerance, step limit, gradient-norm and loss-change tolerances, patience, run count, the tolerance's target. */
  numbers: Float64Array;
  host: FusedHost;
}

export interface FusedKernel {
  /** The compiled round (shared by every sweep with the same source); call it with `state`. */
  round: FusedRound;
  state: FusedState;
  /** Step numbers per t, over all transforms. */
  readonly stepNumbers: number;
  /** Writes every transform's step numbers for step t into out[at .. at + stepNumbers). */
  writeStepNumbers(t: number, out: Float64Array, at: number): void;
}

/** Largest dimension inlined (the kernel unrolls every coordinate). */
const MAX_DIMENSION = 32;

interface InlineSource {
  inlineGradient: FormulaSurface['inlineGradient'];
}

function inlineSource(surface: Surface): InlineSource | null {
  const s = surface as Partial<InlineSource>;
  return typeof s.inlineGradient === 'function' ? (s as InlineSource) : null;
}

/** The kernel for this surface, chain and stop rules, or null when the fused path does not apply. */
export function fusedKernel(
  surface: Surface,
  transforms: readonly GradientTransform[],
  stop: StopRules,
  reach: { tolerance: number; target: number },
  count: number,
  arrays: FusedArrays,
  host: FusedHost,
): FusedKernel | null {
  const n = surface.dimension;
  const formula = inlineSource(surface);
  const codes = transforms.map((tr) => (tr.elementwise ? tr.lockstep : undefined));
  if (!formula || n > MAX_DIMENSION || !codes.every((c): c is LockstepCode => c !== undefined)) return null;
  const { code: gradient, constants } = formula.inlineGradient();
  const gradientRule = stop.gradientNormTolerance !== undefined;
  const calmRule = stop.lossChangeTolerance !== undefined;
  const source = kernelSource(n, gradient, codes, { tolerance: !Number.isNaN(reach.tolerance), gradientRule, calmRule });
  const states = codes.flatMap((c) => c.arrays.map((initial) => new Float64Array(count * n).fill(initial)));
  const blowUp = stop.blowUpFactor ?? DEFAULT_BLOW_UP_FACTOR;
  const blowUpBound = arrays.initialLoss.map((f0) => blowUp * Math.max(1, Math.abs(f0)));
  const numbers = Float64Array.of(
    reach.tolerance,
    stop.maxSteps,
    stop.gradientNormTolerance ?? Number.NaN,
    stop.lossChangeTolerance ?? Number.NaN,
    stop.lossChangePatience ?? DEFAULT_LOSS_CHANGE_PATIENCE,
    count,
    reach.target,
  );
  const state: FusedState = { ...arrays, states, constants: codes.map((c) => Float64Array.from(c.constants)), c: constants, blowUpBound, numbers, host };
  const offsets: number[] = [];
  let stepNumbers = 0;
  for (const c of codes) {
    offsets.push(stepNumbers);
    stepNumbers += c.steps;
  }
  return {
    round: roundFor(source),
    state,
    stepNumbers,
    writeStepNumbers(t, out, at) {
      for (let i = 0; i < codes.length; i++) codes[i].step?.(t, out, at + offsets[i]);
    },
  };
}

/** Compiled rounds by source: sweeps of the same formula, chain and rules share one function. */
const ROUNDS = new Map<string, FusedRound>();
const MAX_CACHED = 64;

function roundFor(source: string): FusedRound {
  let round = ROUNDS.get(source);
  if (!round) {
    if (ROUNDS.size >= MAX_CACHED) ROUNDS.clear();
    // Generated from fixed text and checked formula statements only (see the header).
    round = (new Function('K', 'NORM', source) as (kernels: typeof KERNEL_TABLE, norm: typeof norm2At) => FusedRound)(KERNEL_TABLE, norm2At);
    ROUNDS.set(source, round);
  }
  return round;
}

/** The kernel's source (exported for the tests). */
export function kernelSource(
  n: number,
  gradient: ReturnType<InlineSource['inlineGradient']>['code'],
  codes: readonly LockstepCode[],
  rules: { tolerance: boolean; gradientRule: boolean; calmRule: boolean },
): string {
  const coords = Array.from({ length: n }, (_, i) => i);
  const at = (i: number) => (i === 0 ? 'o' : `o + ${i}`);
  const lines: string[] = ['"use strict";'];
  for (const k of gradient.kernels) {
    if (!isKernelName(k)) throw new Error(`fused: '${k}' is not a kernel`);
    lines.push(`const m_${k} = K.${k};`);
  }
  // One sweep's arrays and numbers, read from the state into locals at each call.
  lines.push(
    'return function round(S, from, to, kept, t, lr, Q, qAt, slot) {',
    'const G = S.grad, IL = S.initialLoss, TT = S.stepsToTolerance, BOUND = S.blowUpBound;',
    'const RP = S.ringPoints, RL = S.ringLoss, CALM = S.calm, LIVE = S.live, HOST = S.host, c = S.c, P = S.numbers;',
    // The run count as an integer, so the ring's index arithmetic stays in integers.
    'const TOL = P[0], MAX_STEPS = P[1], GTOL = P[2], CTOL = P[3], PATIENCE = P[4], COUNT = P[5] | 0, TARGET = P[6];',
  );
  let state = 0;
  const names = codes.map((c, ti) => {
    const s = c.arrays.map((_, j) => ({ array: `S${state + j}`, local: `s${ti}_${j}` }));
    s.forEach((e, j) => lines.push(`const ${e.array} = S.states[${state + j}];`));
    state += c.arrays.length;
    const k = c.constants.map((_, j) => `k${ti}_${j}`);
    k.forEach((name, j) => lines.push(`const ${name} = S.constants[${ti}][${j}];`));
    const q = Array.from({ length: c.steps }, (_, j) => `q${ti}_${j}`);
    return { s, k, q };
  });
  let offset = 0;
  names.forEach((nm) => nm.q.forEach((name) => lines.push(`const ${name} = Q[qAt + ${offset++}];`)));
  lines.push(
    'const ringAt = slot * COUNT;',
    `const previousAt = ((slot + ${RECENT_POINTS - 1}) % ${RECENT_POINTS}) * COUNT;`,
    // Runs of a block where none has ended are consecutive: then r follows from the position alone.
    'const shift = LIVE[to - 1] - LIVE[from] === to - 1 - from ? LIVE[from] - from : -1;',
    'for (let run = from; run < to; run++) {',
    'const r = shift >= 0 ? shift + run : LIVE[run];',
    `const o = r * ${n};`,
    `const previousRing = (previousAt + r) * ${n};`,
  );
  lines.push(`let ${coords.map((i) => `x${i}`).join(', ')};`);
  for (const i of coords) {
    lines.push(`{ const j = ${at(i)}; let u = G[j]; const p = RP[previousRing${i === 0 ? '' : ` + ${i}`}];`);
    names.forEach((nm) => nm.s.forEach((e) => lines.push(`let ${e.local} = ${e.array}[j];`)));
    codes.forEach((c, ti) => lines.push(`{ ${c.code({ u: 'u', p: 'p', s: names[ti].s.map((e) => e.local), k: names[ti].k, q: names[ti].q })} }`));
    names.forEach((nm) => nm.s.forEach((e) => lines.push(`${e.array}[j] = ${e.local};`)));
    lines.push(`x${i} = p + u; }`);
  }
  lines.push(...gradient.statements, `const loss = ${gradient.value};`);
  for (const i of coords) lines.push(`const g${i} = ${gradient.gradient[i]}; G[${at(i)}] = g${i};`);
  if (rules.calmRule) lines.push('const previous = RL[previousAt + r];');
  if (rules.tolerance) lines.push('if (loss - TARGET <= TOL && TT[r] < 0) TT[r] = t;');
  lines.push(
    `const ring = (ringAt + r) * ${n};`,
    ...coords.map((i) => `RP[${i === 0 ? 'ring' : `ring + ${i}`}] = x${i};`),
    'RL[ringAt + r] = loss;',
    // checks.ts rules 1-5 in one test: a v * 0 sum is 0 exactly when every v is finite (loss -Infinity
    // included), and with all finite only the blow-up rule is left. The engine names the rule.
    `if (${[...coords.map((i) => `x${i} * 0`), ...coords.map((i) => `g${i} * 0`), 'loss * 0'].join(' + ')} !== 0 || loss - IL[r] > BOUND[r]) { HOST.endFusedPoint(r, t); continue; }`,
  );
  if (rules.gradientRule) lines.push(`if (NORM(G, o, ${n}) <= GTOL) { HOST.endFusedPoint(r, t); continue; }`);
  if (rules.calmRule)
    lines.push(
      'const calm = lr === 0 ? 0 : Math.abs(loss - previous) / Math.max(1, Math.abs(loss), Math.abs(previous)) <= CTOL ? CALM[r] + 1 : 0;',
      'CALM[r] = calm;',
      'if (calm >= PATIENCE) { HOST.endFusedProgress(r, t); continue; }',
    );
  // LIVE[run] is r, so while no run of this call has ended (kept === run) the store would change nothing.
  lines.push('if (t >= MAX_STEPS) { HOST.endFusedProgress(r, t); continue; }', 'if (kept !== run) LIVE[kept] = r;', 'kept++;', '}', 'return kept;', '};');
  return lines.join('\n');
}
