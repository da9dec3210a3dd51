import { describe, expect, it } from 'vitest';
import { defaultOptimizerSpec, Sweep, type OptimizerKind, type OptimizerSpec, type StopRules, type Surface, type SweepPlan } from '../../../src/engine';
import { assertSafeInline } from '../../../src/engine/expr/inline';
import { buildSurface } from '../../../src/problems';
import { gridStarts, runAlone } from './alone';

/**
 * The sweep's fused kernel (src/engine/sweep/fused.ts) against the two other ways to take the same
 * steps: the engine's block path (the same plan on the surface behind a plain wrapper, which offers no
 * inlinable statements) and each run alone through RunCursor. Every number and outcome must be the
 * same bits; `path` shows which way each sweep went.
 */

const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });
/** Named constants (read by the kernel as c[i]) and an ill-conditioned valley. */
const rosenbrock = buildSurface({ kind: 'catalogue', id: 'rosenbrock' });
/** Four variables, a kernel call (sin) and a cross term. */
const fourD = buildSurface({ kind: 'formula', text: '(a - 1)^2 + 2*(b + 0.5)^2 + 3*c^2 + d^2/2 + sin(a*b*c) + 0.1*a*d' });
/** Defined only for x > 0: a step to x <= 0 leaves the domain (loss NaN, 'undefined'). */
const logWall = buildSurface({ kind: 'formula', text: 'log(x) + (x - 3)^2 + y^2' });
/** Grows fast: GD at a large rate overflows the coordinates (non-finite x) or blows up. */
const quartic = buildSurface({ kind: 'formula', text: 'x^4 + y^4 + x*y' });

/** The same surface behind a plain object: the engine cannot see its statements, so it takes the block path. */
function opaque(s: Surface): Surface {
  const plain: Surface = {
    dimension: s.dimension,
    variables: s.variables,
    value: (x) => s.value(x),
    valueGradient: (x, g) => s.valueGradient(x, g),
    valueGradientHessian: (x, g, h) => s.valueGradientHessian(x, g, h),
  };
  if (s.explainUndefined) plain.explainUndefined = (x, what) => s.explainUndefined!(x, what);
  return plain;
}

function spec(kind: OptimizerKind, learningRate: number, hyper: OptimizerSpec['hyper'] = {}, extra: Partial<OptimizerSpec> = {}): OptimizerSpec {
  const d = defaultOptimizerSpec(kind);
  return { ...d, learningRate, hyper: { ...d.hyper, ...hyper }, ...extra };
}

function starts(surface: Surface, count: number, spread: number, centre = 0): Float64Array {
  const n = surface.dimension;
  const s = new Float64Array(count * n);
  // A fixed, irregular pattern (no generator): coordinate i of run r.
  for (let r = 0; r < count; r++) for (let i = 0; i < n; i++) s[r * n + i] = centre + spread * Math.sin(1.7 * r + 2.3 * i + 0.4);
  return s;
}

/** Runs the plan to the end on the fused path and on the block path, in uneven slices, and checks both against RunCursor. */
function expectSameBits(plan: SweepPlan, slice = 37) {
  const fused = new Sweep(plan);
  const blocks = new Sweep({ ...plan, surface: opaque(plan.surface) });
  expect(fused.path).toBe('fused');
  expect(blocks.path).toBe('blocks');
  while (!fused.finished) fused.advance(slice);
  while (!blocks.finished) blocks.advance(slice);
  const a = fused.result();
  const b = blocks.result();
  expect(a).toEqual(b);
  for (const k of ['endPoints', 'losses'] as const) for (let i = 0; i < a[k].length; i++) if (!Object.is(a[k][i], b[k][i])) throw new Error(`${k}[${i}]: ${a[k][i]} vs ${b[k][i]}`);
  const alone = runAlone(plan.surface, plan.optimizer, plan.stop, plan.starts);
  const n = a.dimension;
  for (let r = 0; r < a.count; r++) {
    const where = `run ${r}`;
    expect(Array.from(a.endPoints.subarray(r * n, (r + 1) * n)), where).toEqual(alone[r].point);
    expect(Object.is(a.losses[r], alone[r].loss), where).toBe(true);
    expect(a.steps[r], where).toBe(alone[r].steps);
    expect(a.evaluations[r], where).toBe(alone[r].evaluations);
    expect(a.outcomes[r], where).toEqual(alone[r].outcome);
  }
  return a;
}

describe('Sweep fused kernel: the same bits as the block path and as RunCursor', () => {
  it('takes the fused path for the bench configuration (catalogue Himmelblau, Adam, step limit only)', () => {
    const optimizer = { ...defaultOptimizerSpec('adam'), learningRate: 0.01, hyper: { beta1: 0.9, beta2: 0.999, epsilon: 1e-8 } };
    // Past one batch of rounds (256) in a single call, as the bench's advance(500) does.
    const res = expectSameBits({ surface: himmelblau, optimizer, stop: { maxSteps: 500 }, starts: gridStarts(-5, 5, -5, 5, 10) }, 500);
    expect(new Set(res.outcomes.map((o) => o!.kind))).toEqual(new Set(['step-limit']));
  });

  it('for every optimizer with lockstep code, with a schedule, weight decay and L2', () => {
    const stop: StopRules = { maxSteps: 300, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-9 };
    const specs: OptimizerSpec[] = [
      spec('gd', 0.01),
      spec('momentum', 0.005, { dampening: 0.1 }),
      spec('nesterov', 0.005),
      spec('adam', 0.05),
      spec('adam', 0.05, { epsilonForm: 'eps-before-correction' }),
      spec('adamw', 0.05),
      spec('amsgrad', 0.05),
      spec('amsgrad', 0.05, { form: 'max-corrected-moment' }),
      spec('amsgrad', 0.05, { form: 'no-bias-correction' }),
      spec('adagrad', 0.5, { epsilonPlacement: 'inside', initialAccumulator: 0.1 }),
      spec('rmsprop', 0.01),
      spec('rmsprop', 0.01, { centered: true, momentum: 0.5, epsilonPlacement: 'inside', initialMeanSquare: 1 }),
      spec('adam', 0.1, {}, { schedule: { kind: 'step', decayRate: 0.5, decaySteps: 50, warmupSteps: 10 } }),
      spec('momentum', 0.005, {}, { l2Penalty: 0.01, weightDecay: 0.001 }),
    ];
    for (const optimizer of specs) expectSameBits({ surface: himmelblau, optimizer, stop, starts: gridStarts(-5, 5, -5, 5, 9), lossTolerance: 1e-3 });
  });

  it('escaping runs: the distance milestones (recorded outside the kernel) are the cursor\'s, ending at a power of 2 or not', () => {
    // A dome: runs slide off faster and faster, and the escape judgement reads the distances from
    // the start at steps 2^k (end-state.ts escapeDetail, quoted in the outcome's detail).
    const plane = buildSurface({ kind: 'formula', text: '-(x^2 + 0.5*y^2)' });
    for (const maxSteps of [256, 300]) {
      const a = expectSameBits({ surface: plane, optimizer: spec('gd', 0.01), stop: { maxSteps }, starts: gridStarts(-1, 1, -1, 1, 4) });
      expect(a.outcomes.filter((o) => o!.kind === 'escaping').length, a.outcomes.map((o) => o!.kind).join()).toBeGreaterThanOrEqual(8);
    }
  });

  it('with stop rules that fire mid-run: loss change, gradient norm, loss tolerance, blow-up, non-finite and leaving the domain', () => {
    const gd = spec('gd', 0.001);
    const a = expectSameBits({ surface: rosenbrock, optimizer: spec('adam', 0.02), stop: { maxSteps: 2000, lossChangeTolerance: 1e-10, lossChangePatience: 5 }, starts: gridStarts(-2, 2, -1, 3, 6), lossTolerance: 1e-4 });
    expect(a.outcomes.some((o) => o!.step < 2000)).toBe(true);
    expect(a.stepsToTolerance.some((s) => s > 0)).toBe(true);
    // A target other than 0 (loss - target <= tolerance): from 0.5 every run gets there no later than from 0, some sooner.
    const shifted = expectSameBits({ surface: rosenbrock, optimizer: spec('adam', 0.02), stop: { maxSteps: 2000, lossChangeTolerance: 1e-10, lossChangePatience: 5 }, starts: gridStarts(-2, 2, -1, 3, 6), lossTolerance: 1e-4, lossTarget: 0.5 });
    expect(shifted.stepsToTolerance.every((s, r) => a.stepsToTolerance[r] < 0 || (s >= 0 && s <= a.stepsToTolerance[r]))).toBe(true);
    expect(shifted.stepsToTolerance.some((s, r) => s >= 0 && s < a.stepsToTolerance[r])).toBe(true);
    const b = expectSameBits({ surface: himmelblau, optimizer: spec('gd', 0.01), stop: { maxSteps: 1000, gradientNormTolerance: 1e-6 }, starts: gridStarts(-5, 5, -5, 5, 6) });
    expect(b.outcomes.filter((o) => o!.kind === 'converged' && o!.step < 1000).length).toBeGreaterThan(0);
    // Large rates on the quartic: coordinates overflow (non-finite) or the loss blows up; some runs stay.
    const reasons = new Set<string>();
    for (const blowUpFactor of [1e6, 1e300]) {
      const c = expectSameBits({ surface: quartic, optimizer: spec('gd', 0.2), stop: { maxSteps: 200, blowUpFactor }, starts: starts(quartic, 40, 3) });
      for (const o of c.outcomes) reasons.add(o!.kind === 'diverged' ? o!.reason : o!.kind);
    }
    expect(reasons).toContain('non-finite');
    expect(reasons).toContain('blow-up');
    // Left of x = 0.177 the gradient pushes towards the wall at 0; a long step jumps over it.
    const d = expectSameBits({ surface: logWall, optimizer: gd, stop: { maxSteps: 300 }, starts: starts(logWall, 30, 0.08, 0.1) });
    const e = expectSameBits({ surface: logWall, optimizer: spec('gd', 0.3), stop: { maxSteps: 300 }, starts: starts(logWall, 30, 0.08, 0.1) });
    expect([...d.outcomes, ...e.outcomes].some((o) => o!.kind === 'undefined')).toBe(true);
  });

  it('on a surface of four variables, and past a batch of rounds in one call', () => {
    const stop: StopRules = { maxSteps: 700, lossChangeTolerance: 1e-13 };
    for (const optimizer of [spec('adam', 0.02), spec('nesterov', 0.01), spec('rmsprop', 0.005, { centered: true })])
      expectSameBits({ surface: fourD, optimizer, stop, starts: starts(fourD, 70, 2) }, 1000);
  });

  it('with kernels and branches in the formula (abs, max, min, softplus, a fractional power)', () => {
    const kinked = buildSurface({ kind: 'formula', text: 'abs(x - 1) + max(y, 0)^2 + softplus(x*y) + min(x, y)^2 + (x^2 + 1)^0.75' });
    for (const optimizer of [spec('gd', 0.01), spec('adam', 0.05)]) expectSameBits({ surface: kinked, optimizer, stop: { maxSteps: 300, lossChangeTolerance: 1e-12 }, starts: starts(kinked, 40, 2) });
  });

  it('stays off with gradient noise, for chains without lockstep code and for surfaces without statements', () => {
    const base = { surface: himmelblau, stop: { maxSteps: 10 }, starts: gridStarts(-1, 1, -1, 1, 2) };
    expect(new Sweep({ ...base, optimizer: spec('adam', 0.1), gradientNoise: 0.1 }).path).toBe('blocks');
    expect(new Sweep({ ...base, optimizer: spec('nadam', 0.1) }).path).toBe('blocks');
    expect(new Sweep({ ...base, optimizer: spec('adam', 0.1, {}, { clipNorm: 1 }) }).path).toBe('runs');
    expect(new Sweep({ ...base, optimizer: spec('lbfgs', 1) }).path).toBe('runs');
    expect(new Sweep({ ...base, surface: opaque(himmelblau), optimizer: spec('adam', 0.1) }).path).toBe('blocks');
  });

  it('lets only the formula compiler\'s own tokens into inlined statements', () => {
    const ok = { kernels: ['sin'], statements: ['const t3 = m_sin(x0) * c[1] + 2.5e-3;'], value: 't3', gradient: ['(-1)'] };
    expect(() => assertSafeInline(ok)).not.toThrow();
    for (const bad of ['const t3 = x0.constructor;', 'const t3 = A[0];', 'const t3 = "x";', 'const t3 = c[x0];', 'fetch(t1);', 'const t3 = m_eval(x0);'])
      expect(() => assertSafeInline({ ...ok, statements: [bad] }), bad).toThrow(/inline/);
    expect(() => assertSafeInline({ ...ok, kernels: ['constructor'] })).toThrow(/not a kernel/);
  });
});
