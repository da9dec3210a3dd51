import { describe, expect, it } from 'vitest';
import {
  bandColours,
  contourBands,
  escapeXml,
  gradientArrows,
  legendModel,
  levelThresholds,
  runStyle,
  surfaceToSvg,
  valueScale,
  viewTransform,
} from '../../../src/ui/plot';
import type { GridBox } from '../../../src/engine';
import { xmlProblems } from './xml-check';

const grid: GridBox = { a: [-2, 2], b: [-2, 2], nx: 41, ny: 41 };
const values = new Float64Array(grid.nx * grid.ny);
for (let j = 0; j < grid.ny; j++) for (let i = 0; i < grid.nx; i++) values[i + j * grid.nx] = (-2 + i * 0.1) ** 2 + (-2 + j * 0.1) ** 2;
values[5] = Number.NaN;
const scale = valueScale(0, 8);
const thresholds = levelThresholds(0, 8, 10);
const colours = bandColours(thresholds, scale);
const bands = contourBands(values, grid, thresholds, scale.transform);
const transform = viewTransform(grid, { width: 320, height: 240 });
const hostile = '<script>alert("x & y")</script>';

function scene() {
  return surfaceToSvg({
    transform,
    title: `Bowl & ${hostile}`,
    bands,
    colours,
    grid,
    axes: { a: 'x <a>', b: "y's" },
    legend: { model: legendModel(scale, thresholds, colours), title: 'loss' },
    trajectories: [
      { points: Float64Array.from([1.5, 1.5, 1, 0.8, 0.5, 0.3, 0, 0]), count: 4, style: runStyle(0), label: hostile, options: { markerEvery: 2 } },
      { points: Float64Array.from([-1.5, 1, -0.5, 0.2]), count: 2, style: runStyle(1), label: 'momentum, lr = 0.1' },
    ],
    knownPoints: [{ at: { a: 0, b: 0 }, kind: 'minimum', label: 'min "0"' }],
    knownPointLabels: true,
    arrows: gradientArrows((p) => ({ da: 2 * p.a, db: 2 * p.b }), transform, 60),
  });
}

describe('surfaceToSvg', () => {
  const svg = scene();

  it('is a well-formed standalone SVG document', () => {
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toMatch(/^<\?xml version="1.0" encoding="UTF-8"\?>\n<svg xmlns="http:\/\/www.w3.org\/2000\/svg" width="\d+" height="\d+" viewBox="0 0 \d+ \d+"/);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });

  it('escapes user text: a <script> label appears only escaped', () => {
    expect(svg).not.toContain('<script');
    expect(svg).toContain('&lt;script&gt;alert(&quot;x &amp; y&quot;)&lt;/script&gt;');
    expect(svg).toContain('x &lt;a&gt;');
    expect(svg).toContain('y&#39;s');
    expect(svg).toContain('min &quot;0&quot;');
  });

  it('has the same content as the canvas view: bands in map colours, axes, legend values, runs, known points', () => {
    const fills = [...svg.matchAll(/<path d="[^"]*" fill="(#[0-9a-f]{6})" fill-rule="evenodd"/g)].map((m) => m[1]);
    expect(fills).toEqual(colours.slice(0, fills.length));
    expect(fills.length).toBe(10);
    for (const label of legendModel(scale, thresholds, colours).ticks.map((t) => t.label)) expect(svg).toContain(`>${label}</text>`);
    expect(svg).toContain(`stroke="${runStyle(0).colour}"`);
    expect(svg).toContain(`stroke="${runStyle(1).colour}"`);
    expect(svg).toContain('momentum, lr = 0.1');
    expect(svg).toContain('data-kind="minimum"');
    expect(svg).toContain('rotate(-90)');
    expect(svg).toContain('fill="#d9d9d9"'); // missing colour under the bands
  });

  it('keeps band coordinates inside the frame', () => {
    const d = [...svg.matchAll(/<path d="([^"]*)" fill="#[0-9a-f]{6}" fill-rule/g)].map((m) => m[1]).join('');
    const nums = d.split(/[MLZ ]/).filter(Boolean).map(Number);
    expect(nums.every((v) => v >= 0 && v <= 320)).toBe(true);
  });

  it('works with nothing but a frame', () => {
    const bare = surfaceToSvg({ transform });
    expect(xmlProblems(bare)).toEqual([]);
  });
});

describe('escapeXml', () => {
  it('escapes markup characters and drops characters XML 1.0 forbids', () => {
    expect(escapeXml(`a<b>&"'`)).toBe('a&lt;b&gt;&amp;&quot;&#39;');
    expect(escapeXml('bell\u0007 tab\t')).toBe('bell tab\t');
    expect(escapeXml('lone \uD800 surrogate')).toBe('lone \uFFFD surrogate');
    expect(escapeXml('pair \uD83D\uDE00')).toBe('pair \uD83D\uDE00');
  });
});

describe('xmlProblems (the checker itself)', () => {
  it('finds unbalanced tags, bare < and raw &', () => {
    expect(xmlProblems('<svg><g></svg>')).not.toEqual([]);
    expect(xmlProblems('<svg><text>a < b</text></svg>')).toEqual(["bare '<' at 13"]);
    expect(xmlProblems('<svg><text>a & b</text></svg>')).toEqual(["unescaped '&' at 13"]);
    expect(xmlProblems('<svg/><svg/>')).toEqual(['2 root elements']);
    expect(xmlProblems('<svg><g a="1"/></svg>')).toEqual([]);
  });
});
