/**
 * Checks that need the engine, after the schema has passed: the formula parses (errors placed at their
 * line and column in the file), the surface builds, run ids are distinct, each run's optimizer and
 * settings are accepted by the engine (the start point has one coordinate per variable, and so on), and
 * so is each study (engine/study validateStudy; its SettingError's field, such as 'box.a' or
 * 'optimizers.1.spec.learningRate', becomes the path under `$.studies[k]`).
 */
import { buildOptimizer, parseFormula, RunCursor, SettingError, validateStudy, type Surface } from '../../engine';
import { buildSurface } from '../../problems';
import { offsetInString, valueOffset } from './json-locator';
import { located, type FileProblem } from './problems';
import type { Experiment } from './versions';

export function checkMeaning(experiment: Experiment, text?: string): FileProblem[] {
  const problems: FileProblem[] = [];
  const spec = experiment.surface;
  if (spec.kind === 'formula') {
    const parsed = parseFormula(spec.text);
    if (!parsed.ok) {
      const quote = text === undefined ? undefined : valueOffset(text, ['surface', 'text']);
      for (const e of parsed.errors) {
        const offset = text !== undefined && quote !== undefined ? offsetInString(text, quote, e.start) : undefined;
        problems.push(located(['surface', 'text'], `formula: ${e.message}`, text, offset));
      }
      return problems;
    }
  }
  let surface: Surface;
  try {
    surface = buildSurface(spec);
  } catch (e) {
    return [located(['surface'], errorText(e), text)];
  }
  const seen = new Map<string, number>();
  experiment.runs.forEach((run, k) => {
    const earlier = seen.get(run.id);
    if (earlier !== undefined) problems.push(located(['runs', k, 'id'], `run id "${run.id}" is already used by runs[${earlier}]`, text));
    else seen.set(run.id, k);
    try {
      new RunCursor(surface, buildOptimizer(run.optimizer), run.settings);
    } catch (e) {
      const field = e instanceof SettingError ? e.field : undefined;
      const where = field && field in run.optimizer ? ['runs', k, 'optimizer', field] : field && field in run.settings ? ['runs', k, 'settings', field] : field && field in run.settings.stop ? ['runs', k, 'settings', 'stop', field] : ['runs', k];
      problems.push(located(where, errorText(e), text));
    }
  });
  (experiment.studies ?? []).forEach((study, k) => {
    try {
      validateStudy(study, surface);
    } catch (e) {
      const field = e instanceof SettingError ? e.field.split('.').map((p) => (/^\d+$/.test(p) ? Number(p) : p)) : study.kind === 'multi-start' ? ['distribution'] : [];
      problems.push(located(['studies', k, ...presentPart(study, field)], errorText(e), text));
    }
  });
  return problems;
}

/** The longest start of `path` that names a value present in `value` (a message's field may be a default left out of the file). */
function presentPart(value: unknown, path: readonly (string | number)[]): (string | number)[] {
  const out: (string | number)[] = [];
  let node = value;
  for (const key of path) {
    if (node === null || typeof node !== 'object' || !Object.hasOwn(node, key)) break;
    node = (node as Record<string | number, unknown>)[key];
    out.push(key);
  }
  return out;
}

function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
