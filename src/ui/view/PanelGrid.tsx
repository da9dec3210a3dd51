import { optimizerInfo, optimizerLabel } from '../../engine';
import { useApp } from '../app-context';
import { ColourBar } from './ColourBar';
import { SurfaceView } from './SurfaceView';

/**
 * The same surface in small panels, one per run, or one per cell of the optimizer x learning-rate table.
 * Every panel shows the shared view, so zoom, pan and the hover crosshair are linked across panels.
 */
export function PanelGrid() {
  const runs = useApp((s) => s.workspace.runs);
  const panels = useApp((s) => s.workspace.panels);
  if (panels.mode === 'table') {
    const cells = runs.filter((r) => r.cell);
    if (!cells.length) return <p className="hint">Set the table's optimizers and learning rates, then build its runs.</p>;
    const columns = panels.tableLearningRates.length;
    return (
      <div className="panel-grid-with-bar">
      <div className="panel-grid" style={{ gridTemplateColumns: `auto repeat(${columns}, minmax(0, 1fr))` }} data-testid="panel-grid">
        <div />
        {panels.tableLearningRates.map((lr) => (
          <div key={lr} className="panel-grid-head">
            learning rate {lr}
          </div>
        ))}
        {panels.tableOptimizers.map((kind, row) => {
          const rowRuns = cells.filter((r) => r.cell!.row === row).sort((a, b) => a.cell!.column - b.cell!.column);
          return <TableRow key={`${kind}-${row}`} label={rowRuns[0] ? optimizerLabel(rowRuns[0].optimizer) : optimizerInfo(kind).label} runs={rowRuns} />;
        })}
      </div>
      <ColourBar />
      </div>
    );
  }
  const visible = runs.filter((r) => !r.hidden);
  return (
    <div className="panel-grid-with-bar">
      <div className="panel-grid" style={{ gridTemplateColumns: `repeat(${Math.min(3, Math.max(1, visible.length))}, minmax(0, 1fr))` }} data-testid="panel-grid">
        {visible.map((r) => (
          <SurfaceView key={r.id} runIds={[r.id]} title={r.label} compact />
        ))}
      </div>
      <ColourBar />
    </div>
  );
}

function TableRow({ label, runs }: { label: string; runs: { id: string; label: string }[] }) {
  return (
    <>
      <div className="panel-grid-head panel-grid-row-head">{label}</div>
      {runs.map((r) => (
        <SurfaceView key={r.id} runIds={[r.id]} title={r.label} compact />
      ))}
    </>
  );
}
