import { useEffect, useRef } from 'react';
import { drawLegend } from '../plot';
import { useApp } from '../app-context';
import { useSurfacePicture } from './picture';

const WIDTH = 96;
const HEIGHT = 220;

/**
 * The colour bar of the panel grid: every panel shows the same grid with the same levels, so one bar
 * with the loss values at its ticks serves them all (the single map draws its own beside the plot).
 */
export function ColourBar() {
  const grid = useApp((s) => s.grid);
  const display = useApp((s) => s.workspace.display);
  const info = useApp((s) => s.surfaceInfo);
  const picture = useSurfacePicture(grid, display, info.logScaleOffset);
  const canvas = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    const c = canvas.current;
    const ctx = c?.getContext('2d');
    if (!c || !ctx) return;
    ctx.clearRect(0, 0, c.width, c.height);
    if (picture) drawLegend(ctx, picture.legend, { px: 14, py: 18, width: 14, height: HEIGHT - 30 }, 'loss');
    c.dataset.drawn = picture ? 'legend' : 'empty';
  }, [picture]);
  return <canvas ref={canvas} width={WIDTH} height={HEIGHT} className="panel-colour-bar" data-testid="panel-colour-bar" role="img" aria-label="Colour bar: loss values of the contour colours" />;
}
