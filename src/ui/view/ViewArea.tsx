import { useId, useRef, useState } from 'react';
import { OPTIMIZERS, type OptimizerKind } from '../../engine';
import type { PanelMode } from '../../store/workspace';
import { useActions, useApp, useLiveRuns, useStoreApi } from '../app-context';
import { FigureExport } from '../figure/FigureExport';
import { mapFigureWhenDrawn } from '../figure/views/map-figures';
import { DisplayControls } from './DisplayControls';
import { PanelGrid } from './PanelGrid';
import { SurfaceView } from './SurfaceView';
import { useElementSize } from './use-canvas-size';

const MODES: { mode: PanelMode; label: string }[] = [
  { mode: 'single', label: 'All runs on one map' },
  { mode: 'per-run', label: 'One panel per run' },
  { mode: 'table', label: 'Optimizer × learning rate' },
];

/** The drawing area: one overlaid map or the panel grid, with the display controls above. */
export function ViewArea() {
  const actions = useActions();
  const panels = useApp((s) => s.workspace.panels);
  const id = useId();
  const store = useStoreApi();
  const live = useLiveRuns();
  const drawing = useRef<HTMLDivElement>(null);
  const size = useElementSize(drawing);
  return (
    <section className="view-area" aria-label="Surface view">
      <div className="view-toolbar">
        <div className="segmented" role="tablist" aria-label="Layout">
          {MODES.map((m) => (
            <button key={m.mode} type="button" role="tab" aria-selected={panels.mode === m.mode} onClick={() => actions.setPanels({ mode: m.mode })}>
              {m.label}
            </button>
          ))}
        </div>
        <DisplayControls />
        <FigureExport name="View" fileName={`fall-line-${panels.mode === 'single' ? 'view' : panels.mode === 'per-run' ? 'panels' : 'table'}`} screenSize={() => size} figure={() => mapFigureWhenDrawn(store.getState, live)} />
      </div>
      {panels.mode === 'table' && <TableSettings id={id} />}
      <div ref={drawing}>{panels.mode === 'single' ? <SurfaceView /> : <PanelGrid />}</div>
    </section>
  );
}

function TableSettings({ id }: { id: string }) {
  const actions = useActions();
  const panels = useApp((s) => s.workspace.panels);
  const toggle = (kind: OptimizerKind) =>
    actions.setPanels({ tableOptimizers: panels.tableOptimizers.includes(kind) ? panels.tableOptimizers.filter((k) => k !== kind) : [...panels.tableOptimizers, kind] });
  const rates = panels.tableLearningRates.join(', ');
  return (
    <div className="table-settings">
      <fieldset>
        <legend>Rows: optimizers</legend>
        {OPTIMIZERS.map((o) => (
          <label key={o.kind} className="chip">
            <input type="checkbox" checked={panels.tableOptimizers.includes(o.kind)} onChange={() => toggle(o.kind)} /> {o.label}
          </label>
        ))}
      </fieldset>
      <RatesField id={id} initial={rates} />
      <button type="button" onClick={() => actions.buildTableRuns()} disabled={!panels.tableOptimizers.length || !panels.tableLearningRates.length}>
        Build table runs ({panels.tableOptimizers.length * panels.tableLearningRates.length})
      </button>
    </div>
  );
}

function RatesField({ id, initial }: { id: string; initial: string }) {
  const actions = useActions();
  const [text, setText] = useState(initial);
  const [error, setError] = useState<string | null>(null);
  function commit() {
    const rates = text.split(/[,\s]+/).filter(Boolean).map(Number);
    if (rates.length > 12) return setError('learning rates: at most 12 columns');
    if (rates.some((r) => !(r > 0 && Number.isFinite(r)))) return setError(`learning rates: each must be a positive number, got "${text}"`);
    const twice = rates.find((r, k) => rates.indexOf(r) !== k);
    if (twice !== undefined) return setError(`learning rates: ${twice} is listed twice (each column needs its own rate)`);
    setError(null);
    actions.setPanels({ tableLearningRates: rates });
  }
  return (
    <div className="field">
      <label htmlFor={`${id}-rates`}>Columns: learning rates</label>
      <input
        id={`${id}-rates`}
        className="mono"
        type="text"
        value={text}
        aria-invalid={error ? true : undefined}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => e.key === 'Enter' && commit()}
      />
      {error && (
        <div className="field-error" role="alert">
          {error}
        </div>
      )}
    </div>
  );
}
