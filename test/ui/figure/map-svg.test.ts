import { describe, expect, it } from 'vitest';
import { drawFigure } from '../../../src/ui/figure/compose';
import { approximateWidth } from '../../../src/ui/figure/render';
import { SvgContext } from '../../../src/ui/figure/svg-context';
import { bandColours, contourBands, gradientArrows, legendModel, levelThresholds, runStyle, valueScale, viewTransform } from '../../../src/ui/plot';
import type { GridBox } from '../../../src/engine';
import { frameLayout } from '../../../src/ui/view/frame';
import { drawBase, drawOverlay } from '../../../src/ui/view/scene';
import { xmlProblems } from '../plot/xml-check';

// The single map drawn into a figure on an SvgContext by the page's own drawBase and drawOverlay.
const grid: GridBox = { a: [-2, 2], b: [-2, 2], nx: 41, ny: 41 };
const values = new Float64Array(grid.nx * grid.ny);
for (let j = 0; j < grid.ny; j++) for (let i = 0; i < grid.nx; i++) values[i + j * grid.nx] = (-2 + i * 0.1) ** 2 + (-2 + j * 0.1) ** 2;
values[5] = Number.NaN;
const scale = valueScale(0, 8);
const thresholds = levelThresholds(0, 8, 10);
const colours = bandColours(thresholds, scale);
const bands = contourBands(values, grid, thresholds, scale.transform);
const picture = { requestId: null, grid, bands, colours, legend: legendModel(scale, thresholds, colours) };
const hostile = '<script>alert("x & y")</script>';
const view = { a: [-2, 2] as [number, number], b: [-2, 2] as [number, number] };
const size = { width: 720, height: 480 };

function mapSvg(): string {
  const ctx = new SvgContext(size.width, size.height, approximateWidth);
  const trajectories = [
    { points: Float64Array.from([1.5, 1.5, 1, 0.8, 0.5, 0.3, 0, 0]), count: 4, style: runStyle(0), label: hostile },
    { points: Float64Array.from([-1.5, 1, -0.5, 0.2]), count: 2, style: runStyle(1), label: 'momentum, lr = 0.1' },
  ].map((t) => ({ ...t, layout: { stride: 2, a: 0, b: 1 }, selected: false }));
  drawFigure(ctx, {
    title: `Bowl & ${hostile}`,
    key: [...trajectories.map((t) => ({ kind: 'run' as const, style: t.style, label: t.label })), { kind: 'known', point: 'minimum', label: 'known minimum' }],
    drawBody: (c, body) => {
      const layout = frameLayout(body, true);
      const arrows = gradientArrows((p) => ({ da: 2 * p.a, db: 2 * p.b }), viewTransform(view, layout.frame), 60);
      drawBase(c, { layout, view, picture, axisLabels: { a: 'x <a>', b: "y's" }, knownPoints: [{ at: { a: 0, b: 0 }, kind: 'minimum' }], arrows });
      drawOverlay(c, { layout, view, trajectories, hover: null });
    },
  }, size);
  return ctx.toSvg(`Bowl & ${hostile}`);
}

describe('the map as an SVG figure', () => {
  const svg = mapSvg();

  it('is a well-formed standalone SVG document of the figure size with no non-numbers', () => {
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<svg xmlns="http:\/\/www.w3.org\/2000\/svg" width="720" height="480" viewBox="0 0 720 480"/);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('escapes user text: a <script> label appears only escaped', () => {
    expect(svg).not.toContain('<script');
    expect(svg).toContain('&lt;script&gt;alert(&quot;x &amp; y&quot;)&lt;/script&gt;');
    expect(svg).toContain('>x &lt;a&gt;</text>');
    expect(svg).toContain('>y&#39;s</text>');
  });

  it('holds what the canvas draws: bands in the map colours, axis titles, colour-bar values, both runs, the missing-value grey', () => {
    const fills = [...svg.matchAll(/<path d="[^"]*" fill="(#[0-9a-f]{6})" fill-rule="evenodd"/g)].map((m) => m[1]);
    expect(fills).toEqual(colours.slice(0, fills.length));
    expect(fills.length).toBe(10);
    for (const label of picture.legend.ticks.map((t) => t.label)) expect(svg).toContain(`>${label}</text>`);
    expect(svg).toContain(`stroke="${runStyle(0).colour.toLowerCase()}"`);
    expect(svg).toContain(`stroke="${runStyle(1).colour.toLowerCase()}"`);
    expect(svg).toContain('>momentum, lr = 0.1</text>');
    expect(svg).toContain('>known minimum</text>');
    expect(svg).toContain('fill="#d9d9d9"'); // missing colour under the bands
    expect(svg).toContain('transform="matrix(0 -1 1 0 '); // the b axis title, turned a quarter
  });
});
