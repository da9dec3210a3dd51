import { describe, expect, it } from 'vitest';
import { bandColours, colourForValue, colourMap, DEFAULT_LOG_FLOOR, legendModel, legendTicks, levelThresholds, valueScale } from '../../../src/ui/plot';
import { camelValues } from './camel';

function range(values: Float64Array): { min: number; max: number } {
  let min = Infinity, max = -Infinity;
  for (const v of values)
    if (Number.isFinite(v)) {
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
  return { min, max };
}

describe('levelThresholds', () => {
  it('log levels are geometric in the shifted value t - min + offset, starting at min', () => {
    const min = 0, max = 100;
    const t = levelThresholds(min, max, 12, 'log');
    const offset = DEFAULT_LOG_FLOOR * (max - min);
    expect(t).toHaveLength(12);
    expect(t[0]).toBe(min);
    const shifted = t.map((v) => v - min + offset);
    const ratio = Math.pow((max - min + offset) / offset, 1 / 12);
    for (let k = 1; k < shifted.length; k++) expect(shifted[k] / shifted[k - 1]).toBeCloseTo(ratio, 9);
    expect(t[11]).toBeLessThan(max);
  });

  it('handles a negative minimum (six-hump camel): still geometric after the shift, all inside [min, max]', () => {
    const { min, max } = range(camelValues());
    expect(min).toBeCloseTo(-1.03, 1); // the grid minimum is near the published -1.0316
    const t = levelThresholds(min, max, 20, 'log');
    const offset = DEFAULT_LOG_FLOOR * (max - min);
    const shifted = t.map((v) => v - min + offset);
    for (let k = 2; k < shifted.length; k++) expect(shifted[k] / shifted[k - 1]).toBeCloseTo(shifted[1] / shifted[0], 9);
    expect(t[0]).toBe(min);
    expect(t.every((v) => v >= min && v < max)).toBe(true);
    expect(t.some((v) => v < 0)).toBe(true);
  });

  it('linear levels are evenly spaced from min', () => {
    expect(levelThresholds(-1, 3, 4, 'linear')).toEqual([-1, 0, 1, 2]);
  });

  it('takes a caller-chosen offset and rejects bad counts and offsets precisely', () => {
    const t = levelThresholds(0, 99, 2, 'log', 1);
    expect(t[1]).toBeCloseTo(9, 12); // shifted 1 .. 100, one step of ratio 10
    expect(() => levelThresholds(0, 1, 0)).toThrow('levels: count must be a whole number from 1 to 256, got 0');
    expect(() => levelThresholds(0, 1, 5, 'log', -1)).toThrow('colour scale: the log offset must be a positive number, got -1');
  });

  it('returns no levels when no value is finite', () => {
    expect(levelThresholds(Number.NaN, Number.NaN, 10)).toEqual([]);
  });
});

describe('valueScale and colourForValue', () => {
  it('normalises min to 0 and max to 1; missing values have no colour; values below min clamp', () => {
    const s = valueScale(-1, 9);
    expect(s.offset).toBeCloseTo(1e-3, 15);
    expect(s.normalise(-1)).toBe(0);
    expect(s.normalise(9)).toBe(1);
    expect(s.normalise(-5)).toBe(0);
    expect(s.normalise(Number.NaN)).toBeNaN();
    expect(colourForValue(Number.POSITIVE_INFINITY, s)).toBeNull();
    expect(s.valueAt(s.normalise(2))).toBeCloseTo(2, 9);
  });

  it('ends of the range get the ends of viridis (matplotlib viridis data: #440154 and #fde725)', () => {
    const s = valueScale(0, 1, 'linear');
    expect(colourForValue(0, s)).toBe('#440154');
    expect(colourForValue(1, s)).toBe('#fde725');
    expect(colourMap('cividis')(0)).toBe('#002051');
  });

  it('log puts the middle colour at the geometric middle of the shifted range', () => {
    const s = valueScale(0, 99.99, 'log', 0.01); // shifted 0.01 .. 100: middle at shifted 1
    expect(s.normalise(0.99)).toBeCloseTo(0.5, 9);
  });

  it('band colours are distinct, come from the map, and go from dark to bright', () => {
    const s = valueScale(0, 10);
    const t = levelThresholds(0, 10, 8);
    const colours = bandColours(t, s);
    const map = colourMap();
    expect(new Set(colours).size).toBe(8);
    colours.forEach((c, k) => expect(c).toBe(map((k + 0.5) / 8)));
  });
});

describe('legendTicks', () => {
  it('for a loss with minimum 0, log ticks are powers of ten with plain labels', () => {
    const ticks = legendTicks(valueScale(0, 100));
    expect(ticks.map((t) => t.value)).toEqual([0, 0.1, 1, 10, 100]);
    expect(ticks.map((t) => t.label)).toEqual(['0', '0.1', '1', '10', '100']);
    for (let k = 1; k < ticks.length; k++) expect(ticks[k].position).toBeGreaterThan(ticks[k - 1].position);
  });

  it('for the six-hump camel, ticks show actual (negative) loss values inside the range', () => {
    const { min, max } = range(camelValues());
    const s = valueScale(min, max);
    const ticks = legendTicks(s);
    expect(ticks.length).toBeGreaterThanOrEqual(3);
    for (const t of ticks) {
      expect(t.value).toBeGreaterThanOrEqual(min);
      expect(t.value).toBeLessThanOrEqual(max);
      expect(t.position).toBeGreaterThanOrEqual(0);
      expect(t.position).toBeLessThanOrEqual(1);
      expect(Number(t.label)).toBeCloseTo(t.value, 12);
      expect(t.position).toBeCloseTo(s.normalise(t.value), 12);
    }
    expect(ticks[0].value).toBeLessThan(-0.5); // near the minimum, not a shifted value near 1e-3
    expect(ticks.map((t) => t.value)).toContain(0);
  });

  it('linear ticks are d3 nice ticks with readable labels', () => {
    const ticks = legendTicks(valueScale(0, 1, 'linear'), 5);
    expect(ticks.map((t) => t.label)).toEqual(['0.0', '0.2', '0.4', '0.6', '0.8', '1.0']);
  });

  it('legend model: one block per band, covering [0, 1] without gaps', () => {
    const s = valueScale(-1, 5);
    const t = levelThresholds(-1, 5, 6);
    const m = legendModel(s, t, bandColours(t, s));
    expect(m.bands[0].from).toBe(0);
    expect(m.bands[m.bands.length - 1].to).toBe(1);
    for (let k = 1; k < m.bands.length; k++) expect(m.bands[k].from).toBeCloseTo(m.bands[k - 1].to, 12);
  });
});

describe('drawLegend', () => {
  it('draws one block per band from the bottom up in band colours, and every tick label beside the bar', async () => {
    const { drawLegend } = await import('../../../src/ui/plot');
    const { RecordingContext } = await import('./recording-context');
    const s = valueScale(0, 100);
    const t = levelThresholds(0, 100, 5);
    const m = legendModel(s, t, bandColours(t, s));
    const ctx = new RecordingContext();
    drawLegend(ctx, m, { px: 10, py: 20, width: 14, height: 200 }, 'loss');
    const blocks = ctx.paints.filter((p) => p.op === 'fill');
    expect(blocks.map((b) => b.colour)).toEqual(bandColours(t, s));
    const bottoms = blocks.map((b) => Math.max(...b.subpaths[0].map(([, y]) => y)));
    expect(bottoms[0]).toBeCloseTo(220, 9); // the lowest band sits at the bottom of the bar
    for (let k = 1; k < bottoms.length; k++) expect(bottoms[k]).toBeLessThan(bottoms[k - 1]);
    expect(ctx.texts.map((x) => x.text)).toEqual([...m.ticks.map((tk) => tk.label), 'loss']);
    for (const x of ctx.texts.slice(0, -1)) expect(x.x).toBeGreaterThan(24);
  });
});
