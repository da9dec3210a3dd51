import { readFileSync, writeFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { applyFormula, openFresh, waitForContours, waitForRunsToEnd } from './helpers';

/**
 * Figure exports look like the view they come from: each exportable view's SVG is parsed by the
 * browser and must hold the run names, the key entries, the axis titles and the colour bar's tick
 * values; its PNG has size x pixel ratio device pixels and its key area is not blank (a run colour at
 * the key's place). The run colours are the Okabe-Ito palette the page draws (plot/run-style.ts).
 */

const ORANGE = [0xe6, 0x9f, 0x00]; // the first run's colour, "Gradient descent"

async function downloadOf(page: Page, button: string): Promise<Buffer> {
  const d = page.waitForEvent('download');
  await page.getByRole('button', { name: button, exact: true }).click();
  const bytes = readFileSync((await (await d).path())!);
  if (process.env.FIGURE_DEBUG) writeFileSync(`${process.env.FIGURE_DEBUG}/${button.replace(/\W+/g, '-')}.${button.endsWith('PNG') ? 'png' : 'svg'}`, bytes);
  return bytes;
}

/** The SVG as the browser reads it: parse error, size, and the text of every <text> with its box once drawn. */
async function readSvg(page: Page, bytes: Buffer) {
  return page.evaluate((text) => {
    const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
    const error = doc.querySelector('parsererror')?.textContent ?? null;
    const holder = document.createElement('div');
    holder.style.cssText = 'position:absolute;left:0;top:0';
    document.body.appendChild(holder);
    const svg = document.importNode(doc.documentElement, true) as unknown as SVGSVGElement;
    holder.appendChild(svg);
    const origin = svg.getBoundingClientRect();
    const texts = [...svg.querySelectorAll('text')].map((t) => {
      const box = t.getBoundingClientRect(); // after the element's transform (rotated axis titles)
      return { text: t.textContent ?? '', x: box.x - origin.x, y: box.y - origin.y, width: box.width, height: box.height, bold: (t.getAttribute('style') ?? '').includes('bold') };
    });
    const result = { error, width: Number(svg.getAttribute('width')), height: Number(svg.getAttribute('height')), texts, paths: svg.querySelectorAll('path').length };
    holder.remove();
    return result;
  }, bytes.toString('utf8'));
}

/** PNG size from its IHDR chunk (bytes 16-23, big-endian). */
function pngSize(bytes: Buffer) {
  expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** Pixels of the PNG decoded in the page, counted in a rectangle (fractions of the image) near a colour. */
async function colourInRegion(page: Page, bytes: Buffer, region: { x0: number; x1: number; y0: number; y1: number }, rgb: number[], tolerance = 30): Promise<number> {
  return page.evaluate(async ({ b64, region, rgb, tolerance }) => {
    const blob = new Blob([Uint8Array.from(atob(b64), (ch) => ch.charCodeAt(0))], { type: 'image/png' });
    const image = await createImageBitmap(blob);
    const c = new OffscreenCanvas(image.width, image.height);
    const ctx = c.getContext('2d')!;
    ctx.drawImage(image, 0, 0);
    const x0 = Math.floor(region.x0 * image.width);
    const y0 = Math.floor(region.y0 * image.height);
    const w = Math.max(1, Math.floor((region.x1 - region.x0) * image.width));
    const h = Math.max(1, Math.floor((region.y1 - region.y0) * image.height));
    const data = ctx.getImageData(x0, y0, w, h).data;
    let n = 0;
    for (let k = 0; k < data.length; k += 4) if (Math.abs(data[k] - rgb[0]) <= tolerance && Math.abs(data[k + 1] - rgb[1]) <= tolerance && Math.abs(data[k + 2] - rgb[2]) <= tolerance) n++;
    return n;
  }, { b64: bytes.toString('base64'), region, rgb, tolerance });
}

async function setFigureSize(page: Page, name: string, width: number, height: number, ratio: number) {
  const group = page.getByRole('group', { name: `${name} figure` });
  await group.locator('summary').click();
  await group.getByLabel(`${name} figure width`).fill(String(width));
  await group.getByLabel(`${name} figure height`).fill(String(height));
  await group.getByLabel(`${name} PNG pixel ratio`).selectOption(String(ratio));
}

const texts = (svg: Awaited<ReturnType<typeof readSvg>>) => svg.texts.map((t) => t.text);

test.describe('figure exports', () => {
  test('the single map: SVG with runs, key, axes and colour-bar values; PNG at the chosen size and ratio with the key drawn', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    // A size outside the range is refused at its field, and the buttons wait for a good one.
    await setFigureSize(page, 'View', 50, 600, 3);
    await expect(page.getByRole('group', { name: 'View figure' }).getByRole('alert')).toHaveText('width: from 200 to 4000 pixels, got 50');
    await expect(page.getByRole('button', { name: 'View PNG', exact: true })).toBeDisabled();
    await page.getByLabel('View figure width').fill('900');
    const svg = await readSvg(page, await downloadOf(page, 'View SVG'));
    expect(svg.error).toBeNull();
    expect([svg.width, svg.height]).toEqual([900, 600]);
    const all = texts(svg);
    for (const label of ['Rosenbrock', 'Gradient descent', 'Momentum', 'Adam', 'known minimum', 'x', 'y', 'loss']) expect(all).toContain(label);
    // The colour bar's decade ticks (log scale of Rosenbrock, minimum 0: legend.ts) and axis ticks inside both axes' ranges (the a-axis is widened by equal scale).
    for (const tick of ['1', '10', '100', '1000', '0.0', '1.0', '2.0']) expect(all).toContain(tick);
    // Nothing runs off the figure.
    for (const t of svg.texts) expect(t.x + t.width).toBeLessThanOrEqual(svg.width + 0.5);

    const png = await downloadOf(page, 'View PNG');
    expect(pngSize(png)).toEqual({ width: 2700, height: 1800 });
    // The key sits in the right-hand column: the first run's orange shows there, in its line and marker.
    expect(await colourInRegion(page, png, { x0: 0.8, x1: 1, y0: 0, y1: 0.3 }, ORANGE)).toBeGreaterThan(100);
  });

  test('the PNG and the SVG of a view are the same drawing', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    await setFigureSize(page, 'View', 800, 520, 1);
    const png = await downloadOf(page, 'View PNG');
    const svg = await downloadOf(page, 'View SVG');
    // The SVG rasterised by the browser against the PNG, pixel by pixel: only antialiasing may differ.
    const differing = await page.evaluate(async ({ png64, svgText }) => {
      const draw = async (blob: Blob) => {
        const url = URL.createObjectURL(blob);
        const img = new Image();
        img.src = url;
        await img.decode();
        const c = new OffscreenCanvas(800, 520);
        const ctx = c.getContext('2d')!;
        ctx.drawImage(img, 0, 0, 800, 520);
        URL.revokeObjectURL(url);
        return ctx.getImageData(0, 0, 800, 520).data;
      };
      const a = await draw(new Blob([Uint8Array.from(atob(png64), (ch) => ch.charCodeAt(0))], { type: 'image/png' }));
      const b = await draw(new Blob([svgText], { type: 'image/svg+xml' }));
      let n = 0;
      for (let k = 0; k < a.length; k += 4) if (Math.max(Math.abs(a[k] - b[k]), Math.abs(a[k + 1] - b[k + 1]), Math.abs(a[k + 2] - b[k + 2])) > 64) n++;
      return n / (a.length / 4);
    }, { png64: png.toString('base64'), svgText: svg.toString('utf8') });
    expect(differing).toBeLessThan(0.02);
  });

  test('per-run panels and the optimizer x learning-rate table export their panels, heads, colour bar and key', async ({ page }) => {
    await openFresh(page);
    await waitForRunsToEnd(page, 3);
    await page.getByRole('tab', { name: 'One panel per run' }).click();
    await expect(page.getByTestId('panel-grid').getByTestId('surface-overlay').nth(2)).toHaveAttribute('data-trajectories', '1', { timeout: 15_000 });
    await setFigureSize(page, 'View', 1400, 520, 2);
    const panels = await readSvg(page, await downloadOf(page, 'View SVG'));
    expect(panels.error).toBeNull();
    const p = texts(panels);
    for (const label of ['Gradient descent', 'Momentum', 'Adam', 'loss', '1000']) expect(p).toContain(label);
    // One title plate per panel plus one key entry per run: each run name twice.
    for (const label of ['Gradient descent', 'Momentum', 'Adam']) expect(p.filter((t) => t === label).length).toBe(2);
    expect(p.filter((t) => t === 'x').length).toBe(3); // an a-axis title under each panel

    await page.getByRole('tab', { name: 'Optimizer × learning rate' }).click();
    await page.getByRole('button', { name: /^Build table runs/ }).click();
    await expect(page.getByTestId('panel-grid').getByTestId('surface-base').first()).toHaveAttribute('data-drawn', 'contours', { timeout: 15_000 });
    // The table's panels have their own frame size, so the grid is sampled again: wait until it is in.
    // (The progress bar may not be up yet when this first looks, so the page's own colour bar is awaited too.)
    await expect(page.getByRole('progressbar', { name: 'Sampling the surface' })).toHaveCount(0, { timeout: 30_000 });
    await expect(page.getByTestId('panel-colour-bar')).toHaveAttribute('data-drawn', 'legend', { timeout: 30_000 });
    await expect(page.getByRole('progressbar', { name: 'Sampling the surface' })).toHaveCount(0, { timeout: 30_000 });
    const table = await readSvg(page, await downloadOf(page, 'View SVG'));
    expect(table.error).toBeNull();
    const t = texts(table);
    const heads = t.filter((s) => s.startsWith('learning rate '));
    expect(heads.length).toBeGreaterThanOrEqual(2);
    expect(t).toContain('loss');
    // Title plates fit their cells: a shortened one ends with an ellipsis, none runs past the figure.
    for (const box of table.texts) expect(box.x + box.width).toBeLessThanOrEqual(table.width + 0.5);
    const png = await downloadOf(page, 'View PNG');
    const size = pngSize(png);
    expect(size.width % 2).toBe(0); // default pixel ratio 2
    // The key runs below the panels (they keep the view's width): the orange run's entry is in the bottom band.
    expect(await colourInRegion(page, png, { x0: 0, x1: 1, y0: 0.9, y1: 1 }, ORANGE)).toBeGreaterThan(30);
  });

  test('a long data-fit title wraps to two lines, ends with an ellipsis and stays clear of the plot and colour bar', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Model on data').check();
    const name = 'reservoir-outflow-probe-calibration-second-field-season-after-the-housing-was-replaced-and-resealed-twice.csv';
    const csv = 'dose,response\n1,2.1\n2,4.0\n3,6.2\n4,7.9\n5,9.8\n';
    await page.getByLabel('Import a CSV file…').setInputFiles({ name, mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByLabel('standardise inputs (mean 0, standard deviation 1)').check();
    await page.getByRole('button', { name: 'Use this data and model' }).click();
    await expect(page.getByTestId('surface-name')).toContainText('reservoir-outflow');
    await waitForContours(page);
    await setFigureSize(page, 'View', 520, 420, 1);
    const svg = await readSvg(page, await downloadOf(page, 'View SVG'));
    expect(svg.error).toBeNull();
    const title = svg.texts.filter((t) => t.bold && t.y < 60);
    expect(title.length).toBe(2);
    expect(title[1].text.endsWith('\u2026')).toBe(true);
    for (const line of title) expect(line.x + line.width).toBeLessThanOrEqual(520 - 10 + 0.5);
    // Every other text (axis ticks, the colour bar's "loss" and values) lies below the title lines.
    const titleBottom = Math.max(...title.map((t) => t.y + t.height));
    for (const t of svg.texts.filter((t) => !title.includes(t))) expect(t.y).toBeGreaterThanOrEqual(titleBottom - 1);
    const png = await downloadOf(page, 'View PNG');
    expect(pngSize(png)).toEqual({ width: 520, height: 420 });
  });

  test('the loss chart exports its runs and, after a multi-start study, the median and quartile band with their key entries', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
    await waitForContours(page);
    await waitForRunsToEnd(page, 3);
    await page.getByRole('button', { name: /^Adam/ }).first().click();
    await page.getByRole('tab', { name: 'Multi-start' }).click();
    const panel = page.getByTestId('multi-start');
    await panel.getByLabel('number of starts').fill('30');
    await panel.getByRole('button', { name: 'Run starts' }).click();
    await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
    await expect(page.getByTestId('loss-chart')).toHaveAttribute('data-band', 'multi-start');
    await expect(page.getByTestId('loss-legend')).toContainText('multi-start median, 30 starts of “Adam”');

    const svg = await readSvg(page, await downloadOf(page, 'Loss chart SVG'));
    expect(svg.error).toBeNull();
    const all = texts(svg);
    for (const label of ['Gradient descent', 'Momentum', 'Adam', 'step', 'loss − minimum', 'multi-start median, 30 starts of “Adam”', 'multi-start 25–75% band']) expect(all).toContain(label);
    // At the default (on-screen) size the long band labels send the key below the chart; at 1400 px it goes right.
    await setFigureSize(page, 'Loss chart', 1400, 400, 1);
    const png = await downloadOf(page, 'Loss chart PNG');
    expect(pngSize(png)).toEqual({ width: 1400, height: 400 });
    expect(await colourInRegion(page, png, { x0: 0.75, x1: 1, y0: 0, y1: 0.6 }, ORANGE)).toBeGreaterThan(30);

    // The multi-start view itself: band chart, key and summary lines.
    const ms = await readSvg(page, await downloadOf(page, 'Multi-start SVG'));
    expect(ms.error).toBeNull();
    const m = texts(ms);
    for (const label of ['median across starts', '25–75% of the starts', 'step']) expect(m).toContain(label);
    expect(m.some((t) => t.startsWith('success rate '))).toBe(true);
    const msPng = await downloadOf(page, 'Multi-start PNG');
    // The band's blue (0, 114, 178) is drawn in the chart.
    expect(await colourInRegion(page, msPng, { x0: 0, x1: 1, y0: 0, y1: 1 }, [0, 114, 178], 20)).toBeGreaterThan(100);
  });

  test('the start-point map exports its cells with axes and the basin legend with counts and shares', async ({ page }) => {
    await openFresh(page);
    await page.getByLabel('Catalogue entry').selectOption({ label: 'Himmelblau' });
    await waitForContours(page);
    await page.getByRole('button', { name: /^Adam/ }).first().click();
    const panel = page.getByTestId('start-map');
    await panel.getByLabel('cells per side').selectOption('32');
    await panel.getByRole('button', { name: 'Map start points' }).click();
    await expect(panel.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
    await setFigureSize(page, 'Start-point map', 1200, 600, 1);
    const rows = await panel.getByTestId('start-map-legend').locator('tbody tr').evaluateAll((trs) => trs.map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent ?? '')));
    const svg = await readSvg(page, await downloadOf(page, 'Start-point map SVG'));
    expect(svg.error).toBeNull();
    const all = texts(svg);
    // Every legend row of the panel, with the same count and share.
    for (const [, end, count, share] of rows) expect(all).toContain(`${end}: ${count} starts, ${share}`);
    expect(all.filter((t) => t.startsWith('minimum (')).length).toBe(4);
    expect(all).toContain('x');
    expect(all).toContain('y');
    expect(all.some((t) => t.startsWith('Where the runs ended'))).toBe(true);
    const png = await downloadOf(page, 'Start-point map PNG');
    // The four basin swatches of the key: at least four distinct saturated hues right of the map.
    const hues = await page.evaluate(async (b64) => {
      const image = await createImageBitmap(new Blob([Uint8Array.from(atob(b64), (ch) => ch.charCodeAt(0))], { type: 'image/png' }));
      const c = new OffscreenCanvas(image.width, image.height);
      const ctx = c.getContext('2d')!;
      ctx.drawImage(image, 0, 0);
      const x0 = Math.floor(image.width * 0.66); // right of the square map: the key's column
      const data = ctx.getImageData(x0, 0, image.width - x0, image.height).data;
      const seen = new Set<string>();
      for (let k = 0; k < data.length; k += 4) {
        const [r, g, b] = [data[k], data[k + 1], data[k + 2]];
        if (Math.max(r, g, b) - Math.min(r, g, b) > 60) seen.add(`${r >> 5},${g >> 5},${b >> 5}`);
      }
      return seen.size;
    }, png.toString('base64'));
    expect(hues).toBeGreaterThanOrEqual(4);
  });

  test('the learning-rate sweep, sharpness and critical-point views export their curves, marks and keys', async ({ page }) => {
    await openFresh(page);
    await applyFormula(page, 'x^2 + 10*y^2');
    await page.getByRole('button', { name: /^Gradient descent/ }).first().click();
    await expect(page.locator('.run-status').first()).toHaveAttribute('data-phase', 'ended', { timeout: 30_000 });

    await page.getByRole('tab', { name: 'Learning-rate sweep' }).click();
    const sweep = page.getByTestId('rate-sweep');
    await sweep.getByLabel('rates').selectOption('16');
    await sweep.getByRole('button', { name: 'Sweep learning rates' }).click();
    await expect(sweep.locator('.study-progress')).toHaveAttribute('data-status', 'done', { timeout: 60_000 });
    const rates = texts(await readSvg(page, await downloadOf(page, 'Learning-rate sweep SVG')));
    for (const label of ['Gradient descent', 'Momentum', 'Adam', 'learning rate', 'final loss', 'observed divergence threshold (solid, run colour)', 'predicted 2/λmax or 2(1+μ)/λmax (dashed)']) expect(rates).toContain(label);
    // The thresholds as the panel shows them (0.1 = 2/lambda_max for GD on x^2 + 10 y^2).
    expect(rates.some((t) => t.startsWith('Gradient descent: observed 0.1') && t.endsWith('predicted 0.1'))).toBe(true);
    const ratesPng = await downloadOf(page, 'Learning-rate sweep PNG');
    expect(await colourInRegion(page, ratesPng, { x0: 0, x1: 1, y0: 0, y1: 1 }, ORANGE)).toBeGreaterThan(50);

    await page.getByRole('tab', { name: 'Sharpness' }).click();
    const sharp = page.getByTestId('sharpness');
    await sharp.getByRole('button', { name: 'Measure sharpness' }).click();
    await expect(sharp.getByTestId('sharpness-last')).toContainText('λmax = 20');
    const s = texts(await readSvg(page, await downloadOf(page, 'Sharpness SVG')));
    for (const label of ['largest Hessian eigenvalue', 'step', '2 / learning rate at that step']) expect(s).toContain(label);
    expect(s.some((t) => t.startsWith('λmax of the Hessian at '))).toBe(true);
    await setFigureSize(page, 'Sharpness', 640, 360, 2);
    const sPng = await downloadOf(page, 'Sharpness PNG');
    expect(pngSize(sPng)).toEqual({ width: 1280, height: 720 });
    // The key's dashed 2/lr line in its vermillion and the curve's blue are both drawn.
    expect(await colourInRegion(page, sPng, { x0: 0, x1: 1, y0: 0, y1: 1 }, [0xd5, 0x5e, 0x00], 20)).toBeGreaterThan(30);
    expect(await colourInRegion(page, sPng, { x0: 0, x1: 1, y0: 0, y1: 1 }, [0x00, 0x72, 0xb2], 20)).toBeGreaterThan(30);

    await page.getByRole('tab', { name: 'Critical points' }).click();
    const crit = page.getByTestId('critical-points');
    await crit.getByRole('button', { name: 'Find critical points' }).click();
    await expect(crit.getByTestId('critical-table').locator('tbody tr')).toHaveCount(1, { timeout: 30_000 });
    const c = texts(await readSvg(page, await downloadOf(page, 'Critical points SVG')));
    for (const label of ['minimum (1)', 'saddle (0)', 'maximum (0)', 'x', 'y']) expect(c).toContain(label);
    const cPng = await downloadOf(page, 'Critical points PNG');
    expect(await colourInRegion(page, cPng, { x0: 0, x1: 1, y0: 0, y1: 1 }, [0x00, 0x9e, 0x73], 20)).toBeGreaterThan(30); // the minimum's green marker
  });
});
