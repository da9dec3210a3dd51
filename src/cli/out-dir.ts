/**
 * The output folder: created if missing, checked writable and free of unrelated files before any work,
 * and written atomically (each file under a temporary name, then renamed, the summary last), so an
 * interrupted or failed run leaves no half-written file.
 */
import { closeSync, existsSync, mkdirSync, openSync, readdirSync, renameSync, rmSync, writeFileSync, writeSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { CliError } from './exit-codes';

/** Temporary files not yet renamed, removed if the process is interrupted. */
const pending = new Set<string>();

/**
 * Creates `dir` if needed and checks it can be written. Existing entries for which `allowed` is false
 * refuse the folder unless `force` (which replaces this command's own files and leaves the rest).
 */
export function prepareOutDir(dir: string, allowed: (name: string) => boolean, force: boolean): void {
  try {
    // Only the missing tail is created; a plain mkdir where the parent exists (Node 20's recursive
    // mkdir can spin on special file systems such as /proc).
    if (!existsSync(dir)) mkdirSync(dir, { recursive: !existsSync(dirname(dir)) });
  } catch (e) {
    throw new CliError(`cannot create the output folder ${dir}: ${reason(e)}`);
  }
  const probe = join(dir, `.fall-write-check-${process.pid}`);
  try {
    writeFileSync(probe, '');
    rmSync(probe);
  } catch (e) {
    throw new CliError(`cannot write into the output folder ${dir}: ${reason(e)}`);
  }
  const others = readdirSync(dir).filter((name) => !allowed(name));
  if (others.length && !force) {
    const shown = others.slice(0, 5).join(', ') + (others.length > 5 ? `, and ${others.length - 5} more` : '');
    throw new CliError(`the output folder ${dir} already has files (${shown}); use an empty folder, or --force to write over this command's files there`);
  }
}

/** A file's contents: the text, or its pieces in order (written one at a time, to bound memory). */
export type FileContents = string | Iterable<string>;

/** Writes every file under a temporary name, then renames them in order. */
export function writeAtomically(dir: string, files: readonly [name: string, contents: FileContents][]): void {
  const temps = files.map(([name]) => join(dir, `.${name}.partial-${process.pid}`));
  try {
    files.forEach(([, contents], k) => {
      pending.add(temps[k]);
      if (typeof contents === 'string') return writeFileSync(temps[k], contents);
      const fd = openSync(temps[k], 'w');
      try {
        for (const piece of contents) writeSync(fd, piece);
      } finally {
        closeSync(fd);
      }
    });
    files.forEach(([name], k) => {
      renameSync(temps[k], join(dir, name));
      pending.delete(temps[k]);
    });
  } catch (e) {
    removePending();
    if (e instanceof CliError) throw e;
    throw new CliError(`cannot write the outputs into ${dir}: ${reason(e)}`);
  }
}

export function removePending(): void {
  for (const path of pending) rmSync(path, { force: true });
  pending.clear();
}

function reason(e: unknown): string {
  const err = e as NodeJS.ErrnoException;
  return err.code ? `${err.code} (${err.message.replace(/^\w+: /, '')})` : String(err.message ?? e);
}
