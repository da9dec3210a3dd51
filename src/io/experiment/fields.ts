/**
 * Building blocks of the experiment file's schema, made from the code's own registries (optimizer
 * kinds from the optimizer catalogue, surface kinds from the surface handlers, the formula parser's
 * length limit) so that a new kind or a changed limit reaches the file format without a second list.
 * Every object is strict: an unknown field is an error naming its path, never silently dropped.
 */
import { z } from 'zod';
import { MAX_FORMULA_LENGTH, MAX_MULTI_STARTS, MAX_RULE_LENGTH, MAX_SWEEP_RATES, OPTIMIZERS, type OptimizerKind } from '../../engine';
import { SURFACE_KINDS, type SurfaceSpecKind } from '../../problems';

export const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const range = z.tuple([finite, finite]);
const constants = z.record(z.string(), finite).optional();

export const OPTIMIZER_KINDS = OPTIMIZERS.map((o) => o.kind) as [OptimizerKind, ...OptimizerKind[]];
export const optimizerKind = z.enum(OPTIMIZER_KINDS);

/** One shape per surface kind; the mapped type makes the compiler insist on every registered kind. */
const SURFACE_SHAPES: { [K in SurfaceSpecKind]: z.ZodObject<{ kind: z.ZodLiteral<K> } & z.ZodRawShape> } = {
  catalogue: z.strictObject({ kind: z.literal('catalogue'), id: z.string().min(1), constants }),
  formula: z.strictObject({
    kind: z.literal('formula'),
    text: z.string().min(1).max(MAX_FORMULA_LENGTH),
    variables: z.array(z.string()).optional(),
    constants,
  }),
  // Data and model are checked in depth by the data-fit kind's own validation when the surface is built.
  datafit: z.strictObject({
    kind: z.literal('datafit'),
    dataset: z.looseObject({ kind: z.string() }),
    model: z.looseObject({ kind: z.string() }),
    l2: finite.optional(),
    standardise: z.boolean().optional(),
  }),
};

export const surfaceSpec = z.discriminatedUnion(
  'kind',
  SURFACE_KINDS.map((k) => SURFACE_SHAPES[k]) as unknown as [z.ZodObject<{ kind: z.ZodLiteral<SurfaceSpecKind> }>, ...z.ZodObject<{ kind: z.ZodLiteral<SurfaceSpecKind> }>[]],
);

/** Schedules are checked by the optimizer validation (their fields depend on the kind). */
const schedule = z.looseObject({ kind: z.string() });

export const optimizerSpec = z.strictObject({
  kind: optimizerKind,
  learningRate: finite,
  hyper: z.record(z.string(), z.union([z.number(), z.boolean(), z.string()])).optional(),
  schedule: schedule.optional(),
  clipNorm: finite.optional(),
  l2Penalty: finite.optional(),
  weightDecay: finite.optional(),
  // Kind 'rule' only: the update rule's name and text (the text is checked in depth by the rule
  // compiler when the run is validated).
  rule: z.strictObject({ name: z.string().min(1).max(200), text: z.string().max(MAX_RULE_LENGTH) }).optional(),
});

export const stopRules = z.strictObject({
  maxSteps: z.number().int().min(1),
  lossChangeTolerance: finite.optional(),
  lossChangePatience: z.number().int().min(1).optional(),
  gradientNormTolerance: finite.optional(),
  blowUpFactor: finite.optional(),
  stationarityTolerance: finite.optional(),
});

export const runConfig = z.strictObject({
  id: z.string().min(1),
  label: z.string().max(200),
  optimizer: optimizerSpec,
  settings: z.strictObject({
    start: z.array(finite).min(1),
    seed: finite,
    gradientNoise: finite.optional(),
    minibatch: z.strictObject({ size: z.number().int().min(1) }).optional(),
    stop: stopRules,
  }),
  style: z.number().int().min(0),
  hidden: z.boolean().optional(),
  cell: z.strictObject({ row: z.number().int().min(0), column: z.number().int().min(0) }).optional(),
});

export const slice = z.strictObject({
  axes: z.tuple([z.number().int().min(0), z.number().int().min(0)]),
  at: z.array(finite),
  plane: z
    .strictObject({
      method: z.enum(['random', 'pca']),
      origin: z.array(finite),
      u: z.array(finite),
      v: z.array(finite),
      labels: z.tuple([z.string(), z.string()]),
      note: z.string(),
    })
    .nullable()
    .optional(),
});

export const view = z.strictObject({ a: range, b: range });

export const display = z.strictObject({
  scale: z.enum(['log', 'linear']),
  levels: z.number().int().min(2).max(200),
  colourMap: z.enum(['viridis', 'cividis']),
  resolution: z.number().int().min(16).max(1024),
  showArrows: z.boolean(),
  showKnownPoints: z.boolean(),
});

export const panels = z.strictObject({
  mode: z.enum(['single', 'per-run', 'table']),
  tableOptimizers: z.array(optimizerKind).max(12),
  tableLearningRates: z.array(finite).max(12),
});

export const MAX_RUNS = 200;

/**
 * The studies (engine/study/spec.ts StudySpec), one shape per kind. Limits that need no surface are
 * checked here; the rest (coordinates per variable, axes below the dimension, the optimizer's
 * settings, the start distribution) by meaning.ts through the engine's own validators.
 */
const whole = z.number().int();
const startMapStudy = z.strictObject({
  kind: z.literal('start-map'),
  optimizer: optimizerSpec,
  stop: stopRules,
  seed: finite,
  box: z.strictObject({ a: range, b: range }),
  axes: z.tuple([whole.min(0), whole.min(0)]),
  base: z.array(finite).min(1),
  resolution: whole.min(16).max(512),
});

const startDistribution = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('uniform'), box: z.array(range).min(1) }),
  z.strictObject({ kind: z.literal('gaussian'), centre: z.array(finite).min(1), sd: z.union([finite, z.array(finite).min(1)]) }),
  z.strictObject({ kind: z.literal('glorot') }),
  z.strictObject({ kind: z.literal('he') }),
]);

const multiStartStudy = z.strictObject({
  kind: z.literal('multi-start'),
  optimizer: optimizerSpec,
  stop: stopRules,
  seed: finite,
  distribution: startDistribution,
  count: whole.min(1).max(MAX_MULTI_STARTS),
  startSeed: finite,
});

const learningRateStudy = z.strictObject({
  kind: z.literal('lr-sweep'),
  optimizers: z.array(z.strictObject({ label: z.string().max(200), spec: optimizerSpec })).min(1).max(MAX_RUNS),
  stop: stopRules,
  seed: finite,
  start: z.array(finite).min(1),
  range: z.tuple([finite, finite]),
  count: whole.min(2).max(MAX_SWEEP_RATES),
});

export const studySpec = z.discriminatedUnion('kind', [startMapStudy, multiStartStudy, learningRateStudy]);

export const MAX_STUDIES = 20;

/** The fields every version so far shares (a version adds its own `version` and any new fields). */
export const workspaceFields = {
  surface: surfaceSpec,
  slice,
  view,
  display,
  runs: z.array(runConfig).max(MAX_RUNS),
  panels,
  tolerance: finite,
  pace: z.union([z.number().positive(), z.literal('max')]),
};
