/**
 * Progress of `fall run`: a bar on a terminal (runs done, rate, time left), one plain line per finished
 * run (and per finished piece of a study) otherwise, or one JSON object per line with --json (on
 * stdout; everything else goes to stderr). A study's cells are runs too: they count in the total.
 */
import type { RunLine } from './summary-file';

export type ProgressStyle = 'bar' | 'lines' | 'json';

export interface Progress {
  runDone(line: RunLine): void;
  /** `count` more cells of study `study` ended; `done` of its `total` cells (in this shard) so far. */
  cellsDone(study: number, kind: string, count: number, done: number, total: number): void;
  finish(): void;
}

interface Sink {
  write(text: string): void;
}

export function createProgress(style: ProgressStyle, total: number, out: { stdout: Sink; stderr: Sink }, now: () => number = Date.now): Progress {
  const began = now();
  let done = 0;
  const rate = () => done / Math.max((now() - began) / 1000, 1e-3);
  const eta = () => (done ? (total - done) / rate() : Number.NaN);
  const barLine = () => {
    const width = 24;
    const filled = total ? Math.round((done / total) * width) : width;
    return `\r[${'#'.repeat(filled)}${'-'.repeat(width - filled)}] ${done}/${total} runs  ${rate().toFixed(1)} runs/s  ETA ${duration(eta())}  `;
  };
  if (style === 'bar') out.stderr.write(barLine());
  if (style === 'json') out.stdout.write(JSON.stringify({ event: 'start', total }) + '\n');
  return {
    runDone(line) {
      done++;
      if (style === 'bar') out.stderr.write(barLine());
      else if (style === 'lines') out.stderr.write(`run ${done}/${total} ${line.id} (${line.label}): ${line.outcome}${line.step === null ? '' : ` at step ${line.step}`}\n`);
      else out.stdout.write(JSON.stringify({ event: 'run', done, total, id: line.id, outcome: line.outcome, step: line.step, runsPerSecond: round(rate()), etaSeconds: round(eta()) }) + '\n');
    },
    cellsDone(study, kind, count, studyDone, studyTotal) {
      done += count;
      if (style === 'bar') out.stderr.write(barLine());
      else if (style === 'lines') out.stderr.write(`study ${study} (${kind}): ${studyDone}/${studyTotal} runs\n`);
      else out.stdout.write(JSON.stringify({ event: 'study', study, kind, done: studyDone, total: studyTotal, runsPerSecond: round(rate()), etaSeconds: round(eta()) }) + '\n');
    },
    finish() {
      const seconds = (now() - began) / 1000;
      if (style === 'bar') out.stderr.write('\n');
      if (style === 'json') out.stdout.write(JSON.stringify({ event: 'finish', done, total, seconds: round(seconds) }) + '\n');
    },
  };
}

function round(x: number): number | null {
  return Number.isFinite(x) ? Math.round(x * 1000) / 1000 : null;
}

export function duration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '--';
  if (seconds < 60) return `${Math.ceil(seconds)}s`;
  const m = Math.floor(seconds / 60);
  return m < 60 ? `${m}m${String(Math.round(seconds % 60)).padStart(2, '0')}s` : `${Math.floor(m / 60)}h${String(m % 60).padStart(2, '0')}m`;
}
