/**
 * Where the parts of an exported figure go, as plain data: a title band on top (wrapped to at most
 * two lines, the second ending in an ellipsis when the title is longer); the key in a column to the
 * right when the body keeps most of the width and the figure does not ask for it below, else in rows
 * below the body; the body (the view's own drawing) in the rest. Every part lies inside the figure
 * and no two overlap; key labels are shortened to KEY_LABEL_MAX (a text-only note to the width), and
 * entries that do not fit are replaced by "and N more".
 */
import type { PixelSize } from '../plot';
import { KEY_GLYPH_WIDTH, KEY_ROW_HEIGHT, type KeyEntry } from './key';
import { ellipsize, wrapText, type WidthOf } from '../plot/text-fit';

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface PlacedKeyEntry {
  entry: KeyEntry;
  /** The label as drawn (shortened to fit). */
  label: string;
  /** Left edge and vertical middle of the entry's row. */
  x: number;
  y: number;
}

export interface FigureLayout {
  size: PixelSize;
  title: { lines: string[]; x: number; firstBaseline: number; lineHeight: number };
  body: Rect;
  key: { placement: 'right' | 'below' | 'none'; rect: Rect; heading: string | null; entries: PlacedKeyEntry[] };
}

export interface FigureText {
  title: string;
  key: readonly KeyEntry[];
  keyHeading?: string;
  /** 'below' keeps the body's full width (panel grids); 'auto' (the default) prefers a right column. */
  keyPlacement?: 'auto' | 'below';
}

export interface FigureMeasures {
  title: WidthOf;
  key: WidthOf;
  /** The key's heading (bold). */
  heading: WidthOf;
}

export const FIGURE_PAD = 10;
export const TITLE_LINE_HEIGHT = 19;
export const TITLE_MAX_LINES = 2;
export const KEY_LABEL_MAX = 380;
/** Gap between entries on one row of a key below the body. */
const KEY_COLUMN_GAP = 18;
/** The body keeps at least this share of the width when the key goes to the right. */
const BODY_MIN_SHARE = 0.6;
/** A key below the body takes at most this share of the height. */
const KEY_BELOW_MAX_SHARE = 0.35;

export function layoutFigure(size: PixelSize, text: FigureText, measure: FigureMeasures): FigureLayout {
  const inner = size.width - 2 * FIGURE_PAD;
  const lines = text.title ? wrapText(text.title, inner, measure.title, TITLE_MAX_LINES) : [];
  const top = lines.length ? FIGURE_PAD + lines.length * TITLE_LINE_HEIGHT + 4 : FIGURE_PAD;
  const title = { lines, x: FIGURE_PAD, firstBaseline: FIGURE_PAD + TITLE_LINE_HEIGHT - 5, lineHeight: TITLE_LINE_HEIGHT };
  const available = { x: FIGURE_PAD, y: top, width: inner, height: Math.max(0, size.height - top - FIGURE_PAD) };
  const heading = text.keyHeading ? ellipsize(text.keyHeading, Math.min(KEY_LABEL_MAX + KEY_GLYPH_WIDTH, inner), measure.heading) : null;
  if (!text.key.length) return { size, title, body: available, key: { placement: 'none', rect: { ...available, width: 0, height: 0 }, heading: null, entries: [] } };

  // Notes (text-only lines) may take the whole width when the key goes below.
  const labelsFor = (noteWidth: number, entryWidth: number) => text.key.map((e) => ellipsize(e.label, e.kind === 'note' ? noteWidth : entryWidth, measure.key));
  const widthsOf = (labels: string[]) => text.key.map((e, k) => (e.kind === 'note' ? 0 : KEY_GLYPH_WIDTH) + measure.key(labels[k]));
  let labels = labelsFor(KEY_LABEL_MAX, KEY_LABEL_MAX);
  let widths = widthsOf(labels);
  const headingRows = heading ? 1 : 0;

  // Right column: as wide as its widest entry.
  const columnWidth = Math.ceil(Math.max(...widths, heading ? measure.heading(heading) : 0)) + FIGURE_PAD;
  if (text.keyPlacement !== 'below' && available.width - columnWidth >= BODY_MIN_SHARE * available.width) {
    const rows = Math.max(1, Math.floor(available.height / KEY_ROW_HEIGHT) - headingRows);
    const shown = fitCount(text.key.length, rows);
    const x = available.x + available.width - columnWidth + FIGURE_PAD;
    const entries = placed(text.key, labels, shown, (k) => ({ x, y: available.y + (k + headingRows + 0.5) * KEY_ROW_HEIGHT }));
    return {
      size, title,
      body: { ...available, width: available.width - columnWidth },
      key: { placement: 'right', rect: { x: x - FIGURE_PAD / 2, y: available.y, width: columnWidth - FIGURE_PAD / 2, height: (entries.length + headingRows) * KEY_ROW_HEIGHT }, heading, entries },
    };
  }

  // Rows below: entries flow left to right, wrapping at the width.
  labels = labelsFor(available.width, Math.min(KEY_LABEL_MAX, available.width - KEY_GLYPH_WIDTH));
  widths = widthsOf(labels);
  const maxRows = Math.max(1, Math.floor((available.height * KEY_BELOW_MAX_SHARE) / KEY_ROW_HEIGHT) - headingRows);
  const spots: { x: number; row: number }[] = [];
  let x = 0;
  let row = 0;
  for (const w of widths) {
    if (x > 0 && x + w > available.width) [x, row] = [0, row + 1];
    spots.push({ x, row });
    x += w + KEY_COLUMN_GAP;
  }
  let shown = spots.filter((s) => s.row < maxRows).length;
  if (shown < text.key.length) shown = Math.max(0, shown - 1); // room for "and N more"
  const rowsUsed = shown < text.key.length ? Math.min(maxRows, (spots[shown]?.row ?? 0) + 1) : spots[spots.length - 1].row + 1;
  const height = (rowsUsed + headingRows) * KEY_ROW_HEIGHT;
  const keyTop = available.y + available.height - height;
  const entries = placed(text.key, labels, shown, (k) => ({
    x: available.x + (k < shown ? spots[k].x : spots[shown]?.x ?? 0),
    y: keyTop + ((k < shown ? spots[k].row : rowsUsed - 1) + headingRows + 0.5) * KEY_ROW_HEIGHT,
  }));
  return {
    size, title,
    body: { ...available, height: Math.max(0, available.height - height - FIGURE_PAD / 2) },
    key: { placement: 'below', rect: { x: available.x, y: keyTop, width: available.width, height }, heading, entries },
  };
}

/** How many entries to show in `rows` rows: all, or rows - 1 and a note. */
function fitCount(count: number, rows: number): number {
  return count <= rows ? count : Math.max(0, rows - 1);
}

function placed(entries: readonly KeyEntry[], labels: string[], shown: number, at: (k: number) => { x: number; y: number }): PlacedKeyEntry[] {
  const out = entries.slice(0, shown).map((entry, k) => ({ entry, label: labels[k], ...at(k) }));
  if (shown < entries.length) {
    const label = `and ${entries.length - shown} more`;
    out.push({ entry: { kind: 'note', label }, label, ...at(shown) });
  }
  return out;
}
