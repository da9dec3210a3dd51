import { createRoot } from 'react-dom/client';
import { createAppStore, workspaceChanged, workspaceOf } from './store/app-store';
import { workerLink } from './store/engine-link';
import { loadSavedWorkspace, saveWorkspace } from './store/persistence';
import { App } from './ui/App';
import { createPageGridPool } from './worker/pool-web';
import { AppContext } from './ui/app-context';
import './ui/styles.css';

const saved = loadSavedWorkspace(window.localStorage);
const app = createAppStore({
  link: workerLink(),
  grids: createPageGridPool(),
  requestFrame: (fn) => requestAnimationFrame(() => fn()),
  initial: saved.workspace ?? undefined,
});

// Work is never lost: the workspace is saved shortly after every change.
let saveTimer = 0;
let lastSaved = '';
app.store.subscribe((state, previous) => {
  if (!workspaceChanged(state, previous)) return;
  window.clearTimeout(saveTimer);
  saveTimer = window.setTimeout(() => {
    const workspace = workspaceOf(state);
    const text = JSON.stringify(workspace);
    if (text === lastSaved) return;
    lastSaved = text;
    const problem = saveWorkspace(window.localStorage, workspace);
    if (problem) app.store.setState({ notice: problem });
  }, 300);
});
if (saved.problem) app.store.setState({ notice: saved.problem });

createRoot(document.getElementById('root')!).render(
  <AppContext.Provider value={app}>
    <App />
  </AppContext.Provider>,
);
