/**
 * How runs are told apart: a colour from the Okabe-Ito palette and a marker shape, so colour is never
 * the only cue.
 *
 * Palette: M. Okabe and K. Ito (2008), "Color Universal Design (CUD): how to make figures and
 * presentations that are friendly to colorblind people" (https://jfly.uni-koeln.de/color/), eight
 * colours distinguishable under the common colour-vision deficiencies. The order below is ours: black
 * goes last because it vanishes on the dark low end of viridis.
 *
 * Run k gets colour k mod 8 and marker (k + floor(k / 8)) mod 8, so the first 64 runs all have
 * different (colour, marker) pairs. Every line and marker is drawn over a halo that contrasts with the
 * run colour (dark under light colours, light under dark ones), which keeps yellow visible on the bright
 * end of the map and blue on the dark end.
 */
export const OKABE_ITO = {
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
  black: '#000000',
} as const;

export const RUN_COLOURS: readonly string[] = Object.values(OKABE_ITO);

export const MARKER_SHAPES = ['circle', 'square', 'triangle', 'diamond', 'cross', 'plus', 'star', 'inverted-triangle'] as const;
export type MarkerShape = (typeof MARKER_SHAPES)[number];

export interface RunStyle {
  colour: string;
  marker: MarkerShape;
  /** Outline colour drawn under the line and around markers. */
  halo: string;
}

export function runStyle(index: number): RunStyle {
  if (!(Number.isInteger(index) && index >= 0)) throw new Error(`run style: index must be a whole number >= 0, got ${index}`);
  const colour = RUN_COLOURS[index % RUN_COLOURS.length];
  const marker = MARKER_SHAPES[(index + Math.floor(index / RUN_COLOURS.length)) % MARKER_SHAPES.length];
  return { colour, marker, halo: haloFor(colour) };
}

/** Dark halo under light colours and light halo under dark ones (WCAG relative luminance > 0.3). */
export function haloFor(hex: string): string {
  return relativeLuminance(hex) > 0.3 ? 'rgba(0,0,0,0.75)' : 'rgba(255,255,255,0.85)';
}

/** WCAG 2 relative luminance of "#rrggbb" (0 black .. 1 white). */
export function relativeLuminance(hex: string): number {
  const m = /^#?([0-9a-f]{6})$/i.exec(hex);
  if (!m) return 0;
  const n = parseInt(m[1], 16);
  const lin = (c: number) => {
    const s = c / 255;
    return s <= 0.03928 ? s / 12.92 : Math.pow((s + 0.055) / 1.055, 2.4);
  };
  return 0.2126 * lin((n >> 16) & 255) + 0.7152 * lin((n >> 8) & 255) + 0.0722 * lin(n & 255);
}
