import { ADAM_EPSILON_FORMS, EPSILON_PLACEMENTS } from '../transforms';
import { choice, number, unit } from '../settings';

/** Settings shared by several methods, declared once (each method declares them under these names). */
export const beta1 = (def = 0.9) => unit(def, { help: 'Decay of the running mean of the gradient (first moment).' });

export const beta2 = (def = 0.999) => unit(def, { help: 'Decay of the running mean of the squared gradient (second moment).' });

export const epsilon = (def: number, help = 'Added to the denominator for numerical safety.') => number(def, { min: 0, help });

export const momentum = (def: number, help: string) => unit(def, { help });

export const epsilonPlacement = choice(EPSILON_PLACEMENTS, {
  label: 'epsilon placement',
  help: "'outside': g / (sqrt(s) + eps) (PyTorch); 'inside': g / sqrt(s + eps) (Keras/TF, Optax, tfjs).",
});

export const adamEpsilonForm = choice(ADAM_EPSILON_FORMS, {
  label: 'epsilon form',
  help: "'eps-after-correction': mhat / (sqrt(vhat) + eps), epsilon added to the root of the bias-corrected second moment (Kingma & Ba 2015, Algorithm 1); 'eps-before-correction': lr sqrt(1 - b2^t)/(1 - b1^t) m / (sqrt(v) + eps), epsilon added to the root of the raw one (the paper's epsilon-hat form, section 2).",
});
