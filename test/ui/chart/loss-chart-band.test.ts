import { describe, expect, it } from 'vitest';
import { BAND_STYLE, CHART_MARGIN, drawLossChart } from '../../../src/ui/chart/loss-chart';
import { runStyle } from '../../../src/ui/plot';
import { RecordingContext } from '../plot/recording-context';

describe('the multi-start band on the loss chart', () => {
  // 300 x 250 canvas: plotting area w = 300 - 70 - 24 = 206, h = 250 - 10 - 40 = 200 (CHART_MARGIN).
  const size = { width: 300, height: 250 };
  const h = size.height - CHART_MARGIN.top - CHART_MARGIN.bottom;
  const steps = 11;
  const fill = (v: number) => new Float64Array(steps).fill(v);
  const series = [{ loss: fill(1), count: steps, style: runStyle(0), label: 'Plain descent' }];

  it('fills between the quartiles and draws the median dashed, the axis covering the band', () => {
    const ctx = new RecordingContext();
    drawLossChart(ctx, size, series, { kind: 'log' }, { quantiles: [fill(10), fill(100), fill(1000)] });
    // Log axis over [1, 1000] (the run at 1, the band's top quartile at 1000): 1000 at the top edge,
    // 100 two thirds of the way up, 10 one third: y = h (1 - log10(v) / 3).
    const band = ctx.paints.find((p) => p.op === 'fill' && p.colour === BAND_STYLE.fill)!;
    expect(band).toBeDefined();
    const ys = band.subpaths.flat().map(([, y]) => y);
    expect(Math.min(...ys)).toBeCloseTo(0, 9);
    expect(Math.max(...ys)).toBeCloseTo(h * (2 / 3), 9);
    const median = ctx.paints.find((p) => p.op === 'stroke' && p.colour === BAND_STYLE.median)!;
    for (const [, y] of median.subpaths.flat()) expect(y).toBeCloseTo(h / 3, 9);
    const dash = ctx.calls.find((c) => c.op === 'setLineDash' && (c.args[0] as number[]).length)!;
    expect(dash.args[0]).toEqual([...BAND_STYLE.medianDash]);
    // The band is painted before (under) the run's line.
    const runLine = ctx.paints.findIndex((p) => p.op === 'stroke' && p.colour === runStyle(0).colour);
    expect(ctx.paints.indexOf(band)).toBeLessThan(runLine);
  });

  it('draws no band without one', () => {
    const ctx = new RecordingContext();
    drawLossChart(ctx, size, series, { kind: 'log' });
    expect(ctx.paints.some((p) => p.colour === BAND_STYLE.fill)).toBe(false);
  });
});
