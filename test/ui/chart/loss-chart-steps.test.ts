import { describe, expect, it } from 'vitest';
import { CHART_MARGIN, drawLossChart } from '../../../src/ui/chart/loss-chart';
import { runStyle } from '../../../src/ui/plot';
import { RecordingContext } from '../plot/recording-context';

describe('the loss chart over a thinned trajectory', () => {
  // Plotting area w = 300 - CHART_MARGIN.left - CHART_MARGIN.right wide.
  const size = { width: 300, height: 250 };
  const w = size.width - CHART_MARGIN.left - CHART_MARGIN.right;

  it('places each kept row at its step, so the axis reaches the last step, not the row count', () => {
    // Rows kept at steps 0, 4, 8, ... 36 and the last step 39 (store/trajectory-buffer.ts keeps those).
    const steps = Float64Array.from([0, 4, 8, 12, 16, 20, 24, 28, 32, 36, 39]);
    const loss = Float64Array.from(steps, (s) => 2 + Math.cos(s));
    const ctx = new RecordingContext();
    drawLossChart(ctx, size, [{ loss, count: steps.length, steps, style: runStyle(0), label: 'thinned' }], { kind: 'linear' });
    const line = ctx.paints.find((p) => p.op === 'stroke' && p.colour === runStyle(0).colour)!;
    const xs = line.subpaths.flat().map(([x]) => x);
    // x = w * step / 39 for every vertex; the last vertex at the right edge, row 5 (step 20) at 20/39.
    expect(xs).toHaveLength(steps.length);
    xs.forEach((x, k) => expect(x).toBeCloseTo((w * steps[k]) / 39, 9));
  });

  it('without step numbers, row k is step k', () => {
    const loss = Float64Array.from({ length: 11 }, (_, k) => 2 + Math.cos(k));
    const ctx = new RecordingContext();
    drawLossChart(ctx, size, [{ loss, count: 11, style: runStyle(0), label: 'every step' }], { kind: 'linear' });
    const xs = ctx.paints.find((p) => p.op === 'stroke' && p.colour === runStyle(0).colour)!.subpaths.flat().map(([x]) => x);
    xs.forEach((x, k) => expect(x).toBeCloseTo((w * k) / 10, 9));
  });
});
