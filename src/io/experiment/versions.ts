/**
 * The versions of the experiment file (`.fall.json`) and the migrations between them. Each version's
 * schema stays here unchanged once released; a file of an earlier version is validated by its own
 * schema and then migrated step by step to the current one, so files saved by any release still open.
 *
 *   1  the workspace as the page first saved it.
 *   2  adds an optional `$schema` (the JSON Schema address, for editors) and `title` (a name for the
 *      experiment, carried into the command line's summary.json); fields otherwise as in version 1.
 *   3  optimizer option values say what they compute instead of naming a library or paper (the table
 *      in renamed-options.ts; older files are rewritten with it), `display.equalScale` (optional:
 *      equal x and y units per pixel on the map; absent, on for two-variable test functions), and an
 *      optional `studies` list (start-point maps, multi-start, learning-rate sweeps as plain data,
 *      engine/study/spec.ts), run by the page's study panels and by `fall run`.
 */
import { z } from 'zod';
import { display, MAX_STUDIES, studySpec, workspaceFields } from './fields';
import { renameOptionValues } from './renamed-options';
import type { Workspace } from './types';
import { CURRENT_VERSION } from './current-version';

export { CURRENT_VERSION };

const version1 = z.strictObject({ version: z.literal(1), ...workspaceFields });

const version2 = z.strictObject({
  $schema: z.string().optional(),
  version: z.literal(2),
  title: z.string().max(200).optional(),
  ...workspaceFields,
});

export const experimentSchema = z.strictObject({
  $schema: z.string().optional(),
  version: z.literal(CURRENT_VERSION),
  title: z.string().max(200).optional(),
  ...workspaceFields,
  display: display.extend({ equalScale: z.boolean().optional() }),
  studies: z.array(studySpec).max(MAX_STUDIES).optional(),
});

/** A file that passed the current schema: the workspace, plus the editor hint `$schema`. */
export type Experiment = Workspace & { $schema?: string };

interface VersionStep {
  /** Validates a file of this version and turns it into one of the next version (or the schema's issues). */
  migrate(file: unknown): { success: true; data: unknown } | { success: false; error: z.ZodError };
}

/** A version's schema and its migration, typed together (the migration receives what the schema passed). */
function versionStep<S extends z.ZodType>(schema: S, upgrade: (file: z.output<S>) => unknown): VersionStep {
  return {
    migrate(file) {
      const parsed = schema.safeParse(file);
      return parsed.success ? { success: true, data: upgrade(parsed.data) } : { success: false, error: parsed.error };
    },
  };
}

/** Schemas of earlier versions and their one-step migration, keyed by version. */
export const EARLIER_VERSIONS: Readonly<Record<number, VersionStep>> = {
  1: versionStep(version1, (file) => ({ ...file, version: 2 })),
  2: versionStep(version2, (file) => ({ ...file, version: 3, runs: file.runs.map((run) => ({ ...run, optimizer: renameOptionValues(run.optimizer) })) })),
};
