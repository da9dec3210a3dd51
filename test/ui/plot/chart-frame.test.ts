import { describe, expect, it } from 'vitest';
import { beginChart, drawVerticalTitle, finiteExtent, PLOT_STYLE, strokeChartFrame } from '../../../src/ui/plot';
import { RecordingContext } from './recording-context';

describe('chart frame', () => {
  it('beginChart paints the canvas white, moves to the inset area and returns its size', () => {
    const ctx = new RecordingContext();
    const area = beginChart(ctx, { width: 400, height: 300 }, { left: 60, right: 10, top: 12, bottom: 38 });
    expect(area).toEqual({ w: 330, h: 250 });
    expect(ctx.calls.map((c) => c.op)).toEqual(['save', 'fillRect', 'translate']);
    expect(ctx.paints).toEqual([{ op: 'fill', colour: '#ffffff', lineWidth: 1, subpaths: [[[0, 0], [400, 0], [400, 300], [0, 300]]] }]);
    expect(ctx.calls[2].args).toEqual([60, 12]);
    expect(ctx.depth).toBe(1);
  });

  it('strokeChartFrame strokes the area outline at 1 px in the frame colour', () => {
    const ctx = new RecordingContext();
    ctx.lineWidth = 3;
    strokeChartFrame(ctx, 330, 250);
    expect(ctx.paints).toEqual([{ op: 'stroke', colour: PLOT_STYLE.frameColour, lineWidth: 1, subpaths: [[[0, 0], [330, 0], [330, 250], [0, 250]]] }]);
  });

  it('drawVerticalTitle turns the text a quarter turn at mid-height and restores the context', () => {
    const ctx = new RecordingContext();
    ctx.textBaseline = 'top';
    drawVerticalTitle(ctx, 'loss', -46, 250);
    expect(ctx.calls.map((c) => [c.op, ...c.args])).toEqual([['save'], ['translate', -46, 125], ['rotate', -Math.PI / 2], ['fillText', 'loss', 0, 0], ['restore']]);
    expect(ctx.textBaseline).toBe('top');
    expect(ctx.depth).toBe(0);
  });

  it('finiteExtent skips NaN and infinities', () => {
    expect(finiteExtent([3, Number.NaN, -2, Infinity, 5, -Infinity])).toEqual([-2, 5]);
    expect(finiteExtent(Float64Array.of(7))).toEqual([7, 7]);
    expect(finiteExtent([Number.NaN])).toEqual([Infinity, -Infinity]);
  });
});
