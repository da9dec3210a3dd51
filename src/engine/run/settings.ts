import { SettingError } from '../optim/types';
import { validateMinibatch, type MinibatchSettings } from './minibatch';

/** When a run stops. Plain data, validated by `validateStopRules`. */
export interface StopRules {
  /** Hard limit on steps (>= 1). */
  maxSteps: number;
  /**
   * Converged when the relative loss change |f_t - f_{t-1}| / max(1, |f_t|, |f_{t-1}|) stays at or below
   * this for `lossChangePatience` consecutive steps (the relative form is SciPy L-BFGS-B's `ftol`
   * test; the patience guards against a momentum method pausing at a turning point).
   */
  lossChangeTolerance?: number;
  /** Consecutive steps the loss-change test must hold; default 3. */
  lossChangePatience?: number;
  /** Converged when the Euclidean gradient norm is at or below this. */
  gradientNormTolerance?: number;
  /**
   * Diverged when the loss rises above f_0 + blowUpFactor * max(1, |f_0|). Default 1e8: a run that
   * has climbed eight orders of magnitude above its start is not coming back in any useful sense.
   */
  blowUpFactor?: number;
  /**
   * tau of the scale-aware stationarity test (stationarity.ts): a point counts as stationary, and so
   * can be reported converged, when |grad| <= tau max(|grad at the start|, ...). Default 1e-5.
   */
  stationarityTolerance?: number;
}

export interface RunSettings {
  /** Start point, one coordinate per surface variable. */
  start: number[];
  stop: StopRules;
  /** Seed for everything random in the run (gradient noise, minibatch order). */
  seed: number;
  /**
   * Standard deviation of Gaussian noise added to every gradient the optimizer sees, to mimic a
   * stochastic gradient; 0 or absent for exact gradients. The recorded loss and gradient norm are
   * always the exact ones.
   */
  gradientNoise?: number;
  /**
   * Minibatch training on a data-fit surface: each step the optimizer sees the loss and gradient of the
   * next batch of rows (see minibatch.ts for the epoch order). The recorded loss and gradient norm are
   * always the exact full-data ones.
   */
  minibatch?: MinibatchSettings;
}

export const DEFAULT_LOSS_CHANGE_PATIENCE = 3;
export const DEFAULT_BLOW_UP_FACTOR = 1e8;
export const MAX_STEPS_LIMIT = 10_000_000;

export function validateStopRules(stop: StopRules): void {
  const { maxSteps } = stop;
  if (!Number.isInteger(maxSteps) || maxSteps < 1 || maxSteps > MAX_STEPS_LIMIT)
    throw new SettingError('maxSteps', `stop: maxSteps must be a whole number from 1 to ${MAX_STEPS_LIMIT}, got ${maxSteps}`);
  nonNegative('lossChangeTolerance', stop.lossChangeTolerance);
  nonNegative('gradientNormTolerance', stop.gradientNormTolerance);
  const patience = stop.lossChangePatience;
  if (patience !== undefined && (!Number.isInteger(patience) || patience < 1))
    throw new SettingError('lossChangePatience', `stop: lossChangePatience must be a whole number >= 1, got ${patience}`);
  const tau = stop.stationarityTolerance;
  if (tau !== undefined && !(tau > 0 && tau < 1))
    throw new SettingError('stationarityTolerance', `stop: stationarityTolerance must be a number in (0, 1), got ${tau}`);
  const blowUp = stop.blowUpFactor;
  if (blowUp !== undefined && !(blowUp > 0 && Number.isFinite(blowUp)))
    throw new SettingError('blowUpFactor', `stop: blowUpFactor must be a finite number > 0, got ${blowUp}`);
}

/** `rows`: the surface's data rows, for surfaces that have them (needed to check `minibatch`). */
export function validateRunSettings(settings: RunSettings, dimension: number, rows?: number): void {
  const { start } = settings;
  if (start.length !== dimension)
    throw new SettingError('start', `start: expected ${dimension} coordinates, got ${start.length}`);
  start.forEach((v, i) => {
    if (!Number.isFinite(v)) throw new SettingError('start', `start: coordinate ${i + 1} must be a finite number, got ${v}`);
  });
  if (!Number.isFinite(settings.seed)) throw new SettingError('seed', `seed must be a finite number, got ${settings.seed}`);
  nonNegative('gradientNoise', settings.gradientNoise);
  if (settings.minibatch !== undefined) validateMinibatch(settings.minibatch, rows);
  validateStopRules(settings.stop);
}

function nonNegative(field: string, v: number | undefined): void {
  if (v !== undefined && !(v >= 0 && Number.isFinite(v)))
    throw new SettingError(field, `${field} must be a finite number >= 0, got ${v}`);
}
