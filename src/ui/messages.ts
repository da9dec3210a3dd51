/**
 * Messages as the page shows them. The engine and the problem specs name fields by their keys
 * ("adam: learningRate must be ...", "surface spec (datafit): model (mlp): hidden must ..."), which
 * the command line and the tests rely on; the page names each field as its label reads.
 */
import { SCHEDULES, optimizerInfo, type OptimizerKind } from '../engine';
import type { CsvImport } from '../problems';

/** The label the run editor gives the step-size field of a kind. */
export function stepSizeLabel(kind: OptimizerKind): string {
  return kind === 'lbfgs' ? 'first trial step' : kind === 'newton' ? 'damping factor' : 'learning rate';
}

const TOP_LEVEL_LABELS: Record<string, string> = {
  clipNorm: 'clip gradient norm at',
  l2Penalty: 'L2 penalty (coupled)',
  weightDecay: 'weight decay (decoupled)',
  schedule: 'schedule',
  warmupSteps: 'warm-up steps',
};

/** Key -> label of every optimizer field of a kind, as the run editor labels them. */
export function optimizerFieldLabels(kind: OptimizerKind): Map<string, string> {
  const labels = new Map<string, string>(Object.entries(TOP_LEVEL_LABELS));
  labels.set('learningRate', stepSizeLabel(kind));
  for (const h of optimizerInfo(kind).hyperparameters) labels.set(h.name, h.label);
  for (const s of SCHEDULES) for (const f of s.fields) labels.set(f.name, f.label);
  return labels;
}

function escape(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** Replaces whole-word keys by labels (longest keys first, so `beta1` is not taken for `beta`). */
function relabel(text: string, labels: Map<string, string>): string {
  const keys = [...labels.keys()].filter((k) => k !== labels.get(k)).sort((a, b) => b.length - a.length);
  if (!keys.length) return text;
  const re = new RegExp(`(?<![A-Za-z0-9_.])(${keys.map(escape).join('|')})(?![A-Za-z0-9_])`, 'g');
  return text.replace(re, (k) => labels.get(k)!);
}

/** "adam: learningRate must be a finite number > 0, got -1" -> "Adam: learning rate must be a finite number > 0, got -1". */
export function optimizerMessage(message: string, kind: OptimizerKind): string {
  const info = optimizerInfo(kind);
  const rest = message.startsWith(`${kind}: `) ? message.slice(kind.length + 2) : message.replace(/^optimizer: /, '');
  return `${info.label}: ${relabel(rest, optimizerFieldLabels(kind))}`;
}

const RUN_SETTING_LABELS = new Map<string, string>([
  ['maxSteps', 'max steps'],
  ['lossChangeTolerance', 'loss change below'],
  ['gradientNormTolerance', 'gradient norm below'],
  ['gradientNoise', 'gradient noise (std)'],
  ['minibatch', 'batch size'],
  ['size', 'batch size'],
  ['seed', 'seed'],
  ['start', 'start point'],
]);

/** "stop: maxSteps must be a whole number ..." -> "max steps must be a whole number ...". */
export function runSettingsMessage(message: string): string {
  return relabel(message.replace(/^stop: /, '').replace(/^minibatch: /, ''), RUN_SETTING_LABELS);
}

const SURFACE_KIND_LABELS: Record<string, string> = { catalogue: 'Test function', formula: 'Your formula', datafit: 'Model on data' };
const MODEL_LABELS: Record<string, string> = {
  linear: 'linear regression',
  logistic: 'logistic regression',
  softmax: 'softmax regression',
  mlp: 'small neural network',
  formula: 'model formula',
};
const DATAFIT_LABELS = new Map<string, string>([
  ['hidden', 'Hidden widths'],
  ['activation', 'Activation'],
  ['head', 'Output'],
  ['text', 'Model formula'],
  ['parameters', 'Parameters'],
  ['start', 'Start'],
  ['inputs', 'Inputs'],
  ['target', 'Target'],
  ['loss', 'Loss'],
  ['l2', 'L2 penalty (weights)'],
  ['standardise', 'standardise inputs'],
  ['initSeed', 'initial weights seed'],
  ['inputNames', 'input names'],
]);

/**
 * "surface spec (datafit): model (mlp): hidden must list ..." -> "Model on data: small neural network:
 * Hidden widths must list ...".
 */
export function surfaceMessage(message: string): string {
  let m = message;
  const kind = /^surface spec \((\w+)\): /.exec(m);
  let prefix = '';
  if (kind) {
    prefix = `${SURFACE_KIND_LABELS[kind[1]] ?? kind[1]}: `;
    m = m.slice(kind[0].length);
  }
  const model = /^model \((\w+)\)(: )?/.exec(m);
  if (model) {
    prefix += `${MODEL_LABELS[model[1]] ?? model[1]}${model[2] ? ': ' : ' '}`;
    m = m.slice(model[0].length);
  }
  return prefix + (kind?.[1] === 'datafit' ? relabel(m, DATAFIT_LABELS) : m);
}

type CsvProblem = CsvImport['problems'][number];

/** A number written with a decimal comma ("1,5", "-0,25"), as some locales' spreadsheets export. */
const DECIMAL_COMMA = /^\s*[-+]?\d*,\d+\s*$/;

/** One unreadable value of an imported file, as listed under the import. */
export function csvProblemText(p: CsvProblem): string {
  const where = p.column ? `row ${p.row}, column ${p.column}` : `row ${p.row}`;
  const reason = p.reason === 'too many fields' ? 'more fields than the header has' : p.reason === 'too large' ? 'too large for a number' : p.reason;
  const hint = p.reason === 'not a number' && DECIMAL_COMMA.test(p.value) ? ', write decimals with a point (1.5, not 1,5)' : '';
  return `${where}: ${reason}${p.value ? ` ("${p.value}")` : ''}${hint}`;
}

/** Why an import failed: the parser's own message, or for unreadable values the first of them. */
export function csvFailureText(result: Extract<CsvImport, { ok: false }>): string {
  const total = result.problems.length + result.moreProblems;
  if (!total) return result.message;
  return `${total} value${total === 1 ? '' : 's'} could not be read (first: ${csvProblemText(result.problems[0])}); fix them or tick "drop rows that cannot be read"`;
}

/** A run's error as the page shows it: optimizer, run-setting and surface messages in the page's labels. */
export function runErrorMessage(message: string, kind: OptimizerKind): string {
  if (message.startsWith(`${kind}: `) || message.startsWith('optimizer: ')) return optimizerMessage(message, kind);
  if (/^(stop|start|minibatch|seed|gradientNoise)\b/.test(message)) return runSettingsMessage(message);
  return surfaceMessage(message);
}

/** A notice that quotes a surface's error ("... could not be built (<message>); ...") with that message in page labels. */
export function noticeMessage(notice: string): string {
  const m = /^(.*? could not be built \()([\s\S]*)(\); [^;]*)$/.exec(notice);
  return m ? `${m[1]}${surfaceMessage(m[2])}${m[3]}` : notice;
}
