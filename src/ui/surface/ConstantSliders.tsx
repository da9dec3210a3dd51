import { catalogueEntry, type SurfaceSpec } from '../../problems';
import { useActions, useApp } from '../app-context';

interface SliderRange {
  name: string;
  label: string;
  min: number;
  max: number;
  step: number;
}

/** One slider per named constant; moving it rebuilds the surface and restarts the runs. */
export function ConstantSliders() {
  const actions = useActions();
  const surface = useApp((s) => s.workspace.surface);
  if (surface.kind === 'datafit') return null;
  const ranges = sliderRanges(surface);
  if (!ranges.length) return null;
  const values = { ...(surface.kind === 'catalogue' ? catalogueEntry(surface.id).constants : {}), ...(surface.constants ?? {}) };
  return (
    <fieldset className="constants">
      <legend>Named constants</legend>
      {ranges.map((r) => {
        const id = `constant-${r.name}`;
        return (
          <div className="field field-slider" key={r.name}>
            <label htmlFor={id}>{r.label}</label>
            <input
              id={id}
              type="range"
              min={r.min}
              max={r.max}
              step={r.step}
              value={values[r.name] ?? 0}
              onChange={(e) => actions.setConstant(r.name, Number(e.target.value))}
            />
            <output htmlFor={id}>{values[r.name]}</output>
          </div>
        );
      })}
    </fieldset>
  );
}

function sliderRanges(surface: Exclude<SurfaceSpec, { kind: 'datafit' }>): SliderRange[] {
  if (surface.kind === 'catalogue') {
    return (catalogueEntry(surface.id).constantInfo ?? []).map((c) => ({ ...c, step: c.step ?? (c.max - c.min) / 100 }));
  }
  // A typed formula's constants: a range set by the value's order of magnitude, so it stays put while
  // the slider moves within it: [0, 2m] for v >= 0, [-2m, 2m] otherwise, m = 10^ceil(log10 max(|v|, 1)).
  return Object.entries(surface.constants ?? {}).map(([name, v]) => {
    const m = 10 ** Math.ceil(Math.log10(Math.max(Math.abs(v), 1)));
    return { name, label: name, min: v >= 0 ? 0 : -2 * m, max: 2 * m, step: m / 100 };
  });
}
