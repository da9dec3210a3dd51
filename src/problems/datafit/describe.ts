import { symmetricEigen } from '../../engine';
import type { KnownPoint } from '../catalogue';
import { LruCache, nistFile } from '../datasets';
import type { SurfaceDescription } from '../types';
import { buildDataFitSurface } from './build';
import { designFor, type Design } from './design';
import { linearLeastSquares } from './least-squares';
import { initialNetworkParameters, MlpSurface } from './mlp';
import { isCertifiedNonlinearFit } from './nist-models';
import type { DataFitSpec, ModelSpec } from './spec';
import type { DataFitSurface } from './types';

/**
 * What the page shows about a data-fit surface before any run: label, parameter names, a plotting box
 * per parameter, the known minimum where there is one, and a start.
 *
 * Known points: a linear regression's exact least-squares minimiser ('normal equations (closed
 * form)', solved by QR; with its Hessian eigenvalues, the Hessian being constant); a NIST nonlinear
 * set with its certified model and no penalty, NIST's certified parameters (value: the certified RSS,
 * divided by N for MSE). Other models have no closed form and list none.
 *
 * Plotting boxes (our own rules; every half-width h is at least a scale taken from the data):
 * - linear: centred on the least-squares solution, h = 2 max(|w_j|, sd(y) / sd(x_j)) for a weight
 *   (sd(x_j) = 1 once standardised) and 2 max(|b|, sd(y)) for the intercept;
 * - logistic and softmax: centred on 0, h = 4 / sd(x_j) for a weight (a change of 4 in the logit
 *   across one standard deviation of the input), 4 (1 + sum_j |mean_j| / sd_j) for an intercept on
 *   raw inputs (what it takes to offset such weights), 4 once standardised;
 * - network: centred on the suggested start, h = 3 for every parameter, first-layer weights and biases
 *   scaled like the logistic ones; plus the start's own size;
 * - formula: for a NIST set the box spanning both NIST starts and the certified values with 25%
 *   margins; otherwise centred on the start, h = max(1, 2 |start_j|).
 * Starts: zeros for linear, logistic and softmax; the seeded initialisation for a network; the spec's
 * start, else NIST's Start 1, else all ones for a formula.
 */
export function describeDataFit(spec: DataFitSpec): SurfaceDescription {
  const surface = buildDataFitSurface(spec);
  const { model } = spec;
  const design = designFor(spec.dataset, model.inputs, model.target, spec.standardise ?? false);
  const description: SurfaceDescription = {
    label: labelOf(spec, design, surface),
    variables: [...surface.variables],
    view: [],
    knownPoints: [],
  };
  switch (model.kind) {
    case 'linear': {
      const solution = cachedLinearSolution(spec, design);
      if (solution) {
        const point = Array.from(solution);
        description.knownPoints.push(linearKnownPoint(surface, point));
        description.view = linearView(design, point);
      } else description.view = logisticView(design, 0);
      description.suggestedStart = zeros(surface.dimension);
      break;
    }
    case 'logistic':
      description.view = logisticView(design, 0);
      description.suggestedStart = zeros(surface.dimension);
      break;
    case 'softmax': {
      const one = logisticView(design, 0);
      const classes = surface.dimension / (design.p + 1);
      description.view = Array.from({ length: classes }, () => one).flat();
      description.suggestedStart = zeros(surface.dimension);
      break;
    }
    case 'mlp': {
      const mlp = surface as MlpSurface;
      const start = initialNetworkParameters(mlp, model.initSeed ?? 1);
      description.view = networkView(mlp, design, start);
      description.suggestedStart = start;
      break;
    }
    case 'formula': {
      if (isCertifiedNonlinearFit(spec)) {
        const file = nistFile(spec.dataset.id);
        const value = model.loss === 'rss' ? file.residualSumOfSquares : file.residualSumOfSquares / design.rows;
        description.knownPoints.push({
          point: [...file.certified],
          value,
          kind: 'global-min',
          source: `NIST StRD ${file.name} certified values (residual sum of squares ${file.residualSumOfSquares})`,
        });
        description.view = spanView([file.starts[0], file.starts[1], file.certified]);
        description.suggestedStart = model.start ? [...model.start] : [...file.starts[0]];
      } else {
        const start = model.start ? [...model.start] : new Array<number>(surface.dimension).fill(1);
        description.view = start.map((s) => {
          const h = Math.max(1, 2 * Math.abs(s));
          return [s - h, s + h];
        });
        description.suggestedStart = start;
      }
      break;
    }
  }
  const minimum = description.knownPoints.find((p) => p.kind === 'global-min');
  if (minimum && minimum.value !== 0) description.logScaleOffset = minimum.value;
  return description;
}

function zeros(n: number): number[] {
  return new Array<number>(n).fill(0);
}

function modelLabel(model: ModelSpec, surface: DataFitSurface): string {
  const on = `${model.target} on ${model.inputs.join(', ')}`;
  switch (model.kind) {
    case 'linear':
      return `Linear regression of ${on} (${surface.lossName})`;
    case 'logistic':
      return `Logistic regression of ${on}`;
    case 'softmax':
      return `Softmax regression of ${on}`;
    case 'mlp':
      return `Network ${(surface as MlpSurface).sizes.join('-')} ${model.activation}, ${model.head} head, ${on}`;
    case 'formula':
      return `${model.target} = ${model.text.trim()} (${surface.lossName})`;
  }
}

function labelOf(spec: DataFitSpec, design: Design, surface: DataFitSurface): string {
  const extras = [...(spec.l2 ? [`L2 ${spec.l2}`] : []), ...(spec.standardise ? ['standardised inputs'] : [])];
  return `${modelLabel(spec.model, surface)} - ${design.table.name}${extras.length ? ` (${extras.join(', ')})` : ''}`;
}

const SOLUTIONS = new LruCache<Float64Array | null>(16);

/** The least-squares solution, or null when the columns are linearly dependent. */
function cachedLinearSolution(spec: DataFitSpec, design: Design): Float64Array | null {
  const loss = spec.model.kind === 'linear' ? (spec.model.loss ?? 'mse') : 'mse';
  const l2 = spec.l2 ?? 0;
  return SOLUTIONS.getOrMake(`${design.key}|${loss}|${l2}`, () => {
    try {
      return linearLeastSquares(design, loss, l2);
    } catch {
      return null;
    }
  });
}

function linearKnownPoint(surface: DataFitSurface, point: number[]): KnownPoint {
  const n = surface.dimension;
  const g = new Float64Array(n);
  const h = new Float64Array(n * n);
  const value = surface.valueGradientHessian(point, g, h);
  return {
    point,
    value,
    kind: 'global-min',
    source: 'normal equations (closed form)',
    hessianEigenvalues: Array.from(symmetricEigen(h, n).values),
  };
}

const safeScale = (v: number) => (v > 0 && Number.isFinite(v) ? v : 1);

function linearView(design: Design, solution: number[]): [number, number][] {
  const sdY = safeScale(design.targetSd);
  return solution.map((w, j) => {
    const scale = j === 0 ? sdY : sdY / (design.standardised ? 1 : safeScale(design.sds[j - 1]));
    const h = 2 * Math.max(Math.abs(w), scale);
    return [w - h, w + h];
  });
}

/** [intercept, weights...] box for one affine unit, centred on 0, half-width `size` in logit units. */
function affineBox(design: Design, size: number): [number, number][] {
  const { p, standardised, means, sds } = design;
  let offset = 1;
  if (!standardised) for (let j = 0; j < p; j++) offset += Math.abs(means[j]) / safeScale(sds[j]);
  const box: [number, number][] = [[-size * offset, size * offset]];
  for (let j = 0; j < p; j++) {
    const h = standardised ? size : size / safeScale(design.sds[j]);
    box.push([-h, h]);
  }
  return box;
}

function logisticView(design: Design, centre: number): [number, number][] {
  return affineBox(design, 4).map(([lo, hi]) => [centre + lo, centre + hi]);
}

function networkView(mlp: MlpSurface, design: Design, start: number[]): [number, number][] {
  const half = new Array<number>(mlp.dimension).fill(3);
  const first = affineBox(design, 3);
  const p = design.p;
  for (let u = 0; u < mlp.sizes[1]; u++) {
    half[mlp.biasOffsets[1] + u] = first[0][1];
    for (let j = 0; j < p; j++) half[mlp.weightOffsets[1] + u * p + j] = first[j + 1][1];
  }
  return start.map((s, k) => {
    const h = half[k] + Math.abs(s);
    return [s - h, s + h];
  });
}

/** The box spanning every given point, with 25% margins (a degenerate side gets +-50% of its value, or +-1). */
function spanView(points: readonly (readonly number[])[]): [number, number][] {
  return points[0].map((_, j) => {
    const values = points.map((p) => p[j]);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const margin = hi > lo ? 0.25 * (hi - lo) : Math.abs(lo) > 0 ? 0.5 * Math.abs(lo) : 1;
    return [lo - margin, hi + margin];
  });
}
