/**
 * Layout at the laptop sizes (1024 x 768, 1280 x 800): the map keeps a usable size without scrolling,
 * the header stays on one line in data-fit mode, nothing in the side panels or the data panels sticks
 * out of its panel; and equal scale: the drawn ticks give the same pixels per unit on both axes, and a
 * gradient-descent path on the circular bowl x^2 + y^2 crosses the drawn contours at right angles.
 */
import { expect, test, type Page } from '@playwright/test';
import { applyFormula, openFresh, waitForContours, waitForRunsToEnd } from './helpers';

interface Axes {
  frame: { left: number; top: number; width: number; height: number };
  a: [number, number][];
  b: [number, number][];
}

const SIZES = [
  { width: 1024, height: 768 },
  { width: 1280, height: 800 },
];

async function axesOf(page: Page): Promise<Axes> {
  return JSON.parse((await page.getByTestId('surface-base').first().getAttribute('data-axes'))!);
}

/** Pixels per unit along a and along b, from the first and last drawn tick of each axis. */
function pixelsPerUnit(axes: Axes): { a: number; b: number } {
  const per = (ticks: [number, number][]) => Math.abs((ticks[ticks.length - 1][1] - ticks[0][1]) / (ticks[ticks.length - 1][0] - ticks[0][0]));
  return { a: per(axes.a), b: per(axes.b) };
}

async function fitProbeData(page: Page) {
  await page.getByLabel('Model on data').check();
  await page.getByRole('button', { name: 'Use this data and model' }).click();
  await expect(page.getByTestId('surface-name')).toContainText('Linear regression of signal on flow');
  await waitForContours(page);
}

/** Every visible element inside `panel` selectors whose box leaves its panel's box (by more than half a pixel). */
async function overflowing(page: Page, panelSelector: string): Promise<string[]> {
  return page.evaluate((selector) => {
    const out: string[] = [];
    for (const panel of Array.from(document.querySelectorAll(selector))) {
      const p = panel.getBoundingClientRect();
      for (const el of Array.from(panel.querySelectorAll('*'))) {
        const r = el.getBoundingClientRect();
        if (r.width === 0 || r.height === 0) continue;
        if (r.left < p.left - 0.5 || r.right > p.right + 0.5) {
          const name = `${el.tagName.toLowerCase()}${el.className && typeof el.className === 'string' ? '.' + el.className.split(' ').join('.') : ''}`;
          out.push(`${selector}: ${name} "${(el.textContent ?? '').trim().slice(0, 30)}" spans ${Math.round(r.left)}..${Math.round(r.right)}, panel ${Math.round(p.left)}..${Math.round(p.right)}`);
        }
      }
    }
    return out;
  }, panelSelector);
}

for (const size of SIZES) {
  test.describe(`at ${size.width} x ${size.height}`, () => {
    test.use({ viewport: size });

    test('the map is a usable size on screen, for a test function and for a data fit', async ({ page }) => {
      await openFresh(page);
      for (const mode of ['test function', 'data fit']) {
        if (mode === 'data fit') await fitProbeData(page);
        const box = (await page.getByTestId('surface-base').first().boundingBox())!;
        const { frame } = await axesOf(page);
        // The plot frame (inside the axes and the colour bar) at least 480 x 400 px, and the whole map on
        // screen without scrolling (it was a 250 px strip at 1024 x 768, and 200 px wide in data-fit mode).
        expect(frame.width, `${mode}: frame width`).toBeGreaterThanOrEqual(480);
        expect(frame.height, `${mode}: frame height`).toBeGreaterThanOrEqual(400);
        expect(box.y + box.height, `${mode}: map bottom`).toBeLessThanOrEqual(size.height);
        expect(box.x + box.width, `${mode}: map right`).toBeLessThanOrEqual(size.width);
      }
    });

    test('the header stays on one line in data-fit mode', async ({ page }) => {
      await openFresh(page);
      await fitProbeData(page);
      const header = (await page.locator('.app-header').boundingBox())!;
      const title = (await page.locator('.app-header h1').boundingBox())!;
      const name = (await page.locator('.app-header .surface-name').boundingBox())!;
      const buttons = await page.locator('.app-header .export-menu button, .app-header .export-menu label').evaluateAll((els) => els.map((e) => e.getBoundingClientRect().top));
      // One line: the header is the title's height plus its padding, the name one text line, all buttons on one row.
      expect(header.height).toBeLessThanOrEqual(title.height + 16 + 1);
      expect(name.height).toBeLessThanOrEqual(24);
      expect(new Set(buttons.map(Math.round)).size).toBe(1);
      // The full name is still there (shortened on screen, whole in its title).
      await expect(page.getByTestId('surface-name')).toHaveAttribute('title', /Linear regression of signal on flow/);
    });

    test('nothing in the side panels or the data panels sticks out of its panel', async ({ page }) => {
      await openFresh(page);
      await page.getByRole('button', { name: /^Gradient descent/ }).first().click(); // opens the run editor
      expect(await overflowing(page, '.sidebar')).toEqual([]);
      // Many variables: the held values under the slice controls.
      await applyFormula(page, '(x1 - 1)^2 + (x2 - 2)^2 + (x3 - 0.123456789)^2 + (x4 + 1.5)^2 + x5^2');
      await expect(page.getByTestId('held-values').getByRole('textbox')).toHaveCount(3);
      expect(await overflowing(page, '.sidebar')).toEqual([]);
      await fitProbeData(page);
      await expect(page.getByTestId('param-table')).toBeVisible();
      for (const panel of ['.sidebar', '.data-panel', '.profile-panel', '.view-area']) expect(await overflowing(page, panel)).toEqual([]);
    });

    test('run names are shown whole on the run cards, with every control button on screen', async ({ page }) => {
      await openFresh(page);
      await waitForRunsToEnd(page, 3);
      const labels = page.locator('.run-item .run-label');
      await expect(labels).toHaveText(['Gradient descent', 'Momentum', 'Adam']);
      // Not cut short: each name's text fits its box (it was "Gradient…" beside the six buttons).
      const cut = await labels.evaluateAll((els) => els.filter((e) => e.scrollWidth > e.clientWidth + 1 || e.scrollHeight > e.clientHeight + 1).map((e) => e.textContent));
      expect(cut).toEqual([]);
      for (const group of await page.locator('.run-item .run-buttons').all()) {
        const box = (await group.boundingBox())!;
        const card = (await group.locator('xpath=ancestor::li[1]').boundingBox())!;
        expect(box.x + box.width).toBeLessThanOrEqual(card.x + card.width + 0.5);
      }
    });

    test('the data-fit form does not show the test function\'s constants', async ({ page }) => {
      await openFresh(page);
      await expect(page.getByText('Named constants')).toBeVisible();
      await page.getByLabel('Model on data').check();
      await expect(page.getByText('Named constants')).toHaveCount(0);
      await page.getByLabel('Test function').check();
      await expect(page.getByText('Named constants')).toBeVisible();
    });
  });
}

test.describe('at 1800 x 1000 (the data beside the map)', () => {
  test.use({ viewport: { width: 1800, height: 1000 } });

  test('the data panels sit beside the map and nothing sticks out of them', async ({ page }) => {
    await openFresh(page);
    await fitProbeData(page);
    const map = (await page.locator('.view-area').boundingBox())!;
    const data = (await page.locator('.data-panel').boundingBox())!;
    expect(data.x).toBeGreaterThan(map.x + map.width - 1);
    for (const panel of ['.sidebar', '.data-panel', '.profile-panel', '.view-area']) expect(await overflowing(page, panel)).toEqual([]);
  });
});

test.describe('equal scale', () => {
  test.use({ viewport: { width: 1280, height: 800 } });

  test('on by default for a test function: the drawn ticks give equal pixels per unit; off, they differ', async ({ page }) => {
    await openFresh(page);
    const toggle = page.getByLabel('equal scale');
    await expect(toggle).toBeChecked();
    const on = await axesOf(page);
    const per = pixelsPerUnit(on);
    expect(per.a / per.b).toBeCloseTo(1, 6);
    // The ticks are drawn where the attribute says: a dark tick mark under the frame at each a tick.
    const marks = await page.getByTestId('surface-base').first().evaluate((el, axes) => {
      const c = el as HTMLCanvasElement;
      const ratio = c.width / c.getBoundingClientRect().width;
      const ctx = c.getContext('2d')!;
      const y = Math.round((axes.frame.top + axes.frame.height + 3) * ratio);
      const darkness = (x: number) => {
        const d = ctx.getImageData(Math.round(x * ratio) - 1, y, 3, 1).data;
        return Math.max(...[0, 4, 8].map((k) => 255 - (d[k] + d[k + 1] + d[k + 2]) / 3));
      };
      return { at: axes.a.map(([, px]) => darkness(px)), between: axes.a.slice(1).map(([, px], k) => darkness((px + axes.a[k][1]) / 2)) };
    }, on);
    for (const d of marks.at) expect(d).toBeGreaterThan(60);
    for (const d of marks.between) expect(d).toBeLessThan(20);
    // The saved view is the demo's square box; shown on a wider frame, x was widened to fill it.
    expect(on.frame.width / on.frame.height).toBeGreaterThan(1.1);
    await toggle.uncheck();
    await waitForContours(page);
    // The frame is wider than tall and the box square: more pixels per unit of a than of b.
    await expect.poll(async () => pixelsPerUnit(await axesOf(page)).a / pixelsPerUnit(await axesOf(page)).b).toBeGreaterThan(1.05);
    // Saved with the workspace: still off after a reload.
    await page.waitForTimeout(500);
    await page.reload();
    await waitForContours(page);
    await expect(page.getByLabel('equal scale')).not.toBeChecked();
  });

  test('a gradient-descent path on the circular bowl crosses the contours at right angles', async ({ page }) => {
    await openFresh(page);
    for (const name of ['Remove Momentum', 'Remove Adam']) await page.getByRole('button', { name }).click();
    await applyFormula(page, 'x^2 + y^2');
    const toggle = page.getByLabel('equal scale');
    await expect(toggle).not.toBeChecked(); // a typed formula starts without it
    const angleOff = await crossingAngles(page);
    const perOff = pixelsPerUnit(await axesOf(page));
    await toggle.check();
    await waitForContours(page);
    const angleOn = await crossingAngles(page);
    // Plain descent on x^2 + y^2 from (-1.2, 1) goes straight to the origin, along the radius, and the
    // contours are circles: perpendicular in the plane, and on screen only when both axes share a scale.
    for (const a of angleOn) expect(Math.abs(a - 90)).toBeLessThan(3);
    // Unequal scale (k = pixels per unit of x / of y) maps the radius r = (cos t, sin t) and the circle's
    // tangent (-sin t, cos t) to (k cos t, sin t) and (-k sin t, cos t): the angle between them on screen is
    // acos(|(1 - k^2) sin t cos t| / (|R| |T|)), about 80.5 degrees for k = 1.18 at t = atan2(1, -1.2).
    const k = perOff.a / perOff.b;
    expect(k).toBeGreaterThan(1.05);
    const t = Math.atan2(1, -1.2);
    const predicted = (Math.acos(Math.abs((1 - k * k) * Math.sin(t) * Math.cos(t)) / (Math.hypot(k * Math.cos(t), Math.sin(t)) * Math.hypot(k * Math.sin(t), Math.cos(t)))) * 180) / Math.PI;
    for (const a of angleOff) expect(Math.abs(a - predicted)).toBeLessThan(3);
  });
});

/**
 * Angles (degrees) between the drawn path and the drawn contour lines where they cross, from pixels:
 * the path's direction from its drawn pixels on the overlay; each contour crossing along it on the base
 * layer, and that contour's tangent from the same colour edge found on two lines parallel to the path,
 * 12 px either side.
 */
async function crossingAngles(page: Page): Promise<number[]> {
  await waitForContours(page);
  await page.waitForTimeout(1500); // the path has streamed (its drawn pixels are read)
  const axes = await axesOf(page);
  return page.evaluate((axes) => {
    const base = document.querySelector('[data-testid="surface-base"]') as HTMLCanvasElement;
    const overlay = document.querySelector('[data-testid="surface-overlay"]') as HTMLCanvasElement;
    const ratio = base.width / base.getBoundingClientRect().width;
    const W = base.width;
    const basePx = base.getContext('2d')!.getImageData(0, 0, W, base.height).data;
    const overPx = overlay.getContext('2d')!.getImageData(0, 0, W, overlay.height).data;
    // Run 0's colour (Okabe-Ito orange), drawn exactly on the overlay.
    const path: [number, number][] = [];
    for (let y = 0; y < overlay.height; y++)
      for (let x = 0; x < W; x++) {
        const k = 4 * (y * W + x);
        if (overPx[k + 3] > 200 && Math.abs(overPx[k] - 0xe6) < 10 && Math.abs(overPx[k + 1] - 0x9f) < 10 && overPx[k + 2] < 20) path.push([x, y]);
      }
    if (path.length < 50) throw new Error(`path not found on the overlay (${path.length} pixels)`);
    // Principal direction of the path pixels.
    const mx = path.reduce((s, p) => s + p[0], 0) / path.length;
    const my = path.reduce((s, p) => s + p[1], 0) / path.length;
    let sxx = 0, sxy = 0, syy = 0;
    for (const [x, y] of path) {
      sxx += (x - mx) ** 2;
      sxy += (x - mx) * (y - my);
      syy += (y - my) ** 2;
    }
    const theta = 0.5 * Math.atan2(2 * sxy, sxx - syy);
    const d = [Math.cos(theta), Math.sin(theta)];
    const n = [-d[1], d[0]];
    // Extent of the path along d.
    const along = path.map(([x, y]) => (x - mx) * d[0] + (y - my) * d[1]);
    const lo = Math.min(...along);
    const hi = Math.max(...along);
    const colour = (x: number, y: number) => {
      const k = 4 * (Math.round(y) * W + Math.round(x));
      return [basePx[k], basePx[k + 1], basePx[k + 2]];
    };
    const differs = (p: number[], q: number[]) => Math.abs(p[0] - q[0]) + Math.abs(p[1] - q[1]) + Math.abs(p[2] - q[2]) > 12;
    const inFrame = (x: number, y: number) =>
      x > (axes.frame.left + 2) * ratio && x < (axes.frame.left + axes.frame.width - 2) * ratio && y > (axes.frame.top + 2) * ratio && y < (axes.frame.top + axes.frame.height - 2) * ratio;
    /** Where the base colour changes along the centre line shifted by `offset` along n: t along d, colours either side. */
    const edges = (offset: number, from: number, to: number) => {
      const found: { t: number; before: number[]; after: number[] }[] = [];
      let prev: number[] | null = null;
      for (let t = from; t <= to; t += 0.5) {
        const x = mx + t * d[0] + offset * n[0];
        const y = my + t * d[1] + offset * n[1];
        if (!inFrame(x, y)) {
          prev = null;
          continue;
        }
        const c = colour(x, y);
        if (prev && differs(prev, c)) found.push({ t: t - 0.25, before: prev, after: colour(x + 2 * d[0], y + 2 * d[1]) });
        prev = c;
      }
      return found;
    };
    const step = 12 * ratio;
    const angles: number[] = [];
    // Crossings in the middle part of the path, away from its ends (the start marker and the minimum); on
    // the parallel lines, the edge between the same two bands (same colours either side) nearest to it.
    for (const e of edges(0, lo + 0.2 * (hi - lo), hi - 0.2 * (hi - lo))) {
      const t = e.t;
      const same = (f: { before: number[]; after: number[] }) => !differs(f.before, e.before) && !differs(f.after, e.after);
      const near = (list: { t: number; before: number[]; after: number[] }[]) =>
        list.filter(same).reduce((best, f) => (Math.abs(f.t - t) < Math.abs(best - t) ? f.t : best), Number.POSITIVE_INFINITY);
      const plus = near(edges(step, t - 3 * step, t + 3 * step));
      const minus = near(edges(-step, t - 3 * step, t + 3 * step));
      if (!Number.isFinite(plus) || !Number.isFinite(minus) || Math.abs(plus - t) > 2 * step || Math.abs(minus - t) > 2 * step) continue;
      // Tangent from (minus, -step) to (plus, +step) in (along d, along n) coordinates.
      const tangent = [plus - minus, 2 * step];
      angles.push((Math.acos(Math.abs(tangent[0]) / Math.hypot(tangent[0], tangent[1])) * 180) / Math.PI);
    }
    if (angles.length < 2) throw new Error(`too few contour crossings measured (${angles.length})`);
    return angles;
  }, axes);
}
