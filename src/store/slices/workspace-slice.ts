/** Surface and whole-workspace actions: a new surface or constant, panels, studies, loading a workspace. */
import type { SurfaceSpec } from '../../problems';
import { defaultTable, type SurfaceInfo, type WorkspaceActions } from '../app-state';
import { drawableSurface, insideBox, suggestedStart, viewFor } from '../surface-info';
import type { SliceSettings } from '../workspace';
import type { SliceContext } from './context';

export function workspaceSlice(ctx: SliceContext): WorkspaceActions {
  const { get, set, setWorkspace, live } = ctx;

  function applySurface(spec: SurfaceSpec, keepView: boolean): void {
    const info = drawableSurface(spec); // throws a specific error for a bad spec before anything changes
    const s = get();
    const n = info.variables.length;
    const sameShape = n === s.surfaceInfo.variables.length;
    // A start is kept while it lies in the new surface's box; elsewhere the run would start out of view.
    const keepStart = (start: number[]) => sameShape && (keepView || insideBox(start, info.view));
    const runs = s.workspace.runs.map((r) => (keepStart(r.settings.start) ? r : { ...r, settings: { ...r.settings, start: suggestedStart(info) } }));
    // The other variables are held at the selected (else the first) run's start, so the slice goes through a run.
    const held = (runs.find((r) => r.id === s.selectedRunId) ?? runs[0])?.settings.start ?? info.view.map(([lo, hi]) => (lo + hi) / 2);
    const slice: SliceSettings = sameShape && !s.workspace.slice.plane ? s.workspace.slice : { axes: [0, 1], at: held.slice(), plane: null };
    const view = keepView && sameShape ? s.workspace.view : viewFor(info.view, slice.axes);
    // A new surface starts from its own equal-scale default (on for two-variable test functions).
    const { equalScale: _choice, ...display } = s.workspace.display;
    // A new surface drops the old one's grid, so no view shows the old contours under the new axes
    // while the new grid is sampled (a new constant keeps it: the same surface, slightly changed).
    const grid = keepView ? s.grid : { ...s.grid, request: null, values: null, stage: null };
    setWorkspace({ surface: spec, slice, view, runs, ...(keepView ? {} : { display }) }, { surfaceInfo: info, surfaceError: null, table: sameShape ? s.table : defaultTable(), grid });
    ctx.updateReference();
    ctx.launchAll();
    ctx.requestGrid();
  }

  return {
    setSurface(spec) {
      try {
        applySurface(spec, false);
        return true;
      } catch (e) {
        set({ surfaceError: e instanceof Error ? e.message : String(e) });
        return false;
      }
    },
    setConstant(name, value) {
      const surface = get().workspace.surface;
      if (!Number.isFinite(value) || surface.kind === 'datafit') return;
      applySurface({ ...surface, constants: { ...(surface.constants ?? {}), [name]: value } }, true);
    },
    setPanels(patch) {
      setWorkspace({ panels: { ...get().workspace.panels, ...patch } });
    },
    setStudy(spec) {
      const studies = get().workspace.studies ?? [];
      const at = studies.findIndex((x) => x.kind === spec.kind);
      setWorkspace({ studies: at < 0 ? [...studies, spec] : studies.map((x, k) => (k === at ? spec : x)) });
    },
    loadWorkspace(workspace) {
      let info: SurfaceInfo;
      try {
        info = drawableSurface(workspace.surface);
      } catch (e) {
        set({ notice: `The experiment's surface could not be built (${e instanceof Error ? e.message : String(e)}); nothing was changed.` });
        return;
      }
      for (const r of get().workspace.runs) live.forget(r.id);
      // A file's studies are set up in their panels, not run (a study can take minutes; the panel's
      // "Run as set up" starts it). The workspace is replaced whole, so fields a file leaves out are cleared.
      set({ workspace, surfaceInfo: info, surfaceError: null, status: {}, selectedRunId: null, table: defaultTable() });
      ctx.engine.send({ type: 'run/pace', pace: workspace.pace });
      ctx.updateReference();
      ctx.launchAll();
      ctx.requestGrid();
    },
  };
}
