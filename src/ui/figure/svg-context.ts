/**
 * A drawing context that writes SVG: it implements the `DrawingContext` subset the plot functions use
 * (paths, rectangles, arcs, text, clipping, translate/rotate, dashes, alpha), so every figure is drawn
 * by the same code for PNG (a real canvas) and for SVG (this class), and the two cannot drift apart.
 *
 * Canvas semantics kept: path points are transformed by the current matrix when they are added (so the
 * SVG holds absolute coordinates), `clip()` intersects with the clip in force until the matching
 * `restore()` (one clipped <g> per clip), line widths and dashes scale with the matrix. Text keeps the
 * canvas font string as CSS `font`, `textAlign` becomes `text-anchor`, `textBaseline` becomes
 * `dominant-baseline`. Colours with alpha become fill-/stroke-opacity. `measureText` asks the measurer
 * given to the constructor (the page passes a canvas's own measurement, so text fits alike in both).
 * All text is XML-escaped (it is user-typed); coordinates are rounded to 0.01 px.
 */
import { color } from 'd3';
import { escapeXml } from '../plot/svg';
import type { DrawingContext } from '../plot';

/** Width in CSS pixels of `text` in the canvas font `font`. */
export type TextMeasure = (text: string, font: string) => number;

type Matrix = [number, number, number, number, number, number];

interface State {
  matrix: Matrix;
  fillStyle: string;
  strokeStyle: string;
  lineWidth: number;
  lineJoin: CanvasLineJoin;
  lineCap: CanvasLineCap;
  font: string;
  textAlign: CanvasTextAlign;
  textBaseline: CanvasTextBaseline;
  globalAlpha: number;
  dash: number[];
  /** Clipped groups opened since the matching save. */
  openGroups: number;
}

const ANCHOR: Record<CanvasTextAlign, string> = { left: 'start', start: 'start', center: 'middle', right: 'end', end: 'end' };
const BASELINE: Record<CanvasTextBaseline, string | null> = {
  alphabetic: null, top: 'text-before-edge', hanging: 'hanging', middle: 'central', bottom: 'text-after-edge', ideographic: 'ideographic',
};

export class SvgContext implements DrawingContext {
  fillStyle: string | CanvasGradient | CanvasPattern = '#000000';
  strokeStyle: string | CanvasGradient | CanvasPattern = '#000000';
  lineWidth = 1;
  lineJoin: CanvasLineJoin = 'miter';
  lineCap: CanvasLineCap = 'butt';
  font = '10px sans-serif';
  textAlign: CanvasTextAlign = 'start';
  textBaseline: CanvasTextBaseline = 'alphabetic';
  globalAlpha = 1;

  private matrix: Matrix = [1, 0, 0, 1, 0, 0];
  private dash: number[] = [];
  private openGroups = 0;
  private stack: State[] = [];
  private path = '';
  private pathStart: [number, number] | null = null;
  private current: [number, number] | null = null;
  private readonly body: string[] = [];
  private readonly defs: string[] = [];
  private clipCount = 0;

  constructor(
    readonly width: number,
    readonly height: number,
    private readonly measure: TextMeasure,
  ) {}

  // State.
  save(): void {
    this.stack.push({
      matrix: [...this.matrix], fillStyle: String(this.fillStyle), strokeStyle: String(this.strokeStyle), lineWidth: this.lineWidth, lineJoin: this.lineJoin,
      lineCap: this.lineCap, font: this.font, textAlign: this.textAlign, textBaseline: this.textBaseline, globalAlpha: this.globalAlpha, dash: [...this.dash], openGroups: this.openGroups,
    });
    this.openGroups = 0;
  }
  restore(): void {
    const s = this.stack.pop();
    if (!s) return; // as a canvas does: an unmatched restore is ignored
    for (; this.openGroups > 0; this.openGroups--) this.body.push('</g>');
    ({ matrix: this.matrix, fillStyle: this.fillStyle, strokeStyle: this.strokeStyle, lineWidth: this.lineWidth, lineJoin: this.lineJoin, lineCap: this.lineCap } = s);
    ({ font: this.font, textAlign: this.textAlign, textBaseline: this.textBaseline, globalAlpha: this.globalAlpha, dash: this.dash, openGroups: this.openGroups } = s);
  }
  translate(x: number, y: number): void {
    const [a, b, c, d, e, f] = this.matrix;
    this.matrix = [a, b, c, d, e + a * x + c * y, f + b * x + d * y];
  }
  rotate(angle: number): void {
    const [a, b, c, d, e, f] = this.matrix;
    const cos = Math.cos(angle);
    const sin = Math.sin(angle);
    this.matrix = [a * cos + c * sin, b * cos + d * sin, c * cos - a * sin, d * cos - b * sin, e, f];
  }
  /** Scales the drawing (not in DrawingContext, but handy for a figure drawn at another size). */
  scale(sx: number, sy: number): void {
    const [a, b, c, d, e, f] = this.matrix;
    this.matrix = [a * sx, b * sx, c * sy, d * sy, e, f];
  }
  setLineDash(segments: number[]): void {
    this.dash = segments.filter((v) => Number.isFinite(v) && v >= 0);
  }
  measureText(text: string): { width: number } {
    return { width: this.measure(text, this.font) };
  }

  // Paths.
  beginPath(): void {
    this.path = '';
    this.pathStart = null;
    this.current = null;
  }
  moveTo(x: number, y: number): void {
    const [px, py] = this.apply(x, y);
    this.path += `M${n(px)} ${n(py)}`;
    this.pathStart = this.current = [px, py];
  }
  lineTo(x: number, y: number): void {
    if (!this.current) return this.moveTo(x, y);
    const [px, py] = this.apply(x, y);
    this.path += `L${n(px)} ${n(py)}`;
    this.current = [px, py];
  }
  closePath(): void {
    if (!this.current) return;
    this.path += 'Z';
    this.current = this.pathStart;
  }
  rect(x: number, y: number, w: number, h: number): void {
    this.moveTo(x, y);
    this.lineTo(x + w, y);
    this.lineTo(x + w, y + h);
    this.lineTo(x, y + h);
    this.closePath();
  }
  arc(x: number, y: number, r: number, a0: number, a1: number, anticlockwise = false): void {
    const s = this.scaleFactor();
    const at = (t: number) => this.apply(x + r * Math.cos(t), y + r * Math.sin(t));
    let sweep = anticlockwise ? a0 - a1 : a1 - a0;
    const full = sweep >= 2 * Math.PI - 1e-12;
    if (!full) sweep = ((sweep % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
    const [sx, sy] = at(a0);
    if (this.current) this.path += `L${n(sx)} ${n(sy)}`;
    else this.path += `M${n(sx)} ${n(sy)}`;
    if (!this.pathStart) this.pathStart = [sx, sy];
    const flag = (anticlockwise ? 0 : 1) ^ (this.determinant() < 0 ? 1 : 0);
    const rr = n(r * s);
    if (full) {
      const [mx, my] = at(a0 + (anticlockwise ? -Math.PI : Math.PI));
      this.path += `A${rr} ${rr} 0 1 ${flag} ${n(mx)} ${n(my)}A${rr} ${rr} 0 1 ${flag} ${n(sx)} ${n(sy)}`;
      this.current = [sx, sy];
      return;
    }
    const [ex, ey] = at(anticlockwise ? a0 - sweep : a0 + sweep);
    this.path += `A${rr} ${rr} 0 ${sweep > Math.PI ? 1 : 0} ${flag} ${n(ex)} ${n(ey)}`;
    this.current = [ex, ey];
  }

  // Painting.
  fill(rule?: CanvasFillRule | Path2D): void {
    if (!this.path) return;
    const evenOdd = rule === 'evenodd' ? ' fill-rule="evenodd"' : '';
    this.body.push(`<path d="${this.path}"${this.paint('fill', this.fillStyle)}${evenOdd}/>`);
  }
  stroke(): void {
    if (!this.path) return;
    this.body.push(`<path d="${this.path}" fill="none"${this.strokeAttributes()}/>`);
  }
  clip(): void {
    const id = `fall-line-clip${++this.clipCount}`;
    this.defs.push(`<clipPath id="${id}"><path d="${this.path || 'M0 0'}"/></clipPath>`);
    this.body.push(`<g clip-path="url(#${id})">`);
    this.openGroups++;
  }
  fillRect(x: number, y: number, w: number, h: number): void {
    const saved = [this.path, this.pathStart, this.current] as const;
    this.beginPath();
    this.rect(x, y, w, h);
    this.fill();
    [this.path, this.pathStart, this.current] = saved as [string, [number, number] | null, [number, number] | null];
  }
  fillText(text: string, x: number, y: number): void {
    this.text(text, x, y, this.paint('fill', this.fillStyle));
  }
  strokeText(text: string, x: number, y: number): void {
    this.text(text, x, y, ` fill="none"${this.strokeAttributes()}`);
  }

  /** The finished standalone SVG document. */
  toSvg(title?: string): string {
    const w = n(this.width);
    const h = n(this.height);
    const head = [
      '<?xml version="1.0" encoding="UTF-8"?>',
      `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${h}" viewBox="0 0 ${w} ${h}">`,
    ];
    if (title) head.push(`<title>${escapeXml(title)}</title>`);
    if (this.defs.length) head.push(`<defs>${this.defs.join('')}</defs>`);
    const closing = '</g>'.repeat(this.openGroups + this.stack.reduce((k, s) => k + s.openGroups, 0));
    return [...head, ...this.body, closing, '</svg>'].filter(Boolean).join('\n') + '\n';
  }

  private text(text: string, x: number, y: number, paint: string): void {
    const [a, b, c, d, e, f] = this.matrix;
    const plain = a === 1 && b === 0 && c === 0 && d === 1;
    const place = plain ? `x="${n(x + e)}" y="${n(y + f)}"` : `x="${n(x)}" y="${n(y)}" transform="matrix(${[a, b, c, d, e, f].map(n6).join(' ')})"`;
    const anchor = ANCHOR[this.textAlign] === 'start' ? '' : ` text-anchor="${ANCHOR[this.textAlign]}"`;
    const baseline = BASELINE[this.textBaseline] ? ` dominant-baseline="${BASELINE[this.textBaseline]}"` : '';
    this.body.push(`<text ${place} style="font: ${escapeXml(this.font)}"${anchor}${baseline}${paint}>${escapeXml(text)}</text>`);
  }

  private strokeAttributes(): string {
    const s = this.scaleFactor();
    const dash = this.dash.length ? ` stroke-dasharray="${this.dash.map((v) => n(v * s)).join(' ')}"` : '';
    const join = this.lineJoin === 'miter' ? '' : ` stroke-linejoin="${this.lineJoin}"`;
    const cap = this.lineCap === 'butt' ? '' : ` stroke-linecap="${this.lineCap}"`;
    return `${this.paint('stroke', this.strokeStyle)} stroke-width="${n(this.lineWidth * s)}"${join}${cap}${dash}`;
  }

  /** ` fill="rgb(...)" fill-opacity="..."` for a CSS colour, the alpha folded with globalAlpha. */
  private paint(kind: 'fill' | 'stroke', style: string | CanvasGradient | CanvasPattern): string {
    const parsed = color(String(style));
    if (!parsed) return ` ${kind}="#000000"`;
    const rgb = parsed.rgb();
    const opacity = rgb.opacity * this.globalAlpha;
    const hex = rgb.copy({ opacity: 1 }).formatHex();
    return ` ${kind}="${hex}"${opacity < 1 ? ` ${kind}-opacity="${n6(opacity)}"` : ''}`;
  }

  private apply(x: number, y: number): [number, number] {
    const [a, b, c, d, e, f] = this.matrix;
    return [a * x + c * y + e, b * x + d * y + f];
  }
  private determinant(): number {
    const [a, b, c, d] = this.matrix;
    return a * d - b * c;
  }
  private scaleFactor(): number {
    return Math.sqrt(Math.abs(this.determinant()));
  }
}

/** A coordinate rounded to 0.01 (no "-0"). */
function n(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}

function n6(v: number): string {
  const r = Number(v.toFixed(6));
  return Object.is(r, -0) ? '0' : String(r);
}
