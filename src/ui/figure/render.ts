/**
 * A figure as a file: PNG (a canvas of size x ratio device pixels, drawn at CSS size under a scale)
 * or SVG (the same drawing on an SvgContext, text measured by a canvas so it fits alike). Also the
 * checks of the size and pixel ratio the user types, each message naming its field.
 */
import type { PixelSize } from '../plot';
import { drawFigure, type Figure, type FigureContext } from './compose';
import { SvgContext, type TextMeasure } from './svg-context';

export const PIXEL_RATIOS = [1, 2, 3] as const;
export type PixelRatio = (typeof PIXEL_RATIOS)[number];
export const FIGURE_LIMITS = { min: 200, max: 4000 } as const;

/** The width or height typed into a figure's size field, or the message saying what is wrong with it. */
export function parseFigureSide(name: 'width' | 'height', text: string): { value: number } | { error: string } {
  const t = text.trim();
  const value = Number(t);
  if (!/^\d+$/.test(t) || !Number.isSafeInteger(value)) return { error: `${name}: "${t}" is not a whole number of pixels` };
  if (value < FIGURE_LIMITS.min || value > FIGURE_LIMITS.max) return { error: `${name}: from ${FIGURE_LIMITS.min} to ${FIGURE_LIMITS.max} pixels, got ${value}` };
  return { value };
}

/** Most device pixels a PNG may have (a canvas this large already needs 256 MB). */
export const PNG_MAX_PIXELS = 64e6;

/** A message when the PNG of `size` at `ratio` would be too large to draw, else null. */
export function pngSizeProblem(size: PixelSize, ratio: PixelRatio): string | null {
  const pixels = size.width * size.height * ratio * ratio;
  return pixels > PNG_MAX_PIXELS ? `PNG pixel ratio: ${size.width} x ${size.height} at ${ratio} would be ${(pixels / 1e6).toFixed(0)} megapixels, at most ${PNG_MAX_PIXELS / 1e6}` : null;
}

export function figurePng(figure: Figure, size: PixelSize, ratio: PixelRatio): Promise<Blob> {
  const problem = pngSizeProblem(size, ratio);
  if (problem) return Promise.reject(new Error(problem));
  const canvas = document.createElement('canvas');
  canvas.width = Math.round(size.width * ratio);
  canvas.height = Math.round(size.height * ratio);
  const ctx = canvas.getContext('2d');
  if (!ctx) return Promise.reject(new Error('the browser gave no 2-D canvas for the PNG'));
  ctx.scale(ratio, ratio);
  drawFigure(ctx as FigureContext, figure, size);
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('the browser could not encode the PNG'))), 'image/png'));
}

export function figureSvg(figure: Figure, size: PixelSize, measure: TextMeasure = canvasMeasure()): string {
  const ctx = new SvgContext(size.width, size.height, measure);
  drawFigure(ctx, figure, size);
  return ctx.toSvg(figure.title);
}

/** Text widths as a canvas measures them. */
export function canvasMeasure(): TextMeasure {
  const ctx = document.createElement('canvas').getContext('2d');
  if (!ctx) return (text, font) => approximateWidth(text, font);
  return (text, font) => {
    ctx.font = font;
    return ctx.measureText(text).width;
  };
}

/** Where no canvas exists (unit tests): 0.6 em per character, the font size read from the font string. */
export function approximateWidth(text: string, font: string): number {
  const px = Number(/(\d+(?:\.\d+)?)px/.exec(font)?.[1] ?? 10);
  return Array.from(text).length * px * 0.6;
}
