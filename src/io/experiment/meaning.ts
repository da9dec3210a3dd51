/**
 * Checks that need the engine, after the schema has passed: the formula parses (errors placed at their
 * line and column in the file), the surface builds, run ids are distinct, and each run's optimizer and
 * settings are accepted by the engine (the start point has one coordinate per variable, and so on).
 */
import { buildOptimizer, parseFormula, RunCursor, SettingError, type Surface } from '../../engine';
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
  return problems;
}

function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
