// Equal scale: the shown box has the same pixels per unit on both axes, contains the asked-for box, and
// keeps its centre (hand-worked examples below).
import { describe, expect, it } from 'vitest';
import { equalScaleOn, shownView } from '../../src/store/equal-scale';
import { viewTransform } from '../../src/ui/plot';

describe('shownView', () => {
  it('widens a on a wide frame: [-2, 2] x [-1, 3] on 600 x 400 px becomes [-3, 3] x [-1, 3]', () => {
    // 400 px / 4 units = 100 px per unit of b, so a spans 600 / 100 = 6 units about its centre 0.
    expect(shownView({ a: [-2, 2], b: [-1, 3] }, { width: 600, height: 400 }, true)).toEqual({ a: [-3, 3], b: [-1, 3] });
  });

  it('widens b on a tall frame: [0, 10] x [0, 1] on 500 x 250 px becomes [0, 10] x [-2, 3]', () => {
    // 500 px / 10 units = 50 px per unit of a, so b spans 250 / 50 = 5 units about its centre 0.5.
    expect(shownView({ a: [0, 10], b: [0, 1] }, { width: 500, height: 250 }, true)).toEqual({ a: [0, 10], b: [-2, 3] });
  });

  it('gives equal pixels per unit, contains the asked-for box and keeps its centre', () => {
    const frames = [{ width: 731, height: 422 }, { width: 212, height: 598 }, { width: 400, height: 400 }];
    const views = [{ a: [-5.12, 5.12], b: [-5.12, 5.12] }, { a: [-1.5, 4], b: [-3, 4] }, { a: [0.001, 0.002], b: [100, 300] }] as { a: [number, number]; b: [number, number] }[];
    for (const frame of frames)
      for (const view of views) {
        const shown = shownView(view, frame, true);
        const t = viewTransform(shown, frame);
        expect(t.pxPerA / t.pxPerB).toBeCloseTo(1, 12);
        expect(shown.a[0]).toBeLessThanOrEqual(view.a[0]);
        expect(shown.a[1]).toBeGreaterThanOrEqual(view.a[1]);
        expect(shown.b[0]).toBeLessThanOrEqual(view.b[0]);
        expect(shown.b[1]).toBeGreaterThanOrEqual(view.b[1]);
        expect(shown.a[0] + shown.a[1]).toBeCloseTo(view.a[0] + view.a[1], 12);
        expect(shown.b[0] + shown.b[1]).toBeCloseTo(view.b[0] + view.b[1], 12);
        // Shown again, it stays (so zooming and panning from the shown box do not drift).
        expect(shownView(shown, frame, true)).toBe(shown);
      }
  });

  it('is the asked-for box when off or before the frame is measured', () => {
    const view = { a: [-2, 2], b: [-1, 3] } as { a: [number, number]; b: [number, number] };
    expect(shownView(view, { width: 600, height: 400 }, false)).toBe(view);
    expect(shownView(view, null, true)).toBe(view);
  });
});

describe('equalScaleOn', () => {
  it('is on by default for a two-variable test function only, and a saved choice wins', () => {
    expect(equalScaleOn({}, { kind: 'catalogue', id: 'rosenbrock' }, 2)).toBe(true);
    expect(equalScaleOn({}, { kind: 'formula', text: 'x^2 + y^2' }, 2)).toBe(false);
    expect(equalScaleOn({}, { kind: 'catalogue', id: 'some-n-d-entry' }, 5)).toBe(false);
    expect(equalScaleOn({ equalScale: false }, { kind: 'catalogue', id: 'rosenbrock' }, 2)).toBe(false);
    expect(equalScaleOn({ equalScale: true }, { kind: 'formula', text: 'x^2 + y^2' }, 2)).toBe(true);
  });
});
