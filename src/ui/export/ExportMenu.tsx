import { useRef } from 'react';
import { parseWorkspace } from '../../io/workspace-schema';
import { workspaceOf } from '../../store/app-store';
import { useActions, useLiveRuns, useStoreApi } from '../app-context';
import { download } from './download';
import { resultsCsv, trajectoriesCsv } from './exports';

export function ExportMenu() {
  const store = useStoreApi();
  const live = useLiveRuns();
  const actions = useActions();
  const fileRef = useRef<HTMLInputElement>(null);
  const guard = (f: () => void | Promise<void>) => async () => {
    try {
      await f();
    } catch (e) {
      store.setState({ notice: `Export failed: ${e instanceof Error ? e.message : String(e)}` });
    }
  };
  return (
    <div className="export-menu" role="group" aria-label="Export">
      <button type="button" onClick={guard(() => download('fall-line-trajectories.csv', trajectoriesCsv(store.getState(), live), 'text/csv'))}>
        Trajectories CSV
      </button>
      <button type="button" onClick={guard(() => download('fall-line-results.csv', resultsCsv(store.getState()), 'text/csv'))}>
        Results CSV
      </button>
      <button type="button" onClick={guard(() => download('experiment.fall.json', JSON.stringify(workspaceOf(store.getState()), null, 2), 'application/json'))}>
        Save experiment
      </button>
      <label className="file">
        Open experiment
        <input
          ref={fileRef}
          className="visually-hidden"
          type="file"
          accept=".json,application/json"
          onChange={async (e) => {
            const file = e.target.files?.[0];
            if (!file) return;
            const parsed = parseWorkspace(await file.text());
            if (parsed.ok) actions.loadWorkspace(parsed.workspace);
            else store.setState({ notice: `${file.name} is not a Fall Line experiment: ${parsed.error}` });
            if (fileRef.current) fileRef.current.value = '';
          }}
        />
      </label>
    </div>
  );
}
