import { validateDatasetSpec } from '../datasets';
import { checkConstants } from '../kinds/check';
import type { DataFitSpec, ModelSpec, RegressionLoss } from './spec';

/** Shape checks for data-fit specs read from JSON, with messages that say where and what. */

const W = 'surface spec (datafit)';
export const MAX_HIDDEN_WIDTH = 64;
export const MAX_HIDDEN_LAYERS = 2;

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const describe = (v: unknown) => (v === undefined ? 'nothing' : v === null ? 'null' : Array.isArray(v) ? 'an array' : typeof v === 'string' ? JSON.stringify(v) : String(v));

function only(where: string, value: Record<string, unknown>, allowed: string[]): void {
  for (const key of Object.keys(value)) if (!allowed.includes(key)) throw new Error(`${where}: unknown field '${key}'; allowed: ${allowed.join(', ')}`);
}

function names(where: string, field: string, value: unknown, allowEmpty = false): string[] {
  if (!Array.isArray(value) || !value.every((v) => typeof v === 'string' && v.length > 0) || (!allowEmpty && value.length === 0))
    throw new Error(`${where}: ${field} must be a non-empty array of column names, got ${describe(value)}`);
  return value as string[];
}

function choice<T extends string>(where: string, field: string, value: unknown, choices: readonly T[], fallback?: T): T {
  if (value === undefined && fallback !== undefined) return fallback;
  if (typeof value !== 'string' || !choices.includes(value as T)) throw new Error(`${where}: ${field} must be one of ${choices.join(', ')}, got ${describe(value)}`);
  return value as T;
}

const LOSSES: readonly RegressionLoss[] = ['rss', 'mse'];

export function validateModelSpec(value: unknown): ModelSpec {
  const where = `${W}: model`;
  if (!isRecord(value)) throw new Error(`${where} must be an object with a 'kind', got ${describe(value)}`);
  const kinds = ['linear', 'logistic', 'softmax', 'mlp', 'formula'];
  if (typeof value.kind !== 'string' || !kinds.includes(value.kind)) throw new Error(`${where}: unknown kind ${describe(value.kind)}; known kinds: ${kinds.join(', ')}`);
  const at = `${where} (${value.kind})`;
  const inputs = names(at, 'inputs', value.inputs);
  if (typeof value.target !== 'string' || value.target.length === 0) throw new Error(`${at}: target must be a column name, got ${describe(value.target)}`);
  const target = value.target;
  switch (value.kind) {
    case 'linear': {
      only(at, value, ['kind', 'inputs', 'target', 'loss']);
      return { kind: 'linear', inputs, target, ...(value.loss !== undefined ? { loss: choice(at, 'loss', value.loss, LOSSES) } : {}) };
    }
    case 'logistic':
    case 'softmax':
      only(at, value, ['kind', 'inputs', 'target']);
      return { kind: value.kind, inputs, target };
    case 'mlp': {
      only(at, value, ['kind', 'inputs', 'target', 'hidden', 'activation', 'head', 'initSeed']);
      const hidden = value.hidden;
      if (
        !Array.isArray(hidden) ||
        hidden.length < 1 ||
        hidden.length > MAX_HIDDEN_LAYERS ||
        !hidden.every((h) => typeof h === 'number' && Number.isInteger(h) && h >= 1 && h <= MAX_HIDDEN_WIDTH)
      )
        throw new Error(`${at}: hidden must list 1 or ${MAX_HIDDEN_LAYERS} layer widths, each a whole number from 1 to ${MAX_HIDDEN_WIDTH}, got ${JSON.stringify(hidden) ?? 'nothing'}`);
      const activation = choice(at, 'activation', value.activation, ['tanh', 'relu'] as const);
      const head = choice(at, 'head', value.head, ['regression', 'binary', 'softmax'] as const);
      if (value.initSeed !== undefined && !(typeof value.initSeed === 'number' && Number.isFinite(value.initSeed)))
        throw new Error(`${at}: initSeed must be a finite number, got ${describe(value.initSeed)}`);
      return { kind: 'mlp', inputs, target, hidden: hidden as number[], activation, head, ...(value.initSeed !== undefined ? { initSeed: value.initSeed as number } : {}) };
    }
    default: {
      only(at, value, ['kind', 'inputs', 'target', 'text', 'parameters', 'inputNames', 'constants', 'loss', 'start']);
      if (typeof value.text !== 'string') throw new Error(`${at}: text must be a string, got ${describe(value.text)}`);
      const parameters = value.parameters;
      if (!Array.isArray(parameters) || parameters.length === 0 || !parameters.every((p) => typeof p === 'string'))
        throw new Error(`${at}: parameters must be a non-empty array of names, got ${describe(parameters)}`);
      const out: ModelSpec = { kind: 'formula', inputs, target, text: value.text, parameters: parameters as string[] };
      if (value.inputNames !== undefined) {
        const inputNames = value.inputNames;
        if (!Array.isArray(inputNames) || inputNames.length !== inputs.length || !inputNames.every((p) => typeof p === 'string'))
          throw new Error(`${at}: inputNames must give one name per input column (${inputs.length}), got ${describe(inputNames)}`);
        out.inputNames = inputNames as string[];
      }
      const constants = checkConstants(at, value.constants);
      if (constants) out.constants = constants;
      if (value.loss !== undefined) out.loss = choice(at, 'loss', value.loss, LOSSES);
      if (value.start !== undefined) {
        const start = value.start;
        if (!Array.isArray(start) || start.length !== parameters.length || !start.every((v) => typeof v === 'number' && Number.isFinite(v)))
          throw new Error(`${at}: start must give one finite number per parameter (${parameters.length}), got ${JSON.stringify(start) ?? 'nothing'}`);
        out.start = start as number[];
      }
      return out;
    }
  }
}

export function validateDataFitSpec(spec: Record<string, unknown>): DataFitSpec {
  only(W, spec, ['kind', 'dataset', 'model', 'l2', 'standardise']);
  let dataset;
  try {
    dataset = validateDatasetSpec(spec.dataset);
  } catch (e) {
    throw new Error(`${W}: ${(e as Error).message}`);
  }
  const model = validateModelSpec(spec.model);
  const out: DataFitSpec = { kind: 'datafit', dataset, model };
  if (spec.l2 !== undefined) {
    if (!(typeof spec.l2 === 'number' && Number.isFinite(spec.l2) && spec.l2 >= 0)) throw new Error(`${W}: l2 must be a finite number >= 0, got ${describe(spec.l2)}`);
    out.l2 = spec.l2;
  }
  if (spec.standardise !== undefined) {
    if (typeof spec.standardise !== 'boolean') throw new Error(`${W}: standardise must be true or false, got ${describe(spec.standardise)}`);
    if (spec.standardise && model.kind === 'formula')
      throw new Error(`${W}: standardise is not offered for formula models (the formula's parameters refer to its inputs in their own units)`);
    out.standardise = spec.standardise;
  }
  return out;
}
