/**
 * The lint rules bite: the project's eslint.config.js, run through ESLint's Node API over the fixture
 * tree test/fixtures/lint/src, reports the engine and the store importing the ui, and a cycle of
 * type-only imports; the allowed ui -> store import passes. Also: the real source tree is clean.
 */
import { resolve } from 'node:path';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const repo = resolve(__dirname, '../..');
const fixtureRoot = resolve(repo, 'test/fixtures/lint');

async function lintFixtures(): Promise<Map<string, string[]>> {
  const eslint = new ESLint({
    cwd: fixtureRoot,
    overrideConfigFile: resolve(repo, 'eslint.config.js'),
    // The layer patterns are relative to the project root; here the fixture tree plays the project.
    overrideConfig: { settings: { 'boundaries/root-path': fixtureRoot } },
    ignore: false,
  });
  const results = await eslint.lintFiles(['src/**/*.ts']);
  return new Map(results.map((r) => [r.filePath.slice(fixtureRoot.length + 1), r.messages.map((m) => `${m.ruleId}: ${m.message}`)]));
}

describe('lint: layer boundaries and cycles', () => {
  it('reports wrong-way imports and a type-only cycle, and only those', async () => {
    const byFile = await lintFixtures();
    expect(byFile.get('src/engine/reaches-up.ts')).toEqual([
      'boundaries/dependencies: There is no policy allowing dependencies from elements of type "engine" to elements of type "ui"',
    ]);
    expect(byFile.get('src/store/reads-ui.ts')).toEqual([
      'boundaries/dependencies: There is no policy allowing dependencies from elements of type "store" to elements of type "ui"',
    ]);
    expect(byFile.get('src/ui/uses-store.ts')).toEqual([]);
    expect(byFile.get('src/ui/plot-box.ts')).toEqual([]);
    expect(byFile.get('src/problems/ring-a.ts')).toEqual([
      'local/no-import-cycle: Import cycle: src/problems/ring-a.ts -> src/problems/ring-b.ts -> src/problems/ring-a.ts',
    ]);
    expect(byFile.get('src/problems/ring-b.ts')).toEqual([
      'local/no-import-cycle: Import cycle: src/problems/ring-b.ts -> src/problems/ring-a.ts -> src/problems/ring-b.ts',
    ]);
  });
});
