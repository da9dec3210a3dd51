import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';

/** The engine is pure numerics shared by the page, the workers, the tests and the command line. */
const engineRoot = resolve(__dirname, '../../src/engine');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : /\.tsx?$/.test(name) ? [path] : [];
  });
}

describe('engine isolation', () => {
  const files = sourceFiles(engineRoot);

  it('has source files to check', () => {
    expect(files.length).toBeGreaterThan(3);
  });

  it.each(files.map((f) => [relative(engineRoot, f), f]))('%s imports nothing outside the engine and touches no browser globals', (_, file) => {
    const text = readFileSync(file, 'utf8');
    const imports = [...text.matchAll(/(?:import|export)[^'"]*from\s+['"]([^'"]+)['"]/g)].map((m) => m[1]);
    for (const spec of imports) {
      expect(spec.startsWith('.'), `${spec} is not a relative import`).toBe(true);
      const target = resolve(file, '..', spec);
      expect(target.startsWith(engineRoot), `${spec} leaves src/engine`).toBe(true);
    }
    expect(text).not.toMatch(/\b(window|document|self|postMessage|localStorage|requestAnimationFrame)\s*[.(]/);
  });
});
