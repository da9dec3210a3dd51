import { describe, expect, it } from 'vitest';
import { makeTable } from '../../../src/problems/datasets/table';
import { drawDataScene, MAX_DRAWN_ROWS, predictedClass, predictionRows, REGION_SIDE, rowStride } from '../../../src/ui/data/data-plot';
import { RecordingContext } from '../plot/recording-context';

/** A made-up table of `rows` rows: y = 2 x + 1 and a 0/1 class column. */
function table(rows: number) {
  return makeTable('made-up', 'test', ['x', 'z', 'y', 'c'], Array.from({ length: rows }, (_, i) => [i, i % 7, 2 * i + 1, i % 2]));
}
/** Each point is one filled marker; the only other fill is the chart's background. */
const markers = (ctx: RecordingContext) => ctx.paints.filter((p) => p.op === 'fill').length - 1;

describe('the data view', () => {
  it('draws every row of a small table and says nothing about thinning', () => {
    const ctx = new RecordingContext();
    const caption = drawDataScene(ctx, { width: 400, height: 300 }, { table: table(150), inputs: ['x'], target: 'y', task: 'regression', predictions: null });
    expect(markers(ctx)).toBe(150);
    expect(caption).not.toMatch(/drawn/);
  });

  it.each([
    ['one input', ['x'], 'y', 'regression'],
    ['several inputs', ['x', 'z'], 'y', 'regression'],
    ['classes', ['x', 'z'], 'c', 'binary'],
  ] as const)('with %s, draws MAX_DRAWN_ROWS rows of a 50,000-row table and says so', (_, inputs, target, task) => {
    const big = table(50_000);
    const { count } = predictionRows(big, inputs, task);
    const ctx = new RecordingContext();
    const caption = drawDataScene(ctx, { width: 400, height: 300 }, { table: big, inputs, target, task, predictions: task === 'binary' ? null : { outputs: new Float64Array(count).fill(0.5), width: 1 } });
    expect(rowStride(50_000)).toBe(25);
    expect(markers(ctx)).toBe(MAX_DRAWN_ROWS);
    expect(count).toBeLessThanOrEqual(REGION_SIDE * REGION_SIDE); // the rows drawn, the 201 points of the curve, or the lattice
    expect(caption).toContain('(1 row in 25 of 50000 drawn)');
  });

  it('asks for predictions at the curve abscissae, at exactly the drawn rows, or at the lattice centres', () => {
    const t = table(10);
    const curve = predictionRows(t, ['x'], 'regression');
    expect(curve.count).toBe(201);
    // x runs 0..9, widened by 5% of its width on each side: [-0.45, 9.45].
    expect(curve.rows[0]).toBeCloseTo(-0.45, 12);
    expect(curve.rows[200]).toBeCloseTo(9.45, 12);
    const drawn = predictionRows(table(50_000), ['x', 'z'], 'regression');
    expect(drawn.count).toBe(MAX_DRAWN_ROWS);
    // Output k belongs to row 25 k: x = 25 k, z = 25 k mod 7.
    expect([drawn.rows[2 * 3], drawn.rows[2 * 3 + 1]]).toEqual([75, 75 % 7]);
    const lattice = predictionRows(t, ['x', 'z', 'y'], 'binary');
    expect(lattice.count).toBe(REGION_SIDE * REGION_SIDE);
    // First cell: the left end of x, the top of z, y held at its mean (2 * 4.5 + 1 = 10).
    expect(lattice.rows[0]).toBeCloseTo(-0.45 + (0.5 * 9.9) / REGION_SIDE, 12);
    expect(lattice.rows[1]).toBeCloseTo(6.3 - (0.5 * 6.6) / REGION_SIDE, 12);
    expect(lattice.rows[2]).toBe(10);
    expect(predictionRows(t, ['x'], 'binary').count).toBe(0);
  });

  it('shades each lattice cell with the colour of its predicted class', () => {
    const n = REGION_SIDE;
    // Class 1 on the left half of the lattice, class 0 on the right; one cell with no finite output.
    const outputs = Float64Array.from({ length: n * n }, (_, k) => (k % n < n / 2 ? 0.9 : 0.1));
    outputs[5] = Number.NaN;
    const ctx = new RecordingContext();
    drawDataScene(ctx, { width: 400, height: 300 }, { table: table(10), inputs: ['x', 'z'], target: 'c', task: 'binary', predictions: { outputs, width: 1 } });
    // Cells per colour: each shading fill is a run of whole cells along one row, cell width (400 - 56 - 12) / n.
    const cw = (400 - 56 - 12) / n;
    const fills = ctx.calls.filter((c) => c.op === 'fillRect' && c.fillStyle !== '#ffffff');
    const cells = new Map<string, number>();
    for (const c of fills) cells.set(c.fillStyle, (cells.get(c.fillStyle) ?? 0) + Math.round(((c.args[2] as number) - 0.5) / cw));
    // Two class colours: n^2 / 2 cells of class 0 and n^2 / 2 - 1 of class 1 (the NaN cell is left blank).
    expect([...cells.values()].sort((a, b) => a - b)).toEqual([(n * n) / 2 - 1, (n * n) / 2]);
    // One rectangle per half row, and one more where the blank cell splits a run.
    expect(fills.length).toBe(2 * n + 1);
  });

  it('takes the most probable class, and none where the outputs are not numbers', () => {
    expect(predictedClass(Float64Array.of(0.2, 0.5, 0.3), 3, 0)).toBe(1);
    expect(predictedClass(Float64Array.of(0.1, 0.2, 0.7, 0.6, 0.3, 0.1), 3, 1)).toBe(0);
    expect(predictedClass(Float64Array.of(Number.NaN, Number.NaN), 2, 0)).toBe(-1);
    expect(predictedClass(Float64Array.of(0.5), 1, 0)).toBe(1);
    expect(predictedClass(Float64Array.of(0.4999), 1, 0)).toBe(0);
  });
});
