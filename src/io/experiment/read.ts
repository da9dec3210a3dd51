/**
 * Reading an experiment file: JSON, then no "__proto__" key (prototype-keys.ts), then the version, then that version's schema, then the migrations
 * up to the current version. Every problem is reported with its JSON path (and its line and column when
 * the input is text); nothing is half-read.
 */
import { CURRENT_VERSION, EARLIER_VERSIONS, experimentSchema, type Experiment } from './versions';
import { located, problemsFromIssues, type FileProblem } from './problems';
import { positionOf } from './json-locator';
import { jsonSyntaxError } from './json-syntax';
import { FORBIDDEN_KEY, prototypeKeyPath } from './prototype-keys';

export type ReadResult = { ok: true; experiment: Experiment; problems: [] } | { ok: false; problems: FileProblem[] };

/** Validates untrusted JSON text (or an already parsed value) as an experiment of any known version. */
export function readExperiment(input: unknown): ReadResult {
  const text = typeof input === 'string' ? input : undefined;
  let value = input;
  if (text !== undefined) {
    try {
      value = JSON.parse(text);
    } catch (e) {
      return { ok: false, problems: [jsonProblem(text, e as Error)] };
    }
  }
  const prototypeKey = prototypeKeyPath(value);
  if (prototypeKey) return fail(located(prototypeKey, `a key named "${FORBIDDEN_KEY}" is not allowed anywhere in the file (it would replace an object's prototype)`, text));
  if (typeof value !== 'object' || value === null || Array.isArray(value))
    return fail(located([], `expected a JSON object (an experiment), got ${value === null ? 'null' : Array.isArray(value) ? 'an array' : typeof value}`, text));
  const version = (value as { version?: unknown }).version;
  if (version === undefined) return fail(located([], "missing 'version': this is not a Fall Line experiment file", text));
  if (typeof version !== 'number' || !Number.isInteger(version) || version < 1)
    return fail(located(['version'], `expected a whole number from 1 to ${CURRENT_VERSION}, got ${JSON.stringify(version)}`, text));
  if (version > CURRENT_VERSION)
    return fail(located(['version'], `version ${version} is newer than this program reads (1 to ${CURRENT_VERSION}); update Fall Line to open it`, text));

  let current: unknown = value;
  for (let v = version; v < CURRENT_VERSION; v++) {
    const parsed = EARLIER_VERSIONS[v].migrate(current);
    // Problems are reported against the file as written (the first step sees the file itself).
    if (!parsed.success) return fail(...problemsFromIssues(parsed.error.issues, v === version ? text : undefined, current));
    current = parsed.data;
  }
  const parsed = experimentSchema.safeParse(current);
  if (!parsed.success) return fail(...problemsFromIssues(parsed.error.issues, version === CURRENT_VERSION ? text : undefined, current));
  // The cast stays: the schema checks some parts only in outline (a data fit's dataset and model, a
  // schedule's fields are loose objects here; buildSurface and validateOptimizerSpec check them in
  // depth), so its inferred type is wider than Workspace; what it passes is typed as the workspace.
  return { ok: true, experiment: parsed.data as Experiment, problems: [] };
}

function fail(...problems: FileProblem[]): ReadResult {
  return { ok: false, problems };
}

/** Why and where the text is not JSON (JSON.parse's own message when the recogniser finds nothing). */
function jsonProblem(text: string, e: Error): FileProblem {
  const found = jsonSyntaxError(text);
  if (!found) return { path: '$', message: `not valid JSON: ${e.message}` };
  return { path: '$', message: `not valid JSON: ${found.message}`, at: positionOf(text, found.offset) };
}
