/**
 * The part of CanvasRenderingContext2D the drawing functions use. A real 2-D context satisfies it; tests
 * pass a small recording fake. The caller owns the context state outside each call: every drawing
 * function saves and restores what it changes.
 */
export type DrawingContext = Pick<
  CanvasRenderingContext2D,
  | 'save'
  | 'restore'
  | 'beginPath'
  | 'closePath'
  | 'moveTo'
  | 'lineTo'
  | 'arc'
  | 'rect'
  | 'fill'
  | 'stroke'
  | 'clip'
  | 'fillRect'
  | 'fillText'
  | 'strokeText'
  | 'translate'
  | 'rotate'
  | 'setLineDash'
  | 'fillStyle'
  | 'strokeStyle'
  | 'lineWidth'
  | 'lineJoin'
  | 'lineCap'
  | 'font'
  | 'textAlign'
  | 'textBaseline'
  | 'globalAlpha'
>;

/** Shared look of text and frame lines, used by the canvas and SVG renderers alike. */
export const PLOT_STYLE = {
  fontFamily: 'system-ui, -apple-system, "Segoe UI", Roboto, sans-serif',
  tickFontSize: 11,
  titleFontSize: 13,
  textColour: '#222222',
  frameColour: '#444444',
  tickLength: 5,
  /** Background shown where grid values are missing (NaN or infinite). */
  missingColour: '#d9d9d9',
} as const;

export function canvasFont(sizePx: number, weight: 'normal' | 'bold' = 'normal'): string {
  return `${weight === 'bold' ? 'bold ' : ''}${sizePx}px ${PLOT_STYLE.fontFamily}`;
}
