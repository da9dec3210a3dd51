import { describe, expect, it } from 'vitest';
import { axesModel, drawAxes, niceTicks, viewTransform } from '../../../src/ui/plot';
import { RecordingContext } from './recording-context';

describe('niceTicks', () => {
  it('gives 1-2-5 steps with labels at the precision of the step', () => {
    expect(niceTicks([0, 1], 5).map((t) => t.label)).toEqual(['0.0', '0.2', '0.4', '0.6', '0.8', '1.0']);
    expect(niceTicks([-2, 2], 4)).toEqual([-2, -1, 0, 1, 2].map((v) => ({ value: v, label: String(v) })));
    expect(niceTicks([2, -2], 4).map((t) => t.value)).toEqual([-2, -1, 0, 1, 2]);
    expect(niceTicks([0, Number.NaN], 4)).toEqual([]);
  });
});

describe('axes', () => {
  const t = viewTransform({ a: [-2, 2], b: [-1, 3] }, { width: 400, height: 250 });

  it('places a ticks along the bottom and b ticks along the left, inside the frame span', () => {
    const m = axesModel(t, { a: 'x', b: 'y' });
    expect(m.aTicks.length).toBeGreaterThanOrEqual(3);
    for (const tick of m.aTicks) {
      expect(tick.px).toBeCloseTo(t.pxOfA(tick.value), 12);
      expect(tick.px).toBeGreaterThanOrEqual(0);
      expect(tick.px).toBeLessThanOrEqual(400);
    }
    for (let k = 1; k < m.bTicks.length; k++) expect(m.bTicks[k].py).toBeLessThan(m.bTicks[k - 1].py);
  });

  it('drawAxes writes every tick label and the variable names as titles, the b title rotated', () => {
    const ctx = new RecordingContext();
    const m = drawAxes(ctx, t, { a: 'learning rate', b: 'momentum' });
    const texts = ctx.texts.map((x) => x.text);
    for (const tick of [...m.aTicks, ...m.bTicks]) expect(texts).toContain(tick.label);
    expect(texts).toContain('learning rate');
    expect(texts).toContain('momentum');
    expect(ctx.calls.find((c) => c.op === 'rotate')?.args).toEqual([-Math.PI / 2]);
    // a labels sit below the frame and b labels left of it, in the margins
    for (const tick of m.aTicks) expect(ctx.texts.some((x) => x.text === tick.label && x.x === tick.px && x.y > 250)).toBe(true);
    for (const tick of m.bTicks) expect(ctx.texts.some((x) => x.text === tick.label && x.y === tick.py && x.x < 0)).toBe(true);
    expect(ctx.depth).toBe(0);
  });
});
