/** A problem found in an experiment file: where (JSON path, and line and column when known) and what. */
import type { z } from 'zod';
import { positionOf, valueOffset, type JsonPath, type TextPosition } from './json-locator';

export interface FileProblem {
  /** JSON path of the offending value, e.g. `$.runs[2].optimizer.kind` ('$' for the whole file). */
  path: string;
  message: string;
  /** Where in the file's text, when the file was read from text. */
  at?: TextPosition;
}

/** `$`, `.name` for plain names, `[n]` for indices, `["odd name"]` otherwise. */
export function jsonPathText(path: readonly PropertyKey[]): string {
  return (
    '$' +
    path
      .map((k) => (typeof k === 'number' ? `[${k}]` : typeof k === 'string' && /^[A-Za-z_$][\w$]*$/.test(k) ? `.${k}` : `[${JSON.stringify(String(k))}]`))
      .join('')
  );
}

/**
 * One problem per zod issue (one per unknown field), located in `text` when given. A field missing
 * from `value` (the parsed input) is reported as missing, placed at the object that lacks it.
 */
export function problemsFromIssues(issues: readonly z.core.$ZodIssue[], text?: string, value?: unknown): FileProblem[] {
  const out: FileProblem[] = [];
  for (const issue of issues) {
    const path = issue.path.filter((k): k is string | number => typeof k !== 'symbol');
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) out.push(located([...path, key], 'unknown field (not part of this version of the experiment file)', text));
    } else if (path.length && value !== undefined && isMissing(value, path)) {
      const parent = path.slice(0, -1);
      const at = text === undefined ? undefined : valueOffset(text, parent);
      out.push(located(path, 'missing (this field is required)', text, at));
    } else {
      out.push(located(path, describeIssue(issue), text));
    }
  }
  return out;
}

/** Whether the last key of `path` is absent from an object that is present. */
function isMissing(value: unknown, path: JsonPath): boolean {
  let node = value;
  for (const key of path.slice(0, -1)) {
    if (node === null || typeof node !== 'object') return false;
    node = (node as Record<string | number, unknown>)[key];
  }
  return node !== null && typeof node === 'object' && !Object.hasOwn(node, path[path.length - 1]);
}

export function located(path: JsonPath, message: string, text?: string, offset?: number): FileProblem {
  const at = text === undefined ? undefined : (offset ?? valueOffset(text, path));
  return { path: jsonPathText(path), message, ...(at === undefined || text === undefined ? {} : { at: positionOf(text, at) }) };
}

function describeIssue(issue: z.core.$ZodIssue): string {
  if (issue.code === 'invalid_union' && 'discriminator' in issue && issue.discriminator) return `${issue.message} (unknown ${String(issue.discriminator)})`;
  return issue.message;
}

/** `file.fall.json:3:14: $.runs[0].label: message` (position left out when unknown). */
export function formatProblem(file: string, p: FileProblem): string {
  return `${file}${p.at ? `:${p.at.line}:${p.at.column}` : ''}: ${p.path}: ${p.message}`;
}
