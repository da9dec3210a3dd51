/**
 * Optimizer option values renamed in experiment version 3. The old values named a library or a paper
 * ('pytorch', 'optax', 'paper', 'library', 'algorithm1', 'hat', 'sutskever', 'scheduled',
 * 'constant-beta1'); the new ones say what the convention computes (the papers are cited in each
 * setting's help, src/engine/optim/methods/). Files and saved workspaces of versions 1 and 2 are
 * rewritten with this table when they are read, so they run exactly as before.
 */
import type { OptimizerSpec } from '../../engine';

type Renames = Readonly<Record<string, Readonly<Record<string, Readonly<Record<string, string>>>>>>;

const ADAM_EPSILON_FORM = { algorithm1: 'eps-after-correction', hat: 'eps-before-correction' };

/** Old value -> new value, per optimizer kind and setting. */
export const RENAMED_OPTION_VALUES: Renames = {
  adam: { epsilonForm: ADAM_EPSILON_FORM },
  adamw: { epsilonForm: ADAM_EPSILON_FORM, decayForm: { library: 'times-learning-rate', paper: 'times-schedule' } },
  amsgrad: { form: { pytorch: 'max-raw-moment', optax: 'max-corrected-moment', paper: 'no-bias-correction' } },
  nadam: { form: { scheduled: 'rising-momentum', 'constant-beta1': 'constant-momentum' } },
  nesterov: { form: { library: 'record-look-ahead', sutskever: 'record-base-point' } },
};

const own = <T>(table: Readonly<Record<string, T>>, key: string): T | undefined => (Object.hasOwn(table, key) ? table[key] : undefined);

/** The spec with every old option value replaced by its new name (other values, and other kinds, unchanged). */
export function renameOptionValues<S extends Pick<OptimizerSpec, 'kind' | 'hyper'>>(spec: S): S {
  const settings = own(RENAMED_OPTION_VALUES, spec.kind);
  if (!settings || !spec.hyper) return spec;
  const hyper = { ...spec.hyper };
  for (const [name, value] of Object.entries(hyper)) {
    const renamed = typeof value === 'string' ? own(own(settings, name) ?? {}, value) : undefined;
    if (renamed !== undefined) hyper[name] = renamed;
  }
  return { ...spec, hyper };
}
