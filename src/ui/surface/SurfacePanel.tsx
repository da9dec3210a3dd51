import { useId, useState } from 'react';
import { CATALOGUE, catalogueEntry, type SurfaceSpec } from '../../problems';
import { surfaceMessage } from '../messages';
import { DataFitEditor } from './datafit/DataFitEditor';
import { useActions, useApp } from '../app-context';
import { ConstantSliders } from './ConstantSliders';
import { FormulaEditor } from './FormulaEditor';
import { SliceControls } from './SliceControls';

/** Choose the surface: a catalogue test function or a typed formula; its constants; the slice. */
export function SurfacePanel() {
  const actions = useActions();
  const surface = useApp((s) => s.workspace.surface);
  const surfaceError = useApp((s) => s.surfaceError);
  const [mode, setMode] = useState<SurfaceSpec['kind']>(surface.kind);
  const id = useId();
  const entry = surface.kind === 'catalogue' ? catalogueEntry(surface.id) : null;

  return (
    <section className="panel" aria-label="Surface">
      <h2>Surface</h2>
      <div className="segmented" role="radiogroup" aria-label="Kind of surface">
        <label>
          <input type="radio" name={`${id}-mode`} checked={mode === 'catalogue'} onChange={() => setMode('catalogue')} /> Test function
        </label>
        <label>
          <input type="radio" name={`${id}-mode`} checked={mode === 'formula'} onChange={() => setMode('formula')} /> Your formula
        </label>
        <label>
          <input type="radio" name={`${id}-mode`} checked={mode === 'datafit'} onChange={() => setMode('datafit')} /> Model on data
        </label>
      </div>
      {mode === 'catalogue' ? (
        <div className="field">
          <label htmlFor={`${id}-entry`}>Catalogue entry</label>
          <select id={`${id}-entry`} value={entry?.id ?? ''} onChange={(e) => actions.setSurface({ kind: 'catalogue', id: e.target.value })}>
            {!entry && <option value="">(choose one)</option>}
            {CATALOGUE.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label}
              </option>
            ))}
          </select>
          {entry && (
            <details className="entry-notes">
              <summary className="mono">{entry.formula}</summary>
              <p>{entry.notes}</p>
              <p className="field-help">Source: {entry.source}</p>
            </details>
          )}
        </div>
      ) : mode === 'formula' ? (
        <FormulaEditor initial={surface.kind === 'formula' ? surface : null} />
      ) : (
        <DataFitEditor initial={surface.kind === 'datafit' ? surface : null} />
      )}
      {surfaceError && (
        <div className="field-error" role="alert">
          {surfaceMessage(surfaceError)}
        </div>
      )}
      {/* The constants and slice belong to the surface shown: hidden while a form for another kind is open. */}
      {mode === surface.kind && (
        <>
          <ConstantSliders />
          <SliceControls />
        </>
      )}
    </section>
  );
}
