import { describe, expect, it } from 'vitest';
import { SvgContext } from '../../../src/ui/figure/svg-context';
import { drawFigure } from '../../../src/ui/figure/compose';
import { approximateWidth } from '../../../src/ui/figure/render';
import { drawLegend, legendModel, levelThresholds, bandColours, runStyle, valueScale } from '../../../src/ui/plot';
import { xmlProblems } from '../plot/xml-check';

const ctxOf = () => new SvgContext(200, 100, approximateWidth);
const paths = (svg: string) => [...svg.matchAll(/<path d="([^"]*)"([^>]*)\/>/g)].map((m) => ({ d: m[1], attrs: m[2] }));

describe('SvgContext', () => {
  it('applies translate and rotate to path points as a canvas does', () => {
    // HTML canvas transform rules: translate(10, 20) then rotate(pi/2) maps (1, 0) to (10, 21) and (0, 1) to (9, 20).
    const ctx = ctxOf();
    ctx.translate(10, 20);
    ctx.rotate(Math.PI / 2);
    ctx.beginPath();
    ctx.moveTo(1, 0);
    ctx.lineTo(0, 1);
    ctx.stroke();
    expect(paths(ctx.toSvg())[0].d).toBe('M10 21L9 20');
  });

  it('scales line widths and dashes with the transform and maps colours with alpha to opacity', () => {
    const ctx = ctxOf();
    ctx.scale(2, 2);
    ctx.strokeStyle = 'rgba(255, 0, 0, 0.5)';
    ctx.lineWidth = 1.5;
    ctx.setLineDash([4, 2]);
    ctx.globalAlpha = 0.5;
    ctx.beginPath();
    ctx.moveTo(0, 0);
    ctx.lineTo(5, 0);
    ctx.stroke();
    const p = paths(ctx.toSvg())[0];
    expect(p.d).toBe('M0 0L10 0');
    expect(p.attrs).toContain('stroke="#ff0000" stroke-opacity="0.25"');
    expect(p.attrs).toContain('stroke-width="3"');
    expect(p.attrs).toContain('stroke-dasharray="8 4"');
  });

  it('restores state on restore and keeps each clip in a group closed by the matching restore', () => {
    const ctx = ctxOf();
    ctx.save();
    ctx.translate(5, 5);
    ctx.beginPath();
    ctx.rect(0, 0, 10, 10);
    ctx.clip();
    ctx.fillStyle = '#00ff00';
    ctx.fillRect(0, 0, 20, 20);
    ctx.restore();
    ctx.fillRect(0, 0, 1, 1); // back at the identity, black, outside the clip
    const svg = ctx.toSvg();
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain('<clipPath id="fall-line-clip1"><path d="M5 5L15 5L15 15L5 15Z"/></clipPath>');
    const groupEnd = svg.indexOf('</g>');
    expect(svg.indexOf('M5 5L25 5L25 25L5 25Z')).toBeLessThan(groupEnd);
    expect(svg.indexOf('M0 0L1 0L1 1L0 1Z" fill="#000000"')).toBeGreaterThan(groupEnd);
  });

  it('writes a full circle as two half arcs and a quarter arc with the small-arc flag', () => {
    const ctx = ctxOf();
    ctx.beginPath();
    ctx.arc(50, 50, 10, 0, 2 * Math.PI);
    ctx.fill();
    ctx.beginPath();
    ctx.arc(0, 0, 10, 0, Math.PI / 2);
    ctx.stroke();
    const [circle, quarter] = paths(ctx.toSvg());
    expect(circle.d).toBe('M60 50A10 10 0 1 1 40 50A10 10 0 1 1 60 50');
    // Canvas angles run clockwise on screen (y down): from (10, 0) a quarter turn reaches (0, 10).
    expect(quarter.d).toBe('M10 0A10 10 0 0 1 0 10');
  });

  it('escapes text, carries the font, the alignment and the baseline, and turns rotated text with a matrix', () => {
    const ctx = ctxOf();
    ctx.font = '12px "Segoe UI", sans-serif';
    ctx.textAlign = 'center';
    ctx.textBaseline = 'middle';
    ctx.fillText('<a & b>', 20, 30);
    ctx.translate(10, 50);
    ctx.rotate(-Math.PI / 2);
    ctx.fillText('loss', 0, 0);
    const svg = ctx.toSvg('title "quoted"');
    expect(xmlProblems(svg)).toEqual([]);
    expect(svg).toContain('<title>title &quot;quoted&quot;</title>');
    expect(svg).toContain('<text x="20" y="30" style="font: 12px &quot;Segoe UI&quot;, sans-serif" text-anchor="middle" dominant-baseline="central" fill="#000000">&lt;a &amp; b&gt;</text>');
    expect(svg).toContain('transform="matrix(0 -1 1 0 10 50)"');
  });

  it('measures text with the measurer it was given', () => {
    const ctx = new SvgContext(10, 10, (text, font) => text.length * (font.startsWith('bold') ? 2 : 1));
    ctx.font = 'bold 10px x';
    expect(ctx.measureText('abcd').width).toBe(8);
  });
});

describe('drawFigure on an SvgContext', () => {
  it('draws the title, the key labels and the body, and balances every group', () => {
    const scale = valueScale(0, 100, 'log');
    const thresholds = levelThresholds(0, 100, 8);
    const colours = bandColours(thresholds, scale);
    const model = legendModel(scale, thresholds, colours);
    const ctx = new SvgContext(640, 360, approximateWidth);
    const layout = drawFigure(ctx, {
      title: 'Bowl & basin',
      key: [{ kind: 'run', style: runStyle(0), label: 'Plain descent' }, { kind: 'known', point: 'minimum', label: 'known minimum' }, { kind: 'line', colour: '#0072b2', dash: [5, 3], label: 'median' }],
      drawBody: (c, size) => drawLegend(c, model, { px: 10, py: 20, width: 14, height: size.height - 40 }, 'loss'),
    }, { width: 640, height: 360 });
    const svg = ctx.toSvg('Bowl & basin');
    expect(xmlProblems(svg)).toEqual([]);
    const texts = [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    expect(texts).toEqual(expect.arrayContaining(['Bowl &amp; basin', 'Plain descent', 'known minimum', 'median', 'loss', ...model.ticks.map((t) => t.label)]));
    expect(layout.key.placement).toBe('right');
    // The body is clipped to its rectangle, offset by the figure's pad and title band.
    expect(svg).toContain(`<clipPath id="fall-line-clip1"><path d="M${layout.body.x} ${layout.body.y}L`);
    expect(svg).toContain('stroke-dasharray="5 3"');
  });
});
