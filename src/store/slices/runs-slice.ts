/** Runs: adding, editing, duplicating and removing them, their launches and controls, the optimizer x learning-rate table. */
import { optimizerLabel } from '../../engine';
import type { AppState, RunActions } from '../app-state';
import { freshId } from '../ids';
import type { LiveRuns } from '../live-runs';
import { newRunConfig, nextStyle, pageDefaultSpec } from '../run-configs';
import { curvatureAt, rateFamily, switchedOptimizer } from '../suggest-rate';
import { mainThreadSurface } from '../surface-cache';
import { suggestedStart } from '../surface-info';
import type { RunConfig } from '../workspace';
import type { SliceContext } from './context';

export function runsSlice(ctx: SliceContext): RunActions {
  const { get, set, setWorkspace, live, engine } = ctx;

  function mutateRun(id: string, f: (r: RunConfig) => RunConfig): RunConfig | null {
    let changed: RunConfig | null = null;
    setWorkspace({ runs: get().workspace.runs.map((r) => (r.id === id ? (changed = f(r)) : r)) });
    return changed;
  }

  return {
    addRun(kind = 'adam') {
      const s = get();
      const run = newRunConfig(kind, s.workspace.runs, suggestedStartOf(s));
      const suggested = rateFamily(kind) === 'gradient' ? suggestedRateAt(s, run.settings.start) : null;
      if (suggested !== null) run.optimizer = { ...run.optimizer, learningRate: suggested };
      setWorkspace({ runs: [...s.workspace.runs, run] }, { selectedRunId: run.id });
      ctx.launch(run);
      return run.id;
    },
    updateRun(id, patch) {
      const run = mutateRun(id, (r) => ({ ...r, ...patch }));
      if (!run) return;
      const relaunch = patch.optimizer !== undefined || patch.settings !== undefined;
      if (relaunch) ctx.launch(run);
    },
    changeOptimizer(id, kind) {
      const s = get();
      const run = s.workspace.runs.find((r) => r.id === id);
      if (!run || run.optimizer.kind === kind) return;
      const optimizer = switchedOptimizer(run.optimizer, kind, pageDefaultSpec(kind), suggestedRateAt(s, run.settings.start));
      const label = run.label === optimizerLabel(run.optimizer) ? optimizerLabel(optimizer) : run.label;
      get().actions.updateRun(id, { optimizer, label });
    },
    duplicateRun(id) {
      const s = get();
      const source = s.workspace.runs.find((r) => r.id === id);
      if (!source) return null;
      const copy: RunConfig = { ...structuredClone(source), id: freshId('c'), label: `${source.label} (copy)`, style: nextStyle(s.workspace.runs), cell: undefined };
      const at = s.workspace.runs.indexOf(source) + 1;
      setWorkspace({ runs: [...s.workspace.runs.slice(0, at), copy, ...s.workspace.runs.slice(at)] }, { selectedRunId: copy.id });
      ctx.launch(copy);
      return copy.id;
    },
    removeRun(id) {
      live.forget(id);
      const s = get();
      setWorkspace({ runs: s.workspace.runs.filter((r) => r.id !== id) }, { selectedRunId: s.selectedRunId === id ? null : s.selectedRunId });
    },
    selectRun(id) {
      set({ selectedRunId: id });
      // A slice through two chosen variables holds the others at the selected run's current point.
      const s = get();
      const run = s.workspace.runs.find((r) => r.id === id);
      if (!run || s.workspace.slice.plane || s.surfaceInfo.variables.length <= 2) return;
      const at = runPoint(run, live);
      if (at.length === s.workspace.slice.at.length && at.every((v, k) => v === s.workspace.slice.at[k])) return;
      get().actions.setSlice({ at });
    },
    setStartTarget(startTarget) {
      set({ startTarget });
    },
    setStart(point) {
      const s = get();
      const targets = s.startTarget === 'selected' && s.selectedRunId ? [s.selectedRunId] : s.workspace.runs.map((r) => r.id);
      for (const id of targets) get().actions.updateRun(id, { settings: { ...get().workspace.runs.find((r) => r.id === id)!.settings, start: point.slice() } });
    },
    control(id, action) {
      live.control(id, action);
    },
    controlAll(action) {
      for (const r of get().workspace.runs) live.control(r.id, action);
    },
    restart(id) {
      const run = get().workspace.runs.find((r) => r.id === id);
      if (run) ctx.launch(run);
    },
    restartAll() {
      ctx.launchAll();
    },
    setPace(pace) {
      setWorkspace({ pace });
      engine.send({ type: 'run/pace', pace });
    },
    setTolerance(tolerance) {
      if (!(tolerance >= 0) || !Number.isFinite(tolerance)) return;
      setWorkspace({ tolerance });
      ctx.updateReference();
    },
    buildTableRuns() {
      const s = get();
      for (const r of s.workspace.runs) if (r.cell) live.forget(r.id);
      const kept = s.workspace.runs.filter((r) => !r.cell);
      const start = suggestedStartOf(s);
      // The 'rule' row runs the selected run's rule when it is a rule run, else the latest rule run's.
      const ruleSource = s.workspace.runs.find((r) => r.id === s.selectedRunId && r.optimizer.kind === 'rule') ?? [...kept].reverse().find((r) => r.optimizer.kind === 'rule');
      const table: RunConfig[] = [];
      s.workspace.panels.tableOptimizers.forEach((kind, row) =>
        s.workspace.panels.tableLearningRates.forEach((lr, column) => {
          const run = newRunConfig(kind, [...kept, ...table], start);
          const base = kind === 'rule' && ruleSource ? structuredClone(ruleSource.optimizer) : run.optimizer;
          run.optimizer = { ...base, learningRate: lr };
          run.label = `${optimizerLabel(run.optimizer)} lr=${lr}`;
          run.cell = { row, column };
          table.push(run);
        }),
      );
      setWorkspace({ runs: [...kept, ...table], panels: { ...s.workspace.panels, mode: 'table' } });
      table.forEach(ctx.launch);
    },
  };
}

/** The rate a new plain-gradient run gets at `start`: SAFE_FRACTION of 2 / lambda_max there, or null. */
function suggestedRateAt(s: AppState, start: number[]): number | null {
  const surface = mainThreadSurface(s.workspace.surface);
  return surface ? curvatureAt(surface, start)?.suggestedRate ?? null : null;
}

/** A run's current point (its last recorded one), else its start. */
function runPoint(run: RunConfig, live: LiveRuns): number[] {
  const b = live.trajectory(run.id);
  if (b && b.count > 0 && b.dimension === run.settings.start.length) {
    const x = Array.from(b.point(b.count - 1));
    if (x.every(Number.isFinite)) return x;
  }
  return run.settings.start.slice();
}

/** Where a new run starts: where the first run starts, else the surface's suggested start. */
function suggestedStartOf(s: AppState): number[] {
  return s.workspace.runs[0]?.settings.start.slice() ?? suggestedStart(s.surfaceInfo);
}
