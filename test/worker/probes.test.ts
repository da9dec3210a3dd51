import { describe, expect, it } from 'vitest';
import type { FromWorker } from '../../src/protocol';
import { SurfaceProbe } from '../../src/worker/probes';

describe('surface probes for the hover readout and the arrows, computed in the worker', () => {
  it("gives Himmelblau's value and gradient at each point, as its formula differentiated by hand", () => {
    // f = (x^2 + y - 11)^2 + (x + y^2 - 7)^2 (Himmelblau 1972);
    // df/dx = 4x(x^2 + y - 11) + 2(x + y^2 - 7), df/dy = 2(x^2 + y - 11) + 4y(x + y^2 - 7).
    const points = [[0.5, -1.5], [3, 2], [-2, 4]];
    const out: FromWorker[] = [];
    new SurfaceProbe((m) => out.push(m)).probe('q', { kind: 'catalogue', id: 'himmelblau' }, Float64Array.from(points.flat()), 3);
    const reply = out[0];
    if (reply.type !== 'probe/result') throw new Error(JSON.stringify(reply));
    points.forEach(([x, y], k) => {
      const a = x * x + y - 11;
      const b = x + y * y - 7;
      expect(reply.values[k]).toBeCloseTo(a * a + b * b, 12);
      expect(reply.gradients[2 * k]).toBeCloseTo(4 * x * a + 2 * b, 12);
      expect(reply.gradients[2 * k + 1]).toBeCloseTo(2 * a + 4 * y * b, 12);
    });
    expect([reply.values[1], reply.gradients[2], reply.gradients[3]]).toEqual([0, 0, 0]); // (3, 2) is a minimum
  });

  it('refuses a batch of the wrong length by name', () => {
    const out: FromWorker[] = [];
    new SurfaceProbe((m) => out.push(m)).probe('q', { kind: 'catalogue', id: 'himmelblau' }, Float64Array.of(1, 2, 3), 2);
    expect(out[0]).toEqual({ type: 'probe/error', requestId: 'q', message: 'probe: expected 2 points of 2 coordinates, got 3 numbers' });
  });
});
