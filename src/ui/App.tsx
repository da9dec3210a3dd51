import type { DataFitSpec } from '../problems';
import { LossChart } from './chart/LossChart';
import { ProfileChart } from './chart/ProfileChart';
import { DataView } from './data/DataView';
import { ExportMenu } from './export/ExportMenu';
import { RunList } from './runs/RunList';
import { SurfacePanel } from './surface/SurfacePanel';
import { RunTable } from './table/RunTable';
import { StudyArea } from './study/StudyArea';
import { useActions, useApp } from './app-context';
import { PanelBoundary } from './PanelBoundary';
import { noticeMessage } from './messages';
import { useAfterPaint } from './use-after-paint';
import { ViewArea } from './view/ViewArea';

export function App() {
  const label = useApp((s) => s.surfaceInfo.label);
  const notice = useApp((s) => s.notice);
  const surface = useApp((s) => s.workspace.surface);
  const actions = useActions();
  return (
    <div className="app">
      <header className="app-header">
        <h1>Fall Line</h1>
        <span className="surface-name" data-testid="surface-name" title={label}>
          {label}
        </span>
        <ExportMenu />
      </header>
      {notice && (
        <div className="notice" role="alert">
          {noticeMessage(notice)}{' '}
          <button type="button" onClick={() => actions.dismissNotice()}>
            Dismiss
          </button>
        </div>
      )}
      <div className="app-body">
        <aside className="sidebar sidebar-left">
          <PanelBoundary name="The surface panel">
            <SurfacePanel />
          </PanelBoundary>
        </aside>
        <main className="main-column">
          {/* One tree for both layouts, so switching to a data fit keeps the surface view (its canvases
              and controls) instead of building it again in the same task as the data column. */}
          <div className={surface.kind === 'datafit' ? 'view-with-data' : 'view-alone'}>
            <PanelBoundary name="The surface view">
              <ViewArea />
            </PanelBoundary>
            {surface.kind === 'datafit' && <DataColumn spec={surface} />}
          </div>
          <div className="lower">
            <PanelBoundary name="The loss chart">
              <LossChart />
            </PanelBoundary>
            <PanelBoundary name="The results table">
              <RunTable />
            </PanelBoundary>
          </div>
          <PanelBoundary name="The studies">
            <StudyArea />
          </PanelBoundary>
        </main>
        <aside className="sidebar sidebar-right">
          <PanelBoundary name="The run list">
            <RunList />
          </PanelBoundary>
        </aside>
      </div>
    </div>
  );
}

/** The data view and the line profile beside the map, mounted a task after the column itself (useAfterPaint). */
function DataColumn({ spec }: { spec: DataFitSpec }) {
  const ready = useAfterPaint();
  return (
    <div className="data-column" aria-busy={!ready}>
      {ready && (
        <>
          <PanelBoundary name="The data view">
            <DataView spec={spec} />
          </PanelBoundary>
          <PanelBoundary name="The line profile">
            <ProfileChart />
          </PanelBoundary>
        </>
      )}
    </div>
  );
}
