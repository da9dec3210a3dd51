/**
 * The import graph of the TypeScript sources, for the lint rule `local/no-import-cycle`: every import,
 * export-from and import() of a relative path, type-only ones included (a cycle through types alone is
 * still two files that cannot be read one without the other). Files are scanned with TypeScript's
 * `preProcessFile` and cached by modification time, so one lint run reads each file once.
 */
import fs from 'node:fs';
import path from 'node:path';
import ts from 'typescript';

const EXTENSIONS = ['.ts', '.tsx', '.js', '.mjs'];
const cache = new Map();

/** The file a relative import names, or undefined (packages, assets, unresolvable paths). */
export function resolveImport(fromFile, specifier) {
  if (!specifier.startsWith('.')) return undefined;
  const base = path.resolve(path.dirname(fromFile), specifier);
  const candidates = [base, ...EXTENSIONS.map((e) => base + e), ...EXTENSIONS.map((e) => path.join(base, 'index' + e))];
  return candidates.find((c) => EXTENSIONS.includes(path.extname(c)) && fs.existsSync(c) && fs.statSync(c).isFile());
}

/** The resolved files one file imports, with the import text for each. */
export function importsOf(file) {
  const mtime = fs.statSync(file).mtimeMs;
  const hit = cache.get(file);
  if (hit && hit.mtime === mtime) return hit.imports;
  const info = ts.preProcessFile(fs.readFileSync(file, 'utf8'), true, true);
  const imports = [];
  for (const ref of info.importedFiles) {
    const target = resolveImport(file, ref.fileName);
    if (target) imports.push({ specifier: ref.fileName, target });
  }
  cache.set(file, { mtime, imports });
  return imports;
}

/** A shortest chain of files from `start` back to `goal` (excluding `start`), or undefined. */
export function pathBack(start, goal) {
  const previous = new Map([[start, null]]);
  const queue = [start];
  while (queue.length > 0) {
    const file = queue.shift();
    for (const { target } of importsOf(file)) {
      if (target === goal) {
        const chain = [];
        for (let f = file; f !== null && f !== start; f = previous.get(f)) chain.unshift(f);
        return chain;
      }
      if (!previous.has(target)) {
        previous.set(target, file);
        queue.push(target);
      }
    }
  }
  return undefined;
}
