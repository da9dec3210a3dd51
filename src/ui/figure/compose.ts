/**
 * The figure composer: a `Figure` is a view's export as data (title, key entries) plus a function
 * that draws the view's body into a rectangle; `drawFigure` lays the parts out (figure-layout.ts) and
 * draws them on any drawing context, a canvas for PNG or an SvgContext for SVG.
 */
import { canvasFont, PLOT_STYLE, type DrawingContext, type PixelSize } from '../plot';
import { layoutFigure, type FigureLayout } from './figure-layout';
import { drawKeyEntry, KEY_FONT, KEY_ROW_HEIGHT, type KeyEntry } from './key';

/** A drawing context that can also measure text (both a canvas context and SvgContext are). */
export type FigureContext = DrawingContext & { measureText(text: string): { width: number } };

export interface Figure {
  /** Shown on top, wrapped or shortened to the width; also the SVG's <title>. */
  title: string;
  key: KeyEntry[];
  keyHeading?: string;
  keyPlacement?: 'auto' | 'below';
  /** Draws the view in a `size` box whose top-left corner is the context's origin (clipped to it). */
  drawBody(ctx: FigureContext, size: PixelSize): void;
}

export const TITLE_FONT = canvasFont(PLOT_STYLE.titleFontSize + 1, 'bold');
export const KEY_HEADING_FONT = canvasFont(PLOT_STYLE.tickFontSize + 1, 'bold');

/** Lays out and draws the figure over a white background; returns the layout it used. */
export function drawFigure(ctx: FigureContext, figure: Figure, size: PixelSize): FigureLayout {
  const widthIn = (font: string) => (text: string) => {
    ctx.font = font;
    return ctx.measureText(text).width;
  };
  ctx.save();
  const layout = layoutFigure(size, figure, { title: widthIn(TITLE_FONT), key: widthIn(KEY_FONT), heading: widthIn(KEY_HEADING_FONT) });
  ctx.fillStyle = '#ffffff';
  ctx.fillRect(0, 0, size.width, size.height);

  ctx.fillStyle = PLOT_STYLE.textColour;
  ctx.font = TITLE_FONT;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'alphabetic';
  layout.title.lines.forEach((line, k) => ctx.fillText(line, layout.title.x, layout.title.firstBaseline + k * layout.title.lineHeight));

  const { body } = layout;
  if (body.width > 0 && body.height > 0) {
    ctx.save();
    ctx.translate(body.x, body.y);
    ctx.beginPath();
    ctx.rect(0, 0, body.width, body.height);
    ctx.clip();
    figure.drawBody(ctx, { width: body.width, height: body.height });
    ctx.restore();
  }

  const { key } = layout;
  if (key.heading) {
    ctx.font = KEY_HEADING_FONT;
    ctx.fillStyle = PLOT_STYLE.textColour;
    ctx.textBaseline = 'middle';
    ctx.fillText(key.heading, key.rect.x + (key.placement === 'right' ? 5 : 0), key.rect.y + KEY_ROW_HEIGHT / 2);
  }
  for (const e of key.entries) drawKeyEntry(ctx, e.entry, e.label, e.x, e.y);
  ctx.restore();
  return layout;
}
