/**
 * `fall merge DIR... [--out DIR] [--force]`: joins the shards of one experiment into the files a single
 * process writes (byte for byte: shards are contiguous blocks of the runs in file order, and each
 * study's CSV is written from all its shards' cells by the same code as a single process,
 * io/study-exports.ts). Refuses shards of different experiments (their hashes differ), a split with a
 * shard missing or found twice, and a shard whose files are incomplete.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { CSV_LINE_END } from '../io/csv';
import { cellTable, studyCsvOf } from '../io/study-exports';
import { buildSurface, describeSurface } from '../problems';
import { CliError, EXIT } from './exit-codes';
import { outputNames, shardOfName, studyCsvName } from './output-names';
import { prepareOutDir, writeAtomically, type FileContents } from './out-dir';
import { readStudyShard, type StudyShardFile } from './study-shard-file';
import { studyLine, summaryText, totalsOf, troubled, type SummaryFile } from './summary-file';

interface FoundShard {
  dir: string;
  summary: SummaryFile;
}

export function mergeCommand(dirs: readonly string[], out: string, force: boolean, log: (line: string) => void): number {
  const shards = findShards(dirs);
  const first = shards[0];
  const count = first.summary.shard!.count;
  const byIndex = new Map<number, FoundShard>();
  for (const s of shards) {
    const { index, count: n } = s.summary.shard!;
    const where = `shard ${index}/${n} in ${s.dir}`;
    if (n !== count) throw new CliError(`${where} belongs to a split into ${n} shards, but shard ${first.summary.shard!.index}/${count} in ${first.dir} to one into ${count}`);
    if (s.summary.experiment.hash !== first.summary.experiment.hash)
      throw new CliError(`${where} is from a different experiment (${s.summary.experiment.hash}) than shard ${first.summary.shard!.index}/${count} in ${first.dir} (${first.summary.experiment.hash}); merge shards of one file only`);
    const twin = byIndex.get(index);
    if (twin) throw new CliError(`shard ${index}/${count} was found twice, in ${twin.dir} and in ${s.dir}`);
    byIndex.set(index, s);
  }
  const missing = [...Array(count).keys()].filter((k) => !byIndex.has(k));
  if (missing.length) throw new CliError(`missing shard${missing.length > 1 ? 's' : ''} ${missing.map((k) => `${k}/${count}`).join(', ')} (looked in ${dirs.join(', ')}); run them, then merge again`);

  const ordered = [...Array(count).keys()].map((k) => byIndex.get(k)!);
  const trajectories = joinCsv(ordered, 'trajectories');
  const results = joinCsv(ordered, 'results');
  const runs = ordered.flatMap((s) => s.summary.runs);
  const studies = first.summary.studies?.length ? mergeStudies(ordered) : { files: [], lines: [] };
  const merged: SummaryFile = { ...first.summary, shard: null, totals: totalsOf(runs), runs, studies: studies.lines };
  const names = outputNames(null);
  const own = new Set([...Object.values(names), ...studies.files.map(([name]) => name)]);
  prepareOutDir(out, (name) => shardOfName(name) !== null && !own.has(name), force);
  writeAtomically(out, [
    [names.trajectories, trajectories],
    [names.results, results],
    ...studies.files,
    [names.summary, summaryText(merged)],
  ]);
  const cells = studies.lines.reduce((sum, l) => sum + l.cells, 0);
  log(`merged ${count} shard${count > 1 ? 's' : ''} (${runs.length} runs${studies.lines.length ? `, ${studies.lines.length} stud${studies.lines.length > 1 ? 'ies' : 'y'} of ${cells} runs` : ''}) into ${out}`);
  return troubled(runs).length ? EXIT.someRunsTroubled : EXIT.done;
}

function findShards(dirs: readonly string[]): FoundShard[] {
  const found: FoundShard[] = [];
  for (const dir of dirs) {
    let names: string[];
    try {
      names = readdirSync(dir);
    } catch (e) {
      throw new CliError(`cannot read the folder ${dir}: ${(e as Error).message}`);
    }
    for (const name of names.sort()) {
      const shard = shardOfName(name);
      if (!shard || !name.startsWith('summary.')) continue;
      const path = join(dir, name);
      let summary: SummaryFile;
      try {
        summary = JSON.parse(readFileSync(path, 'utf8')) as SummaryFile;
      } catch (e) {
        throw new CliError(`${path}: not a readable shard summary: ${(e as Error).message}`);
      }
      if (summary.format !== 'fall-line-summary' || !summary.shard || summary.shard.index !== shard.index || summary.shard.count !== shard.count)
        throw new CliError(`${path}: not the summary of shard ${shard.index}/${shard.count} (its contents say otherwise)`);
      const needed = [outputNames(shard).trajectories, outputNames(shard).results, ...(summary.studies?.length ? [outputNames(shard).studyCells] : [])];
      for (const file of needed)
        if (!existsSync(join(dir, file))) throw new CliError(`shard ${shard.index}/${shard.count} in ${dir} is incomplete: ${file} is missing`);
      found.push({ dir, summary });
    }
  }
  if (!found.length) throw new CliError(`no shard outputs (summary.shard-i-of-n.json) in ${dirs.join(', ')}`);
  return found;
}

/**
 * Every study's CSV from all shards' cells: the experiment comes from the shards' cell files (each
 * must carry the hash the summaries agreed on), the surface is rebuilt from it, and a cell missing or
 * found twice is refused.
 */
function mergeStudies(shards: readonly FoundShard[]): { files: [string, FileContents][]; lines: SummaryFile['studies'] } {
  const read = shards.map((s): StudyShardFile => {
    const path = join(s.dir, outputNames(s.summary.shard).studyCells);
    let file: StudyShardFile;
    try {
      file = readStudyShard(readFileSync(path, 'utf8'));
    } catch (e) {
      throw new CliError(`${path}: not a readable shard study-cells file: ${(e as Error).message}`);
    }
    if (file.hash !== s.summary.experiment.hash) throw new CliError(`${path} is from a different experiment (${file.hash}) than its summary (${s.summary.experiment.hash})`);
    return file;
  });
  const experiment = read[0].experiment;
  const studies = experiment.studies ?? [];
  const surface = buildSurface(experiment.surface);
  const info = describeSurface(experiment.surface);
  const files: [string, FileContents][] = [];
  const lines = studies.map((spec, k) => {
    let table;
    try {
      table = cellTable(spec, surface.dimension, read.map((f) => f.studies[k]));
    } catch (e) {
      throw new CliError(`study ${k} (${spec.kind}): ${(e as Error).message}; were all shards run with the same version of Fall Line?`);
    }
    const name = studyCsvName(spec, k);
    files.push([name, studyCsvOf(spec, surface, info, experiment.view, table)]);
    return studyLine(spec, name, table.outcomes, surface);
  });
  return { files, lines };
}

/**
 * The shards' CSVs in shard order under one header, read one shard at a time. The header must be the
 * same in every shard that has runs (a shard without runs names no variables in its header, as the
 * page's export of no runs does).
 */
function* joinCsv(shards: readonly FoundShard[], table: 'trajectories' | 'results'): Generator<string> {
  const withRuns = shards.filter((s) => s.summary.runs.length > 0);
  let header: string | null = null;
  for (const s of withRuns.length ? withRuns : shards.slice(0, 1)) {
    const path = join(s.dir, outputNames(s.summary.shard)[table]);
    const text = readFileSync(path, 'utf8');
    const cut = text.indexOf(CSV_LINE_END) + CSV_LINE_END.length;
    const own = text.slice(0, cut);
    if (header === null) yield (header = own);
    else if (own !== header) throw new CliError(`${path} has other columns than the shards before it; were the shards made by different versions of Fall Line?`);
    yield text.slice(cut);
  }
}
