/**
 * The quick previews sent before a large grid is finished, shared by the single-worker sampler
 * (src/worker/grids.ts) and the page's grid pool (src/client/grid-pool.ts). Coarse to fine: a 16 x 16
 * grid costs 256 evaluations, so even a network's loss over its data shows a first picture within
 * about a second; the 48 x 48 one follows.
 */
export const PREVIEW_SIDES: readonly number[] = [16, 48];

/** The preview sides a grid of nx x ny cells gets: those with a quarter of its cells or fewer, coarsest first. */
export function previewSidesFor(nx: number, ny: number): number[] {
  return PREVIEW_SIDES.filter((s) => nx * ny > 4 * s * s);
}
