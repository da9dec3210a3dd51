import { describe, expect, it } from 'vitest';
import { drawMapCells } from '../../../src/ui/study/start-map-drawing';
import { RecordingContext } from '../plot/recording-context';

describe('drawMapCells', () => {
  it('paints one rectangle per run of equal colour along each row and skips clear pixels', () => {
    // 3 x 3 cells: row 0 = red red blue, row 1 = clear blue blue, row 2 all clear.
    const px = (r: number, g: number, b: number, a = 255) => [r, g, b, a];
    const rgba = Uint8ClampedArray.from([...px(255, 0, 0), ...px(255, 0, 0), ...px(0, 0, 255), ...px(0, 0, 0, 0), ...px(0, 0, 255), ...px(0, 0, 255), ...px(0, 0, 0, 0), ...px(0, 0, 0, 0), ...px(0, 0, 0, 0)]);
    const ctx = new RecordingContext();
    drawMapCells(ctx, rgba, 3, { width: 30, height: 30 });
    const rects = ctx.calls.filter((c) => c.op === 'fillRect').map((c) => [c.fillStyle, ...(c.args as number[])]);
    expect(rects).toEqual([
      ['rgb(255, 0, 0)', 0, 0, 20.5, 10.5],
      ['rgb(0, 0, 255)', 20, 0, 10.5, 10.5],
      ['rgb(0, 0, 255)', 10, 10, 20.5, 10.5],
    ]);
  });
});
