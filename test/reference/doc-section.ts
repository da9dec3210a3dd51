import { readFileSync, writeFileSync } from 'node:fs';
import { expect } from 'vitest';

/**
 * Keeps a generated section of a results document equal to what a test computed. The section lies
 * between `<!-- generated: NAME -->` and `<!-- end: NAME -->`. With FALL_WRITE_DOCS=1 (`npm run
 * docs:results`) the test writes it; otherwise the test fails when the document says anything else,
 * so a behaviour change cannot leave the document behind.
 */
export function syncDocSection(path: string, name: string, body: string): void {
  const url = new URL(`../../${path}`, import.meta.url);
  const text = readFileSync(url, 'utf8');
  const begin = `<!-- generated: ${name} -->\n`;
  const end = `<!-- end: ${name} -->`;
  const i = text.indexOf(begin);
  const j = text.indexOf(end);
  if (i < 0 || j < i) throw new Error(`${path}: no section "${name}" (markers ${begin.trim()} ... ${end})`);
  const current = text.slice(i + begin.length, j);
  const wanted = body.endsWith('\n') ? body : `${body}\n`;
  if (process.env.FALL_WRITE_DOCS === '1') {
    if (current !== wanted) writeFileSync(url, text.slice(0, i + begin.length) + wanted + text.slice(j));
    return;
  }
  expect(current, `${path} section "${name}" is out of date: run npm run docs:results`).toBe(wanted);
}
