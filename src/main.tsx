import { createRoot } from 'react-dom/client';
import { createAppStore, workspaceChanged, workspaceOf } from './store/app-store';
import { workerLink } from './store/engine-link';
import { loadSavedWorkspace, openStorage, saveWorkspace } from './store/persistence';
import { App } from './ui/App';
import { createPageGridPool, createPageWorkers } from './client/pool-web';
import { StudyPool } from './client/study-pool';
import { AppContext } from './ui/app-context';
import { createStudyStore } from './store/study-store';
import { StudyContext } from './ui/study/study-context';
import './ui/styles.css';

const opened = openStorage(() => window.localStorage);
const saved = opened.storage ? loadSavedWorkspace(opened.storage) : { workspace: null, problem: opened.problem, saving: false };
// One set of pool workers for grids and studies; runs stream in the engine worker beside them.
const workers = createPageWorkers();
const app = createAppStore({
  link: workerLink({ name: 'engine', watchSilence: true }),
  grids: createPageGridPool(workers),
  requestFrame: (fn) => requestAnimationFrame(() => fn()),
  initial: saved.workspace ?? undefined,
});

// Work is never lost: the workspace is saved shortly after every change.
let saveTimer = 0;
let lastSaved = '';
app.store.subscribe((state, previous) => {
  if (!saved.saving || !opened.storage || !workspaceChanged(state, previous)) return;
  const storage = opened.storage;
  window.clearTimeout(saveTimer);
  saveTimer = window.setTimeout(() => {
    const workspace = workspaceOf(state);
    const text = JSON.stringify(workspace);
    if (text === lastSaved) return;
    const problem = saveWorkspace(storage, workspace);
    if (problem) app.store.setState({ notice: problem });
    else lastSaved = text;
  }, 300);
});
if (saved.problem) app.store.setState({ notice: saved.problem });

// Studies are split across the pool workers (src/client/study-pool.ts).
const study = createStudyStore(new StudyPool(workers));

createRoot(document.getElementById('root')!).render(
  <AppContext.Provider value={app}>
    <StudyContext.Provider value={study}>
      <App />
    </StudyContext.Provider>
  </AppContext.Provider>,
);
