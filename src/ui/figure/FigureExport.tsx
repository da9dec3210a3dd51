import { useId, useState } from 'react';
import type { PixelSize } from '../plot';
import { download } from '../export/download';
import type { Figure } from './compose';
import { FIGURE_LIMITS, figurePng, figureSvg, parseFigureSide, PIXEL_RATIOS, pngSizeProblem, type PixelRatio } from './render';

export interface FigureExportProps {
  /** What is exported, e.g. "View" or "Loss chart": the buttons are named "<name> PNG" and "<name> SVG". */
  name: string;
  /** File name without extension. */
  fileName: string;
  /** The on-screen size of the view (the default figure size). */
  screenSize: () => PixelSize | null;
  /** The figure as the view shows it now (once what it draws is ready), or null when there is nothing to export yet. */
  figure: () => Figure | null | Promise<Figure | null>;
  disabled?: boolean;
}

/**
 * PNG and SVG buttons for one view, with the figure's size (CSS pixels, empty = the on-screen size)
 * and the PNG's pixel ratio under a "size" disclosure. A bad size is reported beside the fields and
 * holds the buttons back.
 */
export function FigureExport({ name, fileName, screenSize, figure, disabled }: FigureExportProps) {
  const id = useId();
  const [width, setWidth] = useState('');
  const [height, setHeight] = useState('');
  const [ratio, setRatio] = useState<PixelRatio>(2);
  const [problem, setProblem] = useState<string | null>(null);
  const screen = screenSize();
  const side = (name: 'width' | 'height', text: string, fallback: number | undefined) =>
    text.trim() === '' ? { value: clampSide(fallback ?? 800) } : parseFigureSide(name, text);
  const w = side('width', width, screen?.width);
  const h = side('height', height, screen?.height);
  const widthValue = 'value' in w ? w.value : null;
  const heightValue = 'value' in h ? h.value : null;
  const problems = [w, h].flatMap((r) => ('error' in r ? [r.error] : []));
  const pngProblem = widthValue !== null && heightValue !== null ? pngSizeProblem({ width: widthValue, height: heightValue }, ratio) : null;

  const run = async (kind: 'png' | 'svg') => {
    setProblem(null);
    if (widthValue === null || heightValue === null) return;
    try {
      const f = await figure();
      if (!f) return setProblem(`${name}: nothing to export yet`);
      const size = { width: widthValue, height: heightValue };
      if (kind === 'png') download(`${fileName}.png`, await figurePng(f, size, ratio));
      else download(`${fileName}.svg`, figureSvg(f, size), 'image/svg+xml');
    } catch (e) {
      setProblem(`${name} ${kind.toUpperCase()} failed: ${e instanceof Error ? e.message : String(e)}`);
    }
  };

  return (
    <div className="figure-export" role="group" aria-label={`${name} figure`}>
      <button type="button" aria-label={`${name} PNG`} disabled={disabled || problems.length > 0 || !!pngProblem} onClick={() => run('png')}>PNG</button>
      <button type="button" aria-label={`${name} SVG`} disabled={disabled || problems.length > 0} onClick={() => run('svg')}>SVG</button>
      <details>
        <summary>size</summary>
        <label htmlFor={`${id}-w`}>width</label>
        <input id={`${id}-w`} type="text" inputMode="numeric" size={5} value={width} placeholder={screen ? String(clampSide(screen.width)) : ''} aria-invalid={'error' in w ? true : undefined} aria-label={`${name} figure width`} onChange={(e) => setWidth(e.target.value)} />
        <label htmlFor={`${id}-h`}>height</label>
        <input id={`${id}-h`} type="text" inputMode="numeric" size={5} value={height} placeholder={screen ? String(clampSide(screen.height)) : ''} aria-invalid={'error' in h ? true : undefined} aria-label={`${name} figure height`} onChange={(e) => setHeight(e.target.value)} />
        px
        <label htmlFor={`${id}-r`}>PNG pixel ratio</label>
        <select id={`${id}-r`} value={ratio} aria-label={`${name} PNG pixel ratio`} onChange={(e) => setRatio(Number(e.target.value) as PixelRatio)}>
          {PIXEL_RATIOS.map((r) => <option key={r} value={r}>{r}</option>)}
        </select>
      </details>
      {(problems.length > 0 || pngProblem) && <span className="field-error" role="alert">{[...problems, ...(pngProblem ? [pngProblem] : [])].join('; ')}</span>}
      {problem && <span className="field-error" role="alert">{problem}</span>}
    </div>
  );
}

/** An on-screen size brought inside the exportable range. */
function clampSide(v: number): number {
  return Math.min(FIGURE_LIMITS.max, Math.max(FIGURE_LIMITS.min, Math.round(v)));
}

/** An element's CSS size now (for `screenSize`), or null before it is on the page. */
export function sizeOf(el: Element | null): PixelSize | null {
  const r = el?.getBoundingClientRect();
  return r && r.width > 0 && r.height > 0 ? { width: Math.round(r.width), height: Math.round(r.height) } : null;
}
