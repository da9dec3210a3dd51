/** The `fall` command line: argument parsing, dispatch, exit codes and Ctrl-C. */
import { availableParallelism } from 'node:os';
import { parseArgs } from 'node:util';
import { experimentJsonSchema } from '../io/experiment';
import { CliError, EXIT } from './exit-codes';
import { checkFile } from './load-experiment';
import { mergeCommand } from './merge-command';
import { removePending } from './out-dir';
import { runCommand } from './run-command';
import type { ThreadPool } from './thread-pool';
import { USAGE } from './usage';
import { parseShard } from './work-units';

/** Next to this file in the build (dist-cli/); a variable, so the bundler leaves the URL alone. */
const WORKER_FILE = './run-worker.mjs';

const log = (line: string) => process.stderr.write(line + '\n');

async function main(argv: string[]): Promise<number> {
  const [command, ...rest] = argv;
  switch (command) {
    case 'run':
      return run(rest);
    case 'merge':
      return merge(rest);
    case 'check':
      return check(rest);
    case 'schema':
      process.stdout.write(JSON.stringify(experimentJsonSchema(), null, 2) + '\n');
      return EXIT.done;
    case undefined:
    case 'help':
    case '--help':
    case '-h':
      process.stdout.write(USAGE);
      return command === undefined ? EXIT.badInput : EXIT.done;
    default:
      throw new CliError(`unknown command ${JSON.stringify(command)}; the commands are run, merge, check and schema (fall --help)`);
  }
}

function options<T extends Record<string, { type: 'string' | 'boolean' }>>(args: string[], spec: T) {
  try {
    return parseArgs({ args, options: spec, allowPositionals: true, strict: true });
  } catch (e) {
    throw new CliError(`${(e as Error).message.replace(/\. To specify a positional argument.*$/s, '')} (fall --help)`);
  }
}

let pool: ThreadPool | null = null;

async function run(args: string[]): Promise<number> {
  const { values, positionals } = options(args, { out: { type: 'string' }, threads: { type: 'string' }, shard: { type: 'string' }, force: { type: 'boolean' }, json: { type: 'boolean' } });
  if (positionals.length !== 1) throw new CliError(`fall run takes one experiment file, got ${positionals.length} (fall run FILE --out DIR)`);
  if (!values.out) throw new CliError('fall run needs --out DIR, the folder for the outputs');
  const threads = values.threads === undefined ? availableParallelism() : Number(values.threads);
  if (!Number.isInteger(threads) || threads < 1) throw new CliError(`--threads ${values.threads}: expected a whole number of at least 1`);
  const shard = values.shard === undefined ? null : shardOption(values.shard);
  return runCommand(
    {
      file: positionals[0],
      out: values.out,
      shard,
      threads,
      force: values.force ?? false,
      progress: values.json ? 'json' : process.stderr.isTTY ? 'bar' : 'lines',
      workerFile: new URL(WORKER_FILE, import.meta.url),
      onPool: (p) => (pool = p),
    },
    log,
  );
}

function shardOption(text: string) {
  try {
    return parseShard(text);
  } catch (e) {
    throw new CliError((e as Error).message);
  }
}

function merge(args: string[]): number {
  const { values, positionals } = options(args, { out: { type: 'string' }, force: { type: 'boolean' } });
  if (!positionals.length) throw new CliError('fall merge needs the folders holding the shards (fall merge DIR...)');
  return mergeCommand(positionals, values.out ?? positionals[0], values.force ?? false, log);
}

function check(args: string[]): number {
  const { positionals } = options(args, {});
  if (positionals.length !== 1) throw new CliError(`fall check takes one experiment file, got ${positionals.length}`);
  const { problems } = checkFile(positionals[0]);
  for (const p of problems) process.stdout.write(p + '\n');
  if (!problems.length) process.stdout.write(`${positionals[0]}: ok\n`);
  return problems.length ? EXIT.badInput : EXIT.done;
}

function interrupted(signal: string): void {
  void pool?.stop();
  removePending();
  log(`fall: stopped by ${signal}; nothing was written for this command (files already complete are untouched)`);
  process.exit(EXIT.interrupted);
}

// A reader that stops early (`fall check x | head`) is not an error of ours.
process.stdout.on('error', (e: NodeJS.ErrnoException) => {
  if (e.code === 'EPIPE') process.exit(typeof process.exitCode === 'number' ? process.exitCode : EXIT.done);
  throw e;
});
process.on('SIGINT', () => interrupted('SIGINT'));
process.on('SIGTERM', () => interrupted('SIGTERM'));

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (e) => {
    if (e instanceof CliError) {
      log(`fall: ${e.message}`);
      process.exitCode = e.exitCode;
    } else {
      log(`fall: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      process.exitCode = 70;
    }
  },
);
