import { z } from 'zod';
import { MAX_RULE_LENGTH } from '../engine';
import type { Workspace } from '../store/workspace';

/**
 * The schema of a saved workspace (version 1). The same shape is stored in the browser between visits
 * and will be the body of the `.fall.json` experiment file; anything that fails it is reported with the
 * path of the offending field instead of half-loading.
 */
const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const range = z.tuple([finite, finite]);
const constants = z.record(z.string(), finite).optional();

const surfaceSpec = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('catalogue'), id: z.string().min(1), constants }),
  z.object({ kind: z.literal('formula'), text: z.string().min(1).max(5000), variables: z.array(z.string()).optional(), constants }),
  // Data and model are checked in depth by the data-fit kind's own validation when the surface is built.
  z.object({ kind: z.literal('datafit'), dataset: z.looseObject({ kind: z.string() }), model: z.looseObject({ kind: z.string() }), l2: finite.optional(), standardise: z.boolean().optional() }),
]);

const schedule = z.looseObject({ kind: z.string() });

const optimizerSpec = z.object({
  kind: z.enum(['gd', 'momentum', 'nesterov', 'adagrad', 'rmsprop', 'adam', 'adamw', 'amsgrad', 'nadam', 'lbfgs', 'newton', 'rule']),
  learningRate: finite,
  hyper: z.record(z.string(), z.union([z.number(), z.boolean(), z.string()])).optional(),
  schedule: schedule.optional(),
  clipNorm: finite.optional(),
  l2Penalty: finite.optional(),
  weightDecay: finite.optional(),
  // Kind 'rule' only: the update rule's name and text (optional, so version-1 files without it still load;
  // the text is checked in depth by the rule compiler when the run is validated).
  rule: z.object({ name: z.string().min(1).max(200), text: z.string().max(MAX_RULE_LENGTH) }).optional(),
});

const runConfig = z.object({
  id: z.string().min(1),
  label: z.string().max(200),
  optimizer: optimizerSpec,
  settings: z.object({
    start: z.array(finite).min(1),
    seed: finite,
    gradientNoise: finite.optional(),
    minibatch: z.object({ size: z.number().int().min(1) }).optional(),
    stop: z.object({
      maxSteps: z.number().int().min(1),
      lossChangeTolerance: finite.optional(),
      lossChangePatience: z.number().int().min(1).optional(),
      gradientNormTolerance: finite.optional(),
      blowUpFactor: finite.optional(),
      stationarityTolerance: finite.optional(),
    }),
  }),
  style: z.number().int().min(0),
  hidden: z.boolean().optional(),
  cell: z.object({ row: z.number().int().min(0), column: z.number().int().min(0) }).optional(),
});

export const workspaceSchema = z.object({
  version: z.literal(1),
  surface: surfaceSpec,
  slice: z.object({
    axes: z.tuple([z.number().int().min(0), z.number().int().min(0)]),
    at: z.array(finite),
    plane: z
      .object({
        method: z.enum(['random', 'pca']),
        origin: z.array(finite),
        u: z.array(finite),
        v: z.array(finite),
        labels: z.tuple([z.string(), z.string()]),
        note: z.string(),
      })
      .nullable()
      .optional(),
  }),
  view: z.object({ a: range, b: range }),
  display: z.object({
    scale: z.enum(['log', 'linear']),
    levels: z.number().int().min(2).max(200),
    colourMap: z.enum(['viridis', 'cividis']),
    resolution: z.number().int().min(16).max(1024),
    showArrows: z.boolean(),
    showKnownPoints: z.boolean(),
  }),
  runs: z.array(runConfig).max(200),
  panels: z.object({
    mode: z.enum(['single', 'per-run', 'table']),
    tableOptimizers: z.array(optimizerSpec.shape.kind).max(12),
    tableLearningRates: z.array(finite).max(12),
  }),
  tolerance: finite,
  pace: z.union([z.number().positive(), z.literal('max')]),
});

export type ParsedWorkspace = { ok: true; workspace: Workspace } | { ok: false; error: string };

/** Validates untrusted JSON text (or an already parsed value) as a workspace. */
export function parseWorkspace(input: unknown): ParsedWorkspace {
  let value = input;
  if (typeof input === 'string') {
    try {
      value = JSON.parse(input);
    } catch (e) {
      return { ok: false, error: `not valid JSON: ${(e as Error).message}` };
    }
  }
  const result = workspaceSchema.safeParse(value);
  if (result.success) return { ok: true, workspace: result.data as Workspace };
  const issue = result.error.issues[0];
  return { ok: false, error: `${issue.path.join('.') || '(top level)'}: ${issue.message}` };
}
