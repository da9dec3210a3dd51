import { LossChart } from './chart/LossChart';
import { ExportMenu } from './export/ExportMenu';
import { RunList } from './runs/RunList';
import { SurfacePanel } from './surface/SurfacePanel';
import { RunTable } from './table/RunTable';
import { useActions, useApp } from './app-context';
import { ViewArea } from './view/ViewArea';

export function App() {
  const label = useApp((s) => s.surfaceInfo.label);
  const notice = useApp((s) => s.notice);
  const actions = useActions();
  return (
    <div className="app">
      <header className="app-header">
        <h1>Fall Line</h1>
        <span className="surface-name" data-testid="surface-name">
          {label}
        </span>
        <ExportMenu />
      </header>
      {notice && (
        <div className="notice" role="alert">
          {notice}{' '}
          <button type="button" onClick={() => actions.dismissNotice()}>
            Dismiss
          </button>
        </div>
      )}
      <div className="app-body">
        <aside className="sidebar sidebar-left">
          <SurfacePanel />
        </aside>
        <main className="main-column">
          <ViewArea />
          <div className="lower">
            <LossChart />
            <RunTable />
          </div>
        </main>
        <aside className="sidebar sidebar-right">
          <RunList />
        </aside>
      </div>
    </div>
  );
}
