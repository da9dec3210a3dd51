/**
 * Refuses the JSON key that means "the prototype" to JavaScript: `"__proto__"`. JSON.parse keeps it as
 * an own property, but anything that copies the value with assignment (`out[key] = value`,
 * Object.assign) replaces the copy's prototype instead, and zod 4.6 drops the key without checking its
 * value, so `{"hyper": {"__proto__": {"beta1": "not a number"}}}` would pass as an empty `hyper`
 * (test/hardening/experiment-files.test.ts shows it). No field of the file has that name, so it is
 * refused wherever it appears, with its path.
 * Walked iteratively with parent links, so a file nested 100,000 levels deep costs linear time and
 * cannot exhaust the stack.
 */
import type { JsonPath } from './json-locator';

export const FORBIDDEN_KEY = '__proto__';

interface Visit {
  node: unknown;
  key: string | number;
  parent: Visit | null;
}

/** Path of the first `"__proto__"` key in a parsed JSON value (depth first), or undefined. */
export function prototypeKeyPath(value: unknown): JsonPath | undefined {
  const stack: Visit[] = [{ node: value, key: '', parent: null }];
  while (stack.length > 0) {
    const visit = stack.pop()!;
    const node = visit.node;
    if (node === null || typeof node !== 'object') continue;
    if (Array.isArray(node)) {
      for (let i = node.length - 1; i >= 0; i--) stack.push({ node: node[i], key: i, parent: visit });
      continue;
    }
    if (Object.hasOwn(node, FORBIDDEN_KEY)) return [...pathOf(visit), FORBIDDEN_KEY];
    const keys = Object.keys(node);
    for (let i = keys.length - 1; i >= 0; i--) stack.push({ node: (node as Record<string, unknown>)[keys[i]], key: keys[i], parent: visit });
  }
  return undefined;
}

function pathOf(visit: Visit): JsonPath {
  const path: (string | number)[] = [];
  for (let v: Visit | null = visit; v?.parent; v = v.parent) path.push(v.key);
  return path.reverse();
}
