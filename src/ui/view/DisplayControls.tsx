import { KnownPointKey } from './KnownPointKey';
import { useId } from 'react';
import { equalScaleOn } from '../../store/equal-scale';
import { useActions, useApp } from '../app-context';

/** Colour scale, contour levels, colour map, grid resolution, equal scale and overlays. */
export function DisplayControls() {
  const actions = useActions();
  const d = useApp((s) => s.workspace.display);
  const equal = useApp((s) => equalScaleOn(s.workspace.display, s.workspace.surface, s.surfaceInfo.variables.length));
  const id = useId();
  return (
    <div className="display-controls" role="group" aria-label="Display">
      <label htmlFor={`${id}-scale`}>Colour scale</label>
      <select id={`${id}-scale`} value={d.scale} onChange={(e) => actions.setDisplay({ scale: e.target.value as 'log' | 'linear' })}>
        <option value="log">log</option>
        <option value="linear">linear</option>
      </select>
      <label htmlFor={`${id}-levels`}>Levels</label>
      <input id={`${id}-levels`} type="range" min={4} max={64} step={1} value={d.levels} onChange={(e) => actions.setDisplay({ levels: Number(e.target.value) })} />
      <output htmlFor={`${id}-levels`}>{d.levels}</output>
      <label htmlFor={`${id}-map`}>Colours</label>
      <select id={`${id}-map`} value={d.colourMap} onChange={(e) => actions.setDisplay({ colourMap: e.target.value as 'viridis' | 'cividis' })}>
        <option value="viridis">viridis</option>
        <option value="cividis">cividis</option>
      </select>
      <label htmlFor={`${id}-res`}>Grid</label>
      <select id={`${id}-res`} value={d.resolution} onChange={(e) => actions.setDisplay({ resolution: Number(e.target.value) })}>
        {[64, 128, 192, 256, 384].map((r) => (
          <option key={r} value={r}>
            {r} × {r}
          </option>
        ))}
      </select>
      <label title="One unit of the horizontal and of the vertical axis cover the same pixels, so paths cross contours at their true angles; the shown box widens on one axis to fill the panel.">
        <input type="checkbox" checked={equal} onChange={(e) => actions.setDisplay({ equalScale: e.target.checked })} /> equal scale
      </label>
      <label>
        <input type="checkbox" checked={d.showArrows} onChange={(e) => actions.setDisplay({ showArrows: e.target.checked })} /> descent arrows
      </label>
      <label>
        <input type="checkbox" checked={d.showKnownPoints} onChange={(e) => actions.setDisplay({ showKnownPoints: e.target.checked })} /> known minima and saddles
      </label>
      {d.showKnownPoints && <KnownPointKey />}
    </div>
  );
}
