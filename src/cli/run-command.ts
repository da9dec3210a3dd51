/** `fall run FILE --out DIR [--shard i/n] [--threads N] [--force] [--json]`. */
import type { StudyCellResults, StudySpec } from '../engine';
import { buildSurface, describeSurface } from '../problems';
import { reportedUnits } from '../io/units';
import { resultsCsvOf, referenceMinima, trajectoriesCsvPieces } from '../io/run-exports';
import { toleranceTarget } from '../io/run-summary';
import { cellTable, studyCsvOf } from '../io/study-exports';
import { STUDY_CSV } from '../io/study-csv';
import { EXIT } from './exit-codes';
import { experimentHash } from './experiment-hash';
import { loadExperiment } from './load-experiment';
import { outputNames, shardOfEntry, studyCsvName } from './output-names';
import { prepareOutDir, writeAtomically, type FileContents } from './out-dir';
import { createProgress, type ProgressStyle } from './progress';
import type { RunResult } from './run-one';
import { studyShardText } from './study-shard-file';
import { runLine, studyLine, summaryFile, summaryText, troubled, type StudyLine } from './summary-file';
import type { Task } from './thread-messages';
import { runOnThreads, type ThreadPool } from './thread-pool';
import { cellTasks, shareOf, studyShares, workUnits, type Shard } from './work-units';

export interface RunOptions {
  file: string;
  out: string;
  shard: Shard | null;
  threads: number;
  force: boolean;
  progress: ProgressStyle;
  workerFile: URL;
  /** Lets main stop the threads on Ctrl-C. */
  onPool?: (pool: ThreadPool) => void;
}

export async function runCommand(o: RunOptions, log: (line: string) => void): Promise<number> {
  const { experiment } = loadExperiment(o.file);
  const studies = experiment.studies ?? [];
  const names = outputNames(o.shard);
  const studyFiles = studies.map((s, k) => studyCsvName(s, k));
  const own = new Set([...Object.values(names), ...studyFiles]);
  // Other shards of the same split may share the folder (a job array writes into one); nothing else.
  const otherShard = (name: string) => {
    const s = shardOfEntry(name);
    return o.shard !== null && s !== null && !own.has(name) && s.count === o.shard.count;
  };
  prepareOutDir(o.out, otherShard, o.force);

  const hash = experimentHash(experiment);
  const surface = buildSurface(experiment.surface);
  const info = describeSurface(experiment.surface);
  // The same unit system as the page's exports: original units for a standardised data-fit surface.
  const units = reportedUnits(surface);
  const minima = referenceMinima(info.knownPoints);
  const shard = o.shard ?? { index: 0, count: 1 };
  const share = shareOf(workUnits(experiment), shard);
  const runs = share.map((u) => experiment.runs[u.runIndex]);
  const cellShares = studyShares(experiment, shard);
  const tasks: Task[] = [...share.map((u): Task => ({ kind: 'run', runIndex: u.runIndex })), ...cellShares.flatMap((cells, k) => cellTasks(k, cells, Math.max(1, o.threads)))];
  const totalCells = cellShares.reduce((sum, c) => sum + c.length, 0);
  const progress = createProgress(o.progress, share.length + totalCells, { stdout: process.stdout, stderr: process.stderr });
  const cellsDone = studies.map(() => 0);
  const started = Date.now();
  const job = { surface: experiment.surface, runs: experiment.runs, studies, minima, tolerance: experiment.tolerance, target: toleranceTarget(minima, experiment.tolerance) };
  const pool = runOnThreads(o.workerFile, job, tasks, Math.max(1, o.threads), (unit, r) => {
    const task = tasks[unit];
    if (r.kind === 'run') return progress.runDone(runLine(runs[unit].id, runs[unit].label, r.result));
    if (task.kind !== 'cells') return;
    cellsDone[task.study] += r.cells.indices.length;
    progress.cellsDone(task.study, studies[task.study].kind, r.cells.indices.length, cellsDone[task.study], cellShares[task.study].length);
  });
  o.onPool?.(pool);
  const results = await pool.results;
  progress.finish();

  const runResults = results.slice(0, share.length).map((r) => (r as { kind: 'run'; result: RunResult }).result);
  const pieces: StudyCellResults[][] = studies.map(() => []);
  results.slice(share.length).forEach((r, k) => {
    const task = tasks[share.length + k];
    if (r.kind === 'cells' && task.kind === 'cells') pieces[task.study].push(r.cells);
  });

  const byId = new Map<string, RunResult>(runs.map((r, k) => [r.id, runResults[k]]));
  const lines = runs.map((r, k) => runLine(r.id, r.label, runResults[k]));
  const files: [string, FileContents][] = [
    [names.trajectories, trajectoriesCsvPieces(runs, (id) => byId.get(id)?.trajectory, info.variables, units)],
    [names.results, resultsCsvOf(runs, (id) => byId.get(id)?.summary, info, units)],
  ];
  let studyLines: StudyLine[];
  if (o.shard && studies.length) {
    // A shard keeps its cells raw; the merge assigns basins once every cell is in (study-exports.ts).
    const mine = pieces.map((p) => joinPieces(p, surface.dimension));
    files.push([names.studyCells, studyShardText({ format: 'fall-line-study-cells', hash, shard: o.shard, experiment, studies: mine })]);
    studyLines = studies.map((s, k) => studyLine(s, names.studyCells, mine[k].outcomes));
  } else {
    const tables = studies.map((s, k) => cellTable(s, surface.dimension, pieces[k]));
    studies.forEach((s, k) => files.push([studyFiles[k], studyCsvOf(s, surface, info, experiment.view, tables[k])]));
    studyLines = studies.map((s, k) => studyLine(s, studyFiles[k], tables[k].outcomes, surface));
  }
  files.push([names.summary, summaryText(summaryFile(experiment, hash, o.shard, lines, studyLines))]);
  writeAtomically(o.out, files);

  const seconds = (Date.now() - started) / 1000;
  const shardText = o.shard ? ` (shard ${o.shard.index}/${o.shard.count}: ${runs.length} of ${experiment.runs.length} runs${studies.length ? `, ${totalCells} study cells` : ''})` : '';
  log(`wrote ${files.map(([name]) => name).join(', ')} to ${o.out}${shardText} in ${seconds.toFixed(2)} s`);
  for (const [k, line] of studyLines.entries()) log(`study ${k} (${STUDY_CSV[line.kind].name}): ${line.cells} runs; ${outcomeCounts(line)}${thresholdText(studies[k], line)}`);
  const bad = troubled(lines);
  for (const b of bad) log(`run ${b.id} (${b.label}) ${b.outcome}${b.step === null ? '' : ` at step ${b.step}`}${b.detail ? `: ${b.detail}` : ''}`);
  return bad.length ? EXIT.someRunsTroubled : EXIT.done;
}

/** A shard's pieces of one study as one list, in the order computed. */
function joinPieces(pieces: readonly StudyCellResults[], n: number): StudyCellResults {
  const count = pieces.reduce((s, p) => s + p.indices.length, 0);
  const out: StudyCellResults = {
    indices: new Int32Array(count), steps: new Int32Array(count), loss: new Float64Array(count), endPoints: new Float64Array(count * n), stepsToTolerance: new Int32Array(count), outcomes: [],
  };
  let at = 0;
  for (const p of pieces) {
    out.indices.set(p.indices, at);
    out.steps.set(p.steps, at);
    out.loss.set(p.loss, at);
    out.stepsToTolerance.set(p.stepsToTolerance, at);
    out.endPoints.set(p.endPoints, at * n);
    out.outcomes.push(...p.outcomes);
    at += p.indices.length;
  }
  return out;
}

/** `; diverges above: gd between 0.0999 and 0.1 (predicted 0.1), ...` for a sweep with thresholds. */
function thresholdText(spec: StudySpec, line: StudyLine): string {
  if (spec.kind !== 'lr-sweep' || !line.thresholds) return '';
  const f = (v: number) => String(+v.toPrecision(4));
  const parts = line.thresholds.map((t, q) => `${spec.optimizers[q].label} ${t.observed ? `between ${f(t.observed.lo)} and ${f(t.observed.hi)}` : 'not in range'}${t.predicted ? ` (predicted ${f(t.predicted)})` : ''}`);
  return `; diverges at rates: ${parts.join(', ')}`;
}

export function outcomeCounts(line: StudyLine): string {
  return Object.entries(line.totals).filter(([, v]) => v > 0).map(([k, v]) => `${k} ${v}`).join(', ') || 'none';
}
