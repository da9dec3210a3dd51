import { describe, expect, it } from 'vitest';
import { runStyle } from '../../../src/ui/plot';
import { FIGURE_PAD, KEY_LABEL_MAX, layoutFigure, TITLE_LINE_HEIGHT, type FigureLayout, type Rect } from '../../../src/ui/figure/figure-layout';
import { KEY_GLYPH_WIDTH, KEY_ROW_HEIGHT, type KeyEntry } from '../../../src/ui/figure/key';

const mono = (t: string) => Array.from(t).length * 7;
const measure = { title: (t: string) => Array.from(t).length * 9, key: mono, heading: (t: string) => Array.from(t).length * 8 };
const runs = (labels: string[]): KeyEntry[] => labels.map((label, k) => ({ kind: 'run', style: runStyle(k), label }));

const inside = (r: Rect, size: { width: number; height: number }) => r.x >= 0 && r.y >= 0 && r.x + r.width <= size.width + 1e-9 && r.y + r.height <= size.height + 1e-9;
const disjoint = (a: Rect, b: Rect) => a.x + a.width <= b.x + 1e-9 || b.x + b.width <= a.x + 1e-9 || a.y + a.height <= b.y + 1e-9 || b.y + b.height <= a.y + 1e-9;

function checkParts(layout: FigureLayout) {
  const { size, body, key } = layout;
  expect(inside(body, size)).toBe(true);
  if (key.placement !== 'none') {
    expect(inside(key.rect, size)).toBe(true);
    expect(disjoint(body, key.rect)).toBe(true);
    for (const e of key.entries) {
      const width = (e.entry.kind === 'note' ? 0 : KEY_GLYPH_WIDTH) + mono(e.label);
      expect(e.x + width).toBeLessThanOrEqual(size.width - FIGURE_PAD + 1e-9);
      expect(e.y + KEY_ROW_HEIGHT / 2).toBeLessThanOrEqual(size.height - FIGURE_PAD + 1e-9);
      expect(e.y - KEY_ROW_HEIGHT / 2).toBeGreaterThanOrEqual(key.rect.y - 1e-9);
    }
  }
  // The title band ends above the body.
  expect(body.y).toBeGreaterThanOrEqual(FIGURE_PAD + layout.title.lines.length * TITLE_LINE_HEIGHT);
}

describe('layoutFigure', () => {
  it('puts a short key in a right-hand column, the body keeping the rest of the width', () => {
    const layout = layoutFigure({ width: 900, height: 600 }, { title: 'Rosenbrock', key: runs(['Plain descent', 'Momentum', 'Adam']) }, measure);
    expect(layout.key.placement).toBe('right');
    expect(layout.title.lines).toEqual(['Rosenbrock']);
    // Widest label "Plain descent": 13 x 7 = 91 px, plus the glyph and a pad.
    expect(layout.body.width).toBe(900 - 2 * FIGURE_PAD - (KEY_GLYPH_WIDTH + 91 + FIGURE_PAD));
    expect(layout.key.entries.map((e) => e.label)).toEqual(['Plain descent', 'Momentum', 'Adam']);
    expect(layout.key.entries[1].y - layout.key.entries[0].y).toBe(KEY_ROW_HEIGHT);
    checkParts(layout);
  });

  it('moves a wide key below the body on a narrow figure, flowing entries into rows', () => {
    const labels = ['minimum (3, 2): 274 starts, 26.8%', 'minimum (-2.80512, 3.13131): 273 starts, 26.7%', 'minimum (-3.77931, -3.28319): 247 starts, 24.1%'];
    const layout = layoutFigure({ width: 500, height: 500 }, { title: 'Start-point map', key: labels.map((label) => ({ kind: 'swatch', colour: '#c66', label })), keyHeading: 'Where the runs ended' }, measure);
    expect(layout.key.placement).toBe('below');
    expect(layout.key.heading).toBe('Where the runs ended');
    expect(new Set(layout.key.entries.map((e) => e.y)).size).toBe(3); // one entry per row at this width
    expect(layout.body.width).toBe(500 - 2 * FIGURE_PAD);
    checkParts(layout);
    // A heading wider than the figure is shortened to it (bold: 8 px per character here).
    const narrow = layoutFigure({ width: 220, height: 400 }, { title: '', key: runs(['a']), keyHeading: 'Where the runs ended (3000 steps at most; lighter = more steps)' }, measure);
    expect(narrow.key.heading!.endsWith('\u2026')).toBe(true);
    expect(measure.heading(narrow.key.heading!)).toBeLessThanOrEqual(220 - 2 * FIGURE_PAD);
  });

  it('keeps the body at full width when the figure asks for its key below (panel grids)', () => {
    const layout = layoutFigure({ width: 900, height: 600 }, { title: 'Rosenbrock', key: runs(['Plain descent', 'Momentum', 'Adam']), keyPlacement: 'below' }, measure);
    expect(layout.key.placement).toBe('below');
    expect(layout.body.width).toBe(900 - 2 * FIGURE_PAD);
    expect(new Set(layout.key.entries.map((e) => e.y)).size).toBe(1); // three short entries on one row
    checkParts(layout);
  });

  it('wraps a long data-fit title to two lines ending in an ellipsis, clear of the body', () => {
    const title = 'Linear regression of response on dose (mean squared error) - reservoir-outflow-probe-calibration-second-field-season-after-the-housing-was-replaced.csv (L2 0.1, standardised inputs)';
    const layout = layoutFigure({ width: 520, height: 420 }, { title, key: runs(['Plain descent']) }, measure);
    expect(layout.title.lines).toHaveLength(2);
    expect(layout.title.lines[1].endsWith('\u2026')).toBe(true);
    for (const line of layout.title.lines) expect(measure.title(line)).toBeLessThanOrEqual(520 - 2 * FIGURE_PAD);
    expect(layout.body.y).toBe(FIGURE_PAD + 2 * TITLE_LINE_HEIGHT + 4);
    checkParts(layout);
  });

  it('shortens key labels to KEY_LABEL_MAX and replaces entries that do not fit by "and N more"', () => {
    const long = 'x'.repeat(100);
    const many = runs(Array.from({ length: 40 }, (_, k) => (k === 0 ? long : `run ${k + 1}`)));
    const layout = layoutFigure({ width: 1200, height: 300 }, { title: '', key: many }, measure);
    expect(layout.key.placement).toBe('right');
    expect(mono(layout.key.entries[0].label)).toBeLessThanOrEqual(KEY_LABEL_MAX);
    const last = layout.key.entries[layout.key.entries.length - 1];
    const shown = layout.key.entries.length - 1;
    expect(last.entry.kind).toBe('note');
    expect(last.label).toBe(`and ${40 - shown} more`);
    expect(layout.title.lines).toEqual([]);
    checkParts(layout);
  });

  it('gives the whole area to the body when there is no key', () => {
    const layout = layoutFigure({ width: 400, height: 300 }, { title: 'Loss by step', key: [] }, measure);
    expect(layout.key.placement).toBe('none');
    expect(layout.body).toEqual({ x: FIGURE_PAD, y: FIGURE_PAD + TITLE_LINE_HEIGHT + 4, width: 400 - 2 * FIGURE_PAD, height: 300 - 2 * FIGURE_PAD - TITLE_LINE_HEIGHT - 4 });
  });

  it('keeps every part inside the figure across sizes and key lengths', () => {
    for (const width of [200, 333, 640, 1024, 2000])
      for (const height of [200, 417, 900])
        for (const count of [1, 3, 9, 30]) {
          const layout = layoutFigure({ width, height }, { title: 'Multi-start of “Adam” on Himmelblau: loss across 100 starts', key: runs(Array.from({ length: count }, (_, k) => `Adam lr=${10 ** -k}`)) }, measure);
          checkParts(layout);
        }
  });
});
