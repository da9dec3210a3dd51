import type { Workspace } from './experiment/types';
import { formatProblem, readExperiment } from './experiment';

/**
 * A saved workspace is an experiment file: the same shape is stored in the browser between visits and
 * written as the `.fall.json` file (schema and migrations in experiment/). Anything that fails it is
 * reported with the path of the offending field instead of half-loading.
 */
export { experimentSchema as workspaceSchema } from './experiment';

export type ParsedWorkspace = { ok: true; workspace: Workspace } | { ok: false; error: string };

/** Validates untrusted JSON text (or an already parsed value) as a workspace of any known version. */
export function parseWorkspace(input: unknown): ParsedWorkspace {
  const result = readExperiment(input);
  if (result.ok) {
    const { $schema: _ignored, ...workspace } = result.experiment;
    return { ok: true, workspace };
  }
  const p = result.problems[0];
  return { ok: false, error: formatProblem('', p).replace(/^: /, '').replace(/^:(\d+):(\d+): /, 'line $1, column $2: ') };
}
