import type { DrawingContext } from '../../../src/ui/plot';

/** One recorded call with the paint state at the moment of the call. */
export interface Call {
  op: string;
  args: unknown[];
  fillStyle: string;
  strokeStyle: string;
  lineWidth: number;
}

/**
 * A fake 2-D context that logs every call (no DOM in the node test environment). It keeps the paint
 * state with a save/restore stack like a real context, and collects the points of the current path so
 * tests can assert on the geometry of each fill and stroke.
 */
export class RecordingContext implements DrawingContext {
  calls: Call[] = [];
  /** Each fill or stroke with the sub-paths (lists of [x, y]) it painted. */
  paints: { op: 'fill' | 'stroke'; colour: string; lineWidth: number; subpaths: [number, number][][]; rule?: string }[] = [];
  texts: { text: string; x: number; y: number; colour: string }[] = [];
  depth = 0;
  maxDepth = 0;

  fillStyle: string | CanvasGradient | CanvasPattern = '#000000';
  strokeStyle: string | CanvasGradient | CanvasPattern = '#000000';
  lineWidth = 1;
  lineJoin: CanvasLineJoin = 'miter';
  lineCap: CanvasLineCap = 'butt';
  font = '10px sans-serif';
  textAlign: CanvasTextAlign = 'start';
  textBaseline: CanvasTextBaseline = 'alphabetic';
  globalAlpha = 1;

  private stack: unknown[][] = [];
  private subpaths: [number, number][][] = [];

  private log(op: string, args: unknown[]): void {
    this.calls.push({ op, args, fillStyle: String(this.fillStyle), strokeStyle: String(this.strokeStyle), lineWidth: this.lineWidth });
  }

  save(): void {
    this.log('save', []);
    this.stack.push([this.fillStyle, this.strokeStyle, this.lineWidth, this.lineJoin, this.lineCap, this.font, this.textAlign, this.textBaseline, this.globalAlpha]);
    this.depth++;
    this.maxDepth = Math.max(this.maxDepth, this.depth);
  }
  restore(): void {
    this.log('restore', []);
    const s = this.stack.pop();
    if (!s) throw new Error('restore without save');
    [this.fillStyle, this.strokeStyle, this.lineWidth, this.lineJoin, this.lineCap, this.font, this.textAlign, this.textBaseline, this.globalAlpha] = s as never[];
    this.depth--;
  }
  beginPath(): void {
    this.log('beginPath', []);
    this.subpaths = [];
  }
  closePath(): void {
    this.log('closePath', []);
  }
  moveTo(x: number, y: number): void {
    this.log('moveTo', [x, y]);
    this.subpaths.push([[x, y]]);
  }
  lineTo(x: number, y: number): void {
    this.log('lineTo', [x, y]);
    if (!this.subpaths.length) this.subpaths.push([]);
    this.subpaths[this.subpaths.length - 1].push([x, y]);
  }
  arc(x: number, y: number, r: number, a0: number, a1: number): void {
    this.log('arc', [x, y, r, a0, a1]);
    if (!this.subpaths.length) this.subpaths.push([]);
    this.subpaths[this.subpaths.length - 1].push([x + r, y], [x, y - r], [x - r, y], [x, y + r]);
  }
  rect(x: number, y: number, w: number, h: number): void {
    this.log('rect', [x, y, w, h]);
    this.subpaths.push([[x, y], [x + w, y], [x + w, y + h], [x, y + h]]);
  }
  fill(rule?: CanvasFillRule | Path2D): void {
    this.log('fill', rule === undefined ? [] : [rule]);
    this.paints.push({ op: 'fill', colour: String(this.fillStyle), lineWidth: this.lineWidth, subpaths: this.subpaths.map((s) => s.slice()), rule: typeof rule === 'string' ? rule : undefined });
  }
  stroke(): void {
    this.log('stroke', []);
    this.paints.push({ op: 'stroke', colour: String(this.strokeStyle), lineWidth: this.lineWidth, subpaths: this.subpaths.map((s) => s.slice()) });
  }
  clip(): void {
    this.log('clip', []);
  }
  fillRect(x: number, y: number, w: number, h: number): void {
    this.log('fillRect', [x, y, w, h]);
    this.paints.push({ op: 'fill', colour: String(this.fillStyle), lineWidth: this.lineWidth, subpaths: [[[x, y], [x + w, y], [x + w, y + h], [x, y + h]]] });
  }
  fillText(text: string, x: number, y: number): void {
    this.log('fillText', [text, x, y]);
    this.texts.push({ text, x, y, colour: String(this.fillStyle) });
  }
  strokeText(text: string, x: number, y: number): void {
    this.log('strokeText', [text, x, y]);
  }
  translate(x: number, y: number): void {
    this.log('translate', [x, y]);
  }
  rotate(angle: number): void {
    this.log('rotate', [angle]);
  }
  setLineDash(segments: number[]): void {
    this.log('setLineDash', [segments]);
  }
}
