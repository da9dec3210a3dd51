import { useMemo, useState } from 'react';
import { reportedUnits } from '../../store/units';
import { useActions, useApp } from '../app-context';
import { NumberField } from '../fields/NumberField';
import { RunGlyph } from '../runs/RunGlyph';
import { useMainThreadSurface } from '../view/use-surface';
import { defaultColumnIds, fullNumber, nextSort, resultColumns, sortRows, tableTsv, type ResultColumn } from './columns';
import { resultRows } from './rows';

/** One row per run: how it ended, how far it got, and how close to a known minimum (original units). */
/** Final points with at most this many coordinates have every digit in their cell's tooltip. */
const FULL_POINT_IN_TOOLTIP = 16;

export function RunTable() {
  const actions = useActions();
  const runs = useApp((s) => s.workspace.runs);
  const status = useApp((s) => s.status);
  const info = useApp((s) => s.surfaceInfo);
  const tolerance = useApp((s) => s.workspace.tolerance);
  const table = useApp((s) => s.table);
  const spec = useApp((s) => s.workspace.surface);
  const surface = useMainThreadSurface(spec);
  const units = useMemo(() => reportedUnits(surface), [surface]);
  const hasGlobal = info.knownPoints.some((p) => p.kind === 'global-min');
  const all = useMemo(() => resultColumns(info.variables), [info.variables]);
  const chosen = table.columns ?? defaultColumnIds(info.variables, hasGlobal);
  const columns = all.filter((c) => chosen.includes(c.id));
  const rows = sortRows(resultRows({ workspace: { runs }, status, surfaceInfo: info }, units), all, table.sort);
  const [copied, setCopied] = useState<string | null>(null);
  // The chooser's boxes are rendered only while it is open: a network has a column per parameter, and
  // a thousand hidden checkboxes re-rendered with every streamed update of the table.
  const [choosing, setChoosing] = useState(false);

  const toggle = (id: string) => actions.setTableColumns(chosen.includes(id) ? chosen.filter((c) => c !== id) : all.filter((c) => c.id === id || chosen.includes(c.id)).map((c) => c.id));
  const sortOf = (c: ResultColumn) => (table.sort?.column === c.id ? table.sort.direction : 'none');
  async function copy() {
    try {
      await navigator.clipboard.writeText(tableTsv(rows, columns));
      setCopied('copied at full precision');
    } catch {
      setCopied('the browser did not allow copying');
    }
  }

  return (
    <section className="panel table-panel" aria-label="Results">
      <div className="panel-head">
        <h2>Results</h2>
        {units.standardised && <span className="field-help">in the data's original units</span>}
        {hasGlobal && (
          <NumberField
            compact
            label="tolerance for 'steps to minimum'"
            value={tolerance}
            onCommit={(v) => {
              if (v === undefined || !(v >= 0)) return 'tolerance: must be a number >= 0';
              actions.setTolerance(v);
              return null;
            }}
          />
        )}
        <details className="column-chooser" onToggle={(e) => setChoosing(e.currentTarget.open)}>
          <summary>Columns ({columns.length} of {all.length})</summary>
          {choosing && (
          <fieldset>
            <legend>Show columns</legend>
            {all.map((c) => (
              <label key={c.id} className="chip">
                <input type="checkbox" checked={chosen.includes(c.id)} onChange={() => toggle(c.id)} /> {c.label}
              </label>
            ))}
            <button type="button" onClick={() => actions.setTableColumns(null)}>
              Default columns
            </button>
          </fieldset>
          )}
        </details>
        <button type="button" onClick={copy} title="Copy the shown columns as tab-separated text with every digit">
          Copy table
        </button>
        {copied && <span className="field-help" role="status">{copied}</span>}
      </div>
      <div className="table-scroll">
        <table
          className="run-table"
          data-testid="run-table"
          onCopy={(e) => {
            // A selection in the table copies the rows it touches at full precision, not the compact text.
            const selection = window.getSelection();
            if (!selection || selection.isCollapsed) return;
            const picked = rows.filter((r) => {
              const tr = e.currentTarget.querySelector(`tr[data-run-id="${CSS.escape(r.id)}"]`);
              return tr && selection.containsNode(tr, true);
            });
            if (!picked.length) return;
            e.preventDefault();
            e.clipboardData.setData('text/plain', tableTsv(picked, columns));
          }}
        >
          <thead>
            <tr>
              <th scope="col">Run</th>
              {columns.map((c) => (
                <th key={c.id} scope="col" aria-sort={sortOf(c)} data-col={c.id} title={c.title}>
                  <button type="button" className="sort-button" onClick={() => actions.setTableSort(nextSort(table.sort, c.id))}>
                    {c.label}
                    <span aria-hidden="true">{sortOf(c) === 'ascending' ? ' ▲' : sortOf(c) === 'descending' ? ' ▼' : ''}</span>
                  </button>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.id} data-run-id={r.id}>
                <th scope="row" title={r.label}>
                  <RunGlyph style={r.style} /> {r.label}
                </th>
                {columns.map((c) => {
                  // A network's final point has a thousand coordinates: its every digit is in Copy table
                  // and the CSV, not in a tooltip rebuilt on every streamed update.
                  const long = c.id === 'final-point' && r.point.length > FULL_POINT_IN_TOOLTIP;
                  const v = long ? null : c.value(r);
                  const full = v === null ? undefined : typeof v === 'number' ? fullNumber(v) : v;
                  const title = c.id === 'outcome' ? r.outcomeTitle : long ? `${r.point.length} values; Copy table and Results CSV give every digit` : full;
                  return (
                    <td
                      key={c.id}
                      data-col={c.id}
                      data-value={full ?? ''}
                      data-outcome={c.id === 'outcome' ? r.outcomeKind : undefined}
                      className={c.numeric || c.id === 'final-point' || c.id === 'nearest' ? 'mono num' : undefined}
                      title={title}
                    >
                      {c.text(r)}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
