/** `fall run FILE --out DIR [--shard i/n] [--threads N] [--force] [--json]`. */
import { buildSurface, describeSurface } from '../problems';
import { reportedUnits } from '../io/units';
import { resultsCsvOf, referenceMinima, trajectoriesCsvPieces } from '../io/run-exports';
import { EXIT } from './exit-codes';
import { experimentHash } from './experiment-hash';
import { loadExperiment } from './load-experiment';
import { outputNames, shardOfEntry } from './output-names';
import { prepareOutDir, writeAtomically } from './out-dir';
import { createProgress, type ProgressStyle } from './progress';
import type { RunResult } from './run-one';
import { runLine, summaryFile, summaryText, troubled } from './summary-file';
import { runOnThreads, type ThreadPool } from './thread-pool';
import { shareOf, workUnits, type Shard } from './work-units';

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
  const names = outputNames(o.shard);
  const own = new Set(Object.values(names));
  // Other shards of the same split may share the folder (a job array writes into one); nothing else.
  const otherShard = (name: string) => {
    const s = shardOfEntry(name);
    return o.shard !== null && s !== null && !own.has(name) && s.count === o.shard.count;
  };
  prepareOutDir(o.out, otherShard, o.force);

  const hash = experimentHash(experiment);
  const info = describeSurface(experiment.surface);
  // The same unit system as the page's exports: original units for a standardised data-fit surface.
  const units = reportedUnits(buildSurface(experiment.surface));
  const minima = referenceMinima(info.knownPoints);
  const share = shareOf(workUnits(experiment), o.shard ?? { index: 0, count: 1 });
  const runs = share.map((u) => experiment.runs[u.runIndex]);
  const progress = createProgress(o.progress, share.length, { stdout: process.stdout, stderr: process.stderr });
  const started = Date.now();
  const pool = runOnThreads(o.workerFile, { surface: experiment.surface, runs: experiment.runs, minima, tolerance: experiment.tolerance }, share, Math.max(1, o.threads), (unit, r) =>
    progress.runDone(runLine(runs[unit].id, runs[unit].label, r)),
  );
  o.onPool?.(pool);
  const results = await pool.results;
  progress.finish();

  const byId = new Map<string, RunResult>(runs.map((r, k) => [r.id, results[k]]));
  const lines = runs.map((r, k) => runLine(r.id, r.label, results[k]));
  const summary = summaryFile(experiment, hash, o.shard, lines);
  writeAtomically(o.out, [
    [names.trajectories, trajectoriesCsvPieces(runs, (id) => byId.get(id)?.trajectory, info.variables, units)],
    [names.results, resultsCsvOf(runs, (id) => byId.get(id)?.summary, info, units)],
    [names.summary, summaryText(summary)],
  ]);
  const seconds = (Date.now() - started) / 1000;
  const shardText = o.shard ? ` (shard ${o.shard.index}/${o.shard.count}: ${runs.length} of ${experiment.runs.length} runs)` : '';
  log(`wrote ${names.trajectories}, ${names.results} and ${names.summary} to ${o.out}${shardText} in ${seconds.toFixed(2)} s`);
  const bad = troubled(lines);
  for (const b of bad) log(`run ${b.id} (${b.label}) ${b.outcome}${b.step === null ? '' : ` at step ${b.step}`}${b.detail ? `: ${b.detail}` : ''}`);
  return bad.length ? EXIT.someRunsTroubled : EXIT.done;
}
