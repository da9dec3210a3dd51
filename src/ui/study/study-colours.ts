import { hsl } from 'd3';
import { OUTCOME_KINDS, type OutcomeKind } from '../../engine';

/**
 * Colours of a start-point map. Basins get hues spread by the golden angle (137.5 degrees apart, so
 * any number of basins stay distinguishable from their neighbours in the list) at a middle lightness;
 * a cell is lightened towards white with its shade steps (lighter = slower: sqrt(steps / max steps) of
 * the way to 60% white; paint-map.ts passes steps to tolerance where the study measured them, else the
 * steps the run took). Runs that ended in no basin are coloured by their outcome.
 */
export type Rgb = [number, number, number];

const basinCache = new Map<number, Rgb>();

export function basinColour(id: number): Rgb {
  let rgb = basinCache.get(id);
  if (!rgb) {
    const c = hsl((20 + id * 137.5) % 360, 0.55, 0.5).rgb();
    rgb = [Math.round(c.r), Math.round(c.g), Math.round(c.b)];
    basinCache.set(id, rgb);
  }
  return rgb;
}

export const OUTCOME_COLOURS: Partial<Record<OutcomeKind, Rgb>> = {
  stalled: [140, 140, 140],
  oscillating: [214, 51, 108],
  escaping: [92, 64, 51],
  diverged: [17, 17, 17],
  undefined: [255, 255, 255],
  saddle: [190, 190, 255],
  maximum: [255, 230, 150],
  'step-limit': [207, 207, 207],
  cancelled: [240, 240, 240],
};

export function cellColour(kindIndex: number, basin: number, steps: number, maxSteps: number): Rgb {
  if (basin >= 0) {
    const [r, g, b] = basinColour(basin);
    const t = 0.6 * Math.sqrt(Math.min(1, Math.max(0, steps / Math.max(1, maxSteps))));
    return [Math.round(r + (255 - r) * t), Math.round(g + (255 - g) * t), Math.round(b + (255 - b) * t)];
  }
  return OUTCOME_COLOURS[OUTCOME_KINDS[kindIndex]] ?? [255, 255, 255];
}

export const cssColour = ([r, g, b]: Rgb) => `rgb(${r}, ${g}, ${b})`;
