/** Builds the command line once into a temporary folder and runs it as a child process, as users do. */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
let built: string | null = null;

export function buildCli(): string {
  if (built) return built;
  const out = mkdtempSync(join(tmpdir(), 'fall-cli-build-'));
  execFileSync('npx', ['vite', 'build', '-c', 'vite.cli.config.ts'], { cwd: ROOT, env: { ...process.env, FALL_CLI_OUT_DIR: out }, stdio: 'pipe' });
  built = join(out, 'fall.mjs');
  return built;
}

export interface Ran {
  code: number | null;
  stdout: string;
  stderr: string;
}

export function fall(args: string[], cwd?: string): Ran {
  const r = spawnSync(process.execPath, [buildCli(), ...args], { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

export function fallInBackground(args: string[]) {
  return spawn(process.execPath, [buildCli(), ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
}

export function scratch(): string {
  return mkdtempSync(join(tmpdir(), 'fall-cli-test-'));
}

export function writeJson(dir: string, name: string, value: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof value === 'string' ? value : JSON.stringify(value, null, 2));
  return path;
}
