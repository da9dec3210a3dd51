/**
 * Standalone SVG export of a plot: the same content as the canvas view (filled contour bands, arrows,
 * trajectories with their markers, known points, axes, the colour legend, a key of the runs and a
 * title), built from the same kernels (contour rings, axesModel, legendModel, trajectoryPath,
 * markerGeometry) so the two cannot drift apart.
 *
 * Layout: the plot frame has the view transform's size; the axes sit in AXES_MARGIN around it; a right
 * column holds the legend bar and, below it, one key entry per trajectory. All text (titles, axis
 * names, run labels, point labels) is user-typed, so it is XML-escaped and stripped of characters XML
 * 1.0 forbids. Coordinates are rounded to 0.01 px.
 */
import { AXES_MARGIN, axesModel, axisTitlePositions, type AxisLabels } from './axes';
import type { Arrow } from './arrows';
import { arrowSegments, ARROW_DEFAULTS } from './arrows';
import { PLOT_STYLE } from './context';
import type { ContourBand } from './contours';
import type { GridBox } from '../../engine';
import type { LegendModel } from './legend';
import { knownPointGlyph, KNOWN_POINT_DEFAULTS, markerGeometry, type KnownPoint } from './markers';
import type { RunStyle } from './run-style';
import type { PixelPoint, ViewTransform } from './scales';
import { markerPaint, trajectoryPath, TRAJECTORY_DEFAULTS, type TrajectoryOptions } from './trajectory';

export interface SvgTrajectory {
  points: Float64Array;
  count: number;
  style: RunStyle;
  label: string;
  options?: TrajectoryOptions;
}

export interface SvgScene {
  /** The view and the plot frame size. */
  transform: ViewTransform;
  title?: string;
  bands?: readonly ContourBand[];
  colours?: readonly string[];
  /** The sampled grid; with it the grid rectangle is painted with `missing` under the bands. */
  grid?: GridBox;
  missing?: string | null;
  axes?: AxisLabels;
  legend?: { model: LegendModel; title?: string };
  trajectories?: readonly SvgTrajectory[];
  knownPoints?: readonly KnownPoint[];
  knownPointLabels?: boolean;
  arrows?: readonly Arrow[];
  background?: string;
}

const TITLE_BAND = 34;
const RIGHT_COLUMN = 170;
const KEY_ROW = 18;
const KEY_LABEL_MAX = 28;

export function surfaceToSvg(scene: SvgScene): string {
  const { transform } = scene;
  const { width, height } = transform.size;
  const trajectories = scene.trajectories ?? [];
  const hasColumn = Boolean(scene.legend) || trajectories.length > 0;
  const left = scene.axes ? AXES_MARGIN.left : 8;
  const top = scene.title ? TITLE_BAND : AXES_MARGIN.top;
  const bottom = scene.axes ? AXES_MARGIN.bottom : 8;
  const right = hasColumn ? RIGHT_COLUMN : AXES_MARGIN.right;

  const legendTop = 16;
  const legendHeight = scene.legend ? (trajectories.length ? Math.max(100, Math.min(height - legendTop, height * 0.55)) : height - legendTop) : 0;
  const keyTop = scene.legend ? legendTop + legendHeight + 28 : 8;
  const keyBottom = keyTop + trajectories.length * KEY_ROW;
  const totalWidth = left + width + right;
  const totalHeight = top + Math.max(height + bottom, keyBottom + 8);

  const out: string[] = [];
  out.push('<?xml version="1.0" encoding="UTF-8"?>');
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${n(totalWidth)}" height="${n(totalHeight)}" viewBox="0 0 ${n(totalWidth)} ${n(totalHeight)}" font-family="${attr(PLOT_STYLE.fontFamily)}" font-size="${PLOT_STYLE.tickFontSize}">`,
  );
  if (scene.title) out.push(`<title>${escapeXml(scene.title)}</title>`);
  out.push(`<rect x="0" y="0" width="${n(totalWidth)}" height="${n(totalHeight)}" fill="${attr(scene.background ?? '#ffffff')}"/>`);
  if (scene.title)
    out.push(`<text x="${n(left)}" y="${n(TITLE_BAND - 12)}" font-size="${PLOT_STYLE.titleFontSize + 2}" font-weight="bold" fill="${PLOT_STYLE.textColour}">${escapeXml(scene.title)}</text>`);
  out.push(`<defs><clipPath id="fall-line-plot-frame"><rect x="0" y="0" width="${n(width)}" height="${n(height)}"/></clipPath></defs>`);
  out.push(`<g transform="translate(${n(left)},${n(top)})">`);
  out.push('<g clip-path="url(#fall-line-plot-frame)">');
  bandsSvg(out, scene);
  if (scene.arrows?.length) arrowsSvg(out, scene.arrows, transform);
  for (const t of trajectories) trajectorySvg(out, t, transform);
  if (scene.knownPoints?.length) knownPointsSvg(out, scene.knownPoints, transform, scene.knownPointLabels ?? false);
  out.push('</g>');
  if (scene.axes) axesSvg(out, transform, scene.axes);
  else out.push(`<rect x="0" y="0" width="${n(width)}" height="${n(height)}" fill="none" stroke="${PLOT_STYLE.frameColour}"/>`);
  if (scene.legend) legendSvg(out, scene.legend.model, { px: width + 24, py: legendTop, width: 14, height: legendHeight }, scene.legend.title);
  trajectories.forEach((t, k) => keySvg(out, t, { px: width + 24, py: keyTop + k * KEY_ROW }));
  out.push('</g>');
  out.push('</svg>');
  return out.join('\n') + '\n';
}

function bandsSvg(out: string[], scene: SvgScene): void {
  const { transform } = scene;
  const missing = scene.missing === undefined ? PLOT_STYLE.missingColour : scene.missing;
  if (scene.grid && missing) {
    const g = scene.grid;
    const x0 = transform.pxOfA(g.a[0]);
    const y0 = transform.pyOfB(g.b[1]);
    out.push(`<rect x="${n(x0)}" y="${n(y0)}" width="${n(transform.pxOfA(g.a[1]) - x0)}" height="${n(transform.pyOfB(g.b[0]) - y0)}" fill="${attr(missing)}"/>`);
  }
  const bands = scene.bands ?? [];
  const colours = scene.colours ?? [];
  if (colours.length < bands.length) throw new Error(`svg: ${bands.length} bands need ${bands.length} colours, got ${colours.length}`);
  for (const band of bands) {
    if (!band.polygons.length) continue;
    const d: string[] = [];
    for (const polygon of band.polygons)
      for (const { ab } of polygon) {
        const count = ab.length / 2;
        if (count < 3) continue;
        let s = `M${n(transform.pxOfA(ab[0]))} ${n(transform.pyOfB(ab[1]))}`;
        for (let k = 1; k < count; k++) s += `L${n(transform.pxOfA(ab[2 * k]))} ${n(transform.pyOfB(ab[2 * k + 1]))}`;
        d.push(s + 'Z');
      }
    if (d.length) out.push(`<path d="${d.join('')}" fill="${attr(colours[band.level] ?? colours[colours.length - 1])}" fill-rule="evenodd" data-threshold="${band.threshold}"/>`);
  }
}

function arrowsSvg(out: string[], arrows: readonly Arrow[], transform: ViewTransform): void {
  let d = '';
  for (const arrow of arrows) for (const [x1, y1, x2, y2] of arrowSegments(arrow, transform)) d += `M${n(x1)} ${n(y1)}L${n(x2)} ${n(y2)}`;
  if (!d) return;
  out.push(`<path d="${d}" fill="none" stroke="${ARROW_DEFAULTS.halo}" stroke-width="${ARROW_DEFAULTS.width + 1.6}" stroke-linecap="round"/>`);
  out.push(`<path d="${d}" fill="none" stroke="${ARROW_DEFAULTS.colour}" stroke-width="${ARROW_DEFAULTS.width}" stroke-linecap="round"/>`);
}

function trajectorySvg(out: string[], t: SvgTrajectory, transform: ViewTransform): void {
  const path = trajectoryPath(t.points, t.count, transform, t.options);
  const width = t.options?.lineWidth ?? TRAJECTORY_DEFAULTS.lineWidth;
  const markerSize = t.options?.markerSize ?? TRAJECTORY_DEFAULTS.markerSize;
  out.push(`<g data-run="${attr(t.label)}">`);
  let d = '';
  for (const { pxpy } of path.polylines) {
    d += `M${n(pxpy[0])} ${n(pxpy[1])}`;
    for (let k = 2; k < pxpy.length; k += 2) d += `L${n(pxpy[k])} ${n(pxpy[k + 1])}`;
  }
  if (d) {
    out.push(`<path d="${d}" fill="none" stroke="${attr(t.style.halo)}" stroke-width="${width + 2.5}" stroke-linejoin="round" stroke-linecap="round"/>`);
    out.push(`<path d="${d}" fill="none" stroke="${attr(t.style.colour)}" stroke-width="${width}" stroke-linejoin="round" stroke-linecap="round"/>`);
  }
  for (const m of path.markers) {
    const paint = markerPaint(m.kind, t.style, markerSize);
    out.push(markerSvg(t.style.marker, m.at, paint.size, paint.fill, paint.outline, paint.outlineWidth));
  }
  out.push('</g>');
}

function markerSvg(shape: RunStyle['marker'], at: PixelPoint, size: number, fill: string, outline: string, outlineWidth: number): string {
  const g = markerGeometry(shape, size);
  const paint = `fill="${attr(fill)}" stroke="${attr(outline)}" stroke-width="${outlineWidth}" stroke-linejoin="round"`;
  if (g.kind === 'circle') return `<circle cx="${n(at.px)}" cy="${n(at.py)}" r="${n(g.r)}" ${paint}/>`;
  return `<polygon points="${g.points.map((q) => `${n(at.px + q.px)},${n(at.py + q.py)}`).join(' ')}" ${paint}/>`;
}

function knownPointsSvg(out: string[], points: readonly KnownPoint[], transform: ViewTransform, labels: boolean): void {
  const size = KNOWN_POINT_DEFAULTS.size;
  for (const point of points) {
    const at = transform.toPixel(point.at);
    if (!(Number.isFinite(at.px) && Number.isFinite(at.py))) continue;
    out.push(`<g data-kind="${point.kind}">`);
    const parts = knownPointGlyph(point.kind, size);
    for (const [stroke, w] of [[KNOWN_POINT_DEFAULTS.halo, 3.5], [KNOWN_POINT_DEFAULTS.colour, 1.5]] as const)
      for (const part of parts) {
        const paint = `stroke="${stroke}" stroke-width="${w}" stroke-linecap="round" stroke-linejoin="round"`;
        if (part.kind === 'circle') out.push(`<circle cx="${n(at.px)}" cy="${n(at.py)}" r="${n(part.r)}" fill="${part.filled ? stroke : 'none'}" ${paint}/>`);
        else {
          const pts = part.points.map((q) => `${n(at.px + q.px)},${n(at.py + q.py)}`).join(' ');
          out.push(`<${part.closed ? 'polygon' : 'polyline'} points="${pts}" fill="none" ${paint}/>`);
        }
      }
    if (labels && point.label)
      out.push(
        `<text x="${n(at.px + size * 0.7)}" y="${n(at.py - size * 0.4)}" fill="${KNOWN_POINT_DEFAULTS.colour}" stroke="${KNOWN_POINT_DEFAULTS.halo}" stroke-width="3" paint-order="stroke">${escapeXml(point.label)}</text>`,
      );
    out.push('</g>');
  }
}

function axesSvg(out: string[], transform: ViewTransform, labels: AxisLabels): void {
  const model = axesModel(transform, labels);
  const { width, height } = model;
  const tl = PLOT_STYLE.tickLength;
  const fs = PLOT_STYLE.tickFontSize;
  let d = '';
  for (const t of model.aTicks) d += `M${n(t.px)} ${n(height)}V${n(height + tl)}`;
  for (const t of model.bTicks) d += `M0 ${n(t.py)}H${n(-tl)}`;
  out.push(`<g class="axes" fill="${PLOT_STYLE.textColour}">`);
  out.push(`<rect x="0" y="0" width="${n(width)}" height="${n(height)}" fill="none" stroke="${PLOT_STYLE.frameColour}"/>`);
  if (d) out.push(`<path d="${d}" stroke="${PLOT_STYLE.frameColour}" fill="none"/>`);
  for (const t of model.aTicks) out.push(`<text x="${n(t.px)}" y="${n(height + tl + 2 + fs * 0.85)}" text-anchor="middle">${escapeXml(t.label)}</text>`);
  for (const t of model.bTicks) out.push(`<text x="${n(-tl - 3)}" y="${n(t.py + fs * 0.35)}" text-anchor="end">${escapeXml(t.label)}</text>`);
  const titles = axisTitlePositions(model);
  const ts = PLOT_STYLE.titleFontSize;
  out.push(`<text x="${n(titles.a.px)}" y="${n(titles.a.py - ts * 0.2)}" text-anchor="middle" font-size="${ts}">${escapeXml(labels.a)}</text>`);
  out.push(`<text transform="translate(${n(titles.b.px + ts * 0.85)},${n(titles.b.py)}) rotate(-90)" text-anchor="middle" font-size="${ts}">${escapeXml(labels.b)}</text>`);
  out.push('</g>');
}

function legendSvg(out: string[], model: LegendModel, rect: { px: number; py: number; width: number; height: number }, title?: string): void {
  const yOf = (u: number) => rect.py + rect.height * (1 - u);
  out.push('<g class="legend">');
  for (const band of model.bands) {
    if (!(band.to > band.from)) continue;
    const y = yOf(band.to);
    out.push(`<rect x="${n(rect.px)}" y="${n(y)}" width="${n(rect.width)}" height="${n(yOf(band.from) - y)}" fill="${attr(band.colour)}"/>`);
  }
  out.push(`<rect x="${n(rect.px)}" y="${n(rect.py)}" width="${n(rect.width)}" height="${n(rect.height)}" fill="none" stroke="${PLOT_STYLE.frameColour}"/>`);
  const x = rect.px + rect.width;
  for (const t of model.ticks) {
    const y = yOf(t.position);
    out.push(`<path d="M${n(x)} ${n(y)}H${n(x + PLOT_STYLE.tickLength)}" stroke="${PLOT_STYLE.frameColour}"/>`);
    out.push(`<text x="${n(x + PLOT_STYLE.tickLength + 3)}" y="${n(y + PLOT_STYLE.tickFontSize * 0.35)}" fill="${PLOT_STYLE.textColour}">${escapeXml(t.label)}</text>`);
  }
  if (title) out.push(`<text x="${n(rect.px)}" y="${n(rect.py - 6)}" fill="${PLOT_STYLE.textColour}">${escapeXml(title)}</text>`);
  out.push('</g>');
}

function keySvg(out: string[], t: SvgTrajectory, at: PixelPoint): void {
  const label = t.label.length > KEY_LABEL_MAX ? t.label.slice(0, KEY_LABEL_MAX - 1) + '\u2026' : t.label;
  out.push('<g class="key">');
  out.push(`<path d="M${n(at.px - 4)} ${n(at.py)}H${n(at.px + 18)}" stroke="${attr(t.style.colour)}" stroke-width="2"/>`);
  out.push(markerSvg(t.style.marker, { px: at.px + 7, py: at.py }, 8, t.style.colour, t.style.halo, 1));
  out.push(`<text x="${n(at.px + 24)}" y="${n(at.py + PLOT_STYLE.tickFontSize * 0.35)}" fill="${PLOT_STYLE.textColour}">${escapeXml(label)}</text>`);
  out.push('</g>');
}

/** Escapes text for XML content and attribute values; drops characters XML 1.0 does not allow. */
export function escapeXml(text: string): string {
  return text
    .replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '')
    .replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, '\uFFFD')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const attr = escapeXml;

/** A coordinate rounded to 0.01 (no "-0", no exponent for the sizes that occur here). */
function n(v: number): string {
  const r = Math.round(v * 100) / 100;
  return Object.is(r, -0) ? '0' : String(r);
}
