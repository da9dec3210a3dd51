import { useId, useState } from 'react';
import { OPTIMIZERS, type OptimizerKind } from '../../engine';
import { PACES } from '../../store/pace';
import { useActions, useApp } from '../app-context';
import { RunEditor } from './RunEditor';
import { RunGlyph } from './RunGlyph';
import { progressText, statusText } from './status-text';
import { outcomeDetail } from '../../engine';

/** The runs: add, select, control, duplicate, remove; the selected run's settings below. */
export function RunList() {
  const actions = useActions();
  const runs = useApp((s) => s.workspace.runs);
  const status = useApp((s) => s.status);
  const selected = useApp((s) => s.selectedRunId);
  const pace = useApp((s) => s.workspace.pace);
  const startTarget = useApp((s) => s.startTarget);
  const [kind, setKind] = useState<OptimizerKind>('adam');
  const addId = useId();
  const paceId = useId();
  const selectedRun = runs.find((r) => r.id === selected);

  return (
    <section className="panel runs-panel" aria-label="Runs">
      <h2>Runs</h2>
      <div className="row">
        <label htmlFor={addId}>New run with</label>
        <select id={addId} value={kind} onChange={(e) => setKind(e.target.value as OptimizerKind)}>
          {OPTIMIZERS.map((o) => (
            <option key={o.kind} value={o.kind}>
              {o.label}
            </option>
          ))}
        </select>
        <button type="button" onClick={() => actions.addRun(kind)}>
          Add run
        </button>
      </div>
      <div className="row" role="group" aria-label="All runs">
        <button type="button" onClick={() => actions.controlAll('resume')} title="Resume all runs">
          Play
        </button>
        <button type="button" onClick={() => actions.controlAll('pause')} title="Pause all runs">
          Pause
        </button>
        <button type="button" onClick={() => actions.controlAll('step')} title="One step of every run">
          Step
        </button>
        <button type="button" onClick={() => actions.restartAll()} title="Restart every run from its start">
          Restart
        </button>
        <button type="button" onClick={() => actions.controlAll('cancel')} title="Stop every run">
          Cancel
        </button>
      </div>
      <div className="row">
        <label htmlFor={paceId}>Pace</label>
        <select id={paceId} value={String(pace)} onChange={(e) => actions.setPace(e.target.value === 'max' ? 'max' : Number(e.target.value))}>
          {PACES.map((p) => (
            <option key={String(p)} value={String(p)}>
              {p === 'max' ? 'as fast as possible' : `${p} steps/s`}
            </option>
          ))}
        </select>
      </div>
      <fieldset className="row">
        <legend>A click on the surface sets the start of</legend>
        <label>
          <input type="radio" name="start-target" checked={startTarget === 'all'} onChange={() => actions.setStartTarget('all')} /> every run
        </label>
        <label>
          <input type="radio" name="start-target" checked={startTarget === 'selected'} onChange={() => actions.setStartTarget('selected')} /> the selected run
        </label>
      </fieldset>
      <ul className="run-list">
        {runs.map((r) => {
          const st = status[r.id];
          const isSelected = r.id === selected;
          const running = st?.phase === 'running';
          return (
            <li key={r.id} className={isSelected ? 'run-item selected' : 'run-item'} data-run-id={r.id}>
              <div className="run-head">
                <button type="button" className="run-select" aria-pressed={isSelected} onClick={() => actions.selectRun(isSelected ? null : r.id)}>
                  <RunGlyph style={r.style} />
                  <span className="run-label" title={r.label}>{r.label}</span>
                </button>
                <div className="run-buttons" role="group" aria-label={`Controls of ${r.label}`}>
                  <IconButton label={`${running ? 'Pause' : 'Resume'} ${r.label}`} symbol={running ? '❚❚' : '▶'} onClick={() => actions.control(r.id, running ? 'pause' : 'resume')} />
                  <IconButton label={`One step of ${r.label}`} symbol="+1" onClick={() => actions.control(r.id, 'step')} />
                  <IconButton label={`Restart ${r.label}`} symbol="↺" onClick={() => actions.restart(r.id)} />
                  <IconButton label={`${r.hidden ? 'Show' : 'Hide'} ${r.label}`} symbol={r.hidden ? '○' : '◉'} pressed={r.hidden === true} onClick={() => actions.updateRun(r.id, { hidden: !r.hidden })} />
                  <IconButton label={`Duplicate ${r.label}`} symbol="⊞" onClick={() => actions.duplicateRun(r.id)} />
                  <IconButton label={`Remove ${r.label}`} symbol="✕" onClick={() => actions.removeRun(r.id)} />
                </div>
              </div>
              <div className="run-status" data-phase={st?.phase ?? 'none'} data-outcome={st?.summary.outcome?.kind} title={st?.summary.outcome ? outcomeDetail(st.summary.outcome) : undefined}>
                {statusText(st, r.optimizer.kind)}
              </div>
              <div className="run-progress" data-testid="run-progress">
                <progress max={r.settings.stop.maxSteps} value={st ? st.summary.steps : 0} aria-label={`Progress of ${r.label}`} />
                <span>{progressText(st, r.settings.stop.maxSteps)}</span>
              </div>
            </li>
          );
        })}
      </ul>
      {selectedRun ? <RunEditor run={selectedRun} /> : <p className="hint">Select a run to edit its settings.</p>}
    </section>
  );
}

/** A small button showing a symbol; its accessible name (and tooltip) says what it does to which run. */
function IconButton({ label, symbol, onClick, pressed }: { label: string; symbol: string; onClick(): void; pressed?: boolean }) {
  return (
    <button type="button" className="icon-button" onClick={onClick} aria-label={label} title={label} aria-pressed={pressed}>
      <span aria-hidden="true">{symbol}</span>
    </button>
  );
}
