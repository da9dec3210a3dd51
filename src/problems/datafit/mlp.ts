import { createRng, nextGaussian, nextUniform, type ParameterGroup } from '../../engine';
import type { Design } from './design';
import { penaltyMask, RowLossSurface } from './row-loss';
import type { Activation, NetworkHead } from './spec';
import { logSumExp, logSumExpSoftmax, sigmoid, softplus } from './stable';
import { unitToOriginal, unitToStandardised } from './units';

/**
 * A small fully connected network (multilayer perceptron). Layers l = 1..L with widths n_0 = p (the
 * inputs), n_1, ..., n_{L-1} (1 or 2 hidden layers), n_L (1 output, or K logits for softmax):
 *   z_l = W_l a_{l-1} + b_l,  a_l = phi(z_l) for hidden layers (phi = tanh or ReLU),  a_0 = x_i,
 * and the head on z_L: 'regression' l_i = (z_L - y_i)^2 (mean squared error); 'binary' l_i =
 * softplus(z_L) - y_i z_L (mean binary cross-entropy); 'softmax' l_i = logsumexp(z_L) - z_L,y_i (mean
 * cross-entropy). All three are averaged over rows; lambda/2 |W|^2 penalises weights, not biases.
 *
 * Gradient: backpropagation (reverse mode by hand), delta_L = dl/dz_L,
 * delta_{l-1} = phi'(z_{l-1}) * (W_l^T delta_l), dl/dW_l = delta_l a_{l-1}^T, dl/db_l = delta_l.
 * Hessian: exact, by forward-over-reverse: Pearlmutter's R-operator (B. A. Pearlmutter, "Fast exact
 * multiplication by the Hessian", Neural Computation 6, 1994) gives H v per row from one forward and
 * one backward pass of directional derivatives; doing it for v = e_1..e_n gives the columns of H, at
 * O(n^2) per row; the surface's hessianVector runs the same pass once per row with the caller's v,
 * O(n) per row, without forming H. ReLU is not twice differentiable at 0: its phi'' is taken as 0
 * everywhere (exact wherever no unit sits exactly at z = 0).
 *
 * Layout: layer by layer, W_l row-major by unit (unit u's incoming weights contiguous), then b_l.
 * Names: 'h1.u3.w_<input>' (first layer), 'h2.u1.w3' (weight from unit 3 of the layer below),
 * 'h1.u3.b', and 'out.w2', 'out.b' for one output or 'out.<class>.w2' for softmax. Groups: each unit's
 * incoming weights (one filter), and each layer's biases.
 */
export interface NetworkShape {
  readonly sizes: readonly number[];
  readonly activation: Activation;
  readonly head: NetworkHead;
}

export class MlpSurface extends RowLossSurface {
  readonly model = 'mlp' as const;
  readonly lossName: string;
  readonly sizes: readonly number[];
  readonly activation: Activation;
  readonly head: NetworkHead;
  /** Offsets of W_l and b_l in the parameter vector (index 0 unused). */
  readonly weightOffsets: readonly number[];
  readonly biasOffsets: readonly number[];
  private readonly L: number;
  private readonly a: Float64Array[];
  private readonly zs: Float64Array[];
  private readonly delta: Float64Array[];
  private readonly ra: Float64Array[];
  private readonly rz: Float64Array[];
  private readonly rdelta: Float64Array[];
  private readonly probs: Float64Array;
  private readonly direction: Float64Array;

  constructor(design: Design, shape: NetworkShape, classLabels: readonly string[], l2: number) {
    const sizes = shape.sizes;
    const L = sizes.length - 1;
    const { names, groups, weightOffsets, biasOffsets, biases } = layout(design.inputs, sizes, classLabels);
    super(design, names, groups, 'mean', l2, penaltyMask(names.length, biases));
    this.sizes = Object.freeze([...sizes]);
    this.activation = shape.activation;
    this.head = shape.head;
    this.weightOffsets = weightOffsets;
    this.biasOffsets = biasOffsets;
    this.L = L;
    const buffers = () => sizes.map((n) => new Float64Array(n));
    this.a = buffers();
    this.zs = buffers();
    this.delta = buffers();
    this.ra = buffers();
    this.rz = buffers();
    this.rdelta = buffers();
    this.probs = new Float64Array(sizes[L]);
    this.direction = new Float64Array(names.length);
    this.lossName = shape.head === 'regression' ? 'mean squared error' : shape.head === 'binary' ? 'mean binary cross-entropy' : 'mean cross-entropy';
  }

  /** Forward pass for row i from the design (or for `input` when given, already in design units). */
  private forward(w: Float64Array, i: number, input: ArrayLike<number> | null): Float64Array {
    const { x, p } = this.design;
    const a0 = this.a[0];
    if (input) for (let j = 0; j < p; j++) a0[j] = input[j];
    else for (let j = 0, o = i * p; j < p; j++) a0[j] = x[o + j];
    const relu = this.activation === 'relu';
    for (let l = 1; l <= this.L; l++) {
      const nIn = this.sizes[l - 1];
      const nOut = this.sizes[l];
      const prev = this.a[l - 1];
      const z = this.zs[l];
      const act = this.a[l];
      let wo = this.weightOffsets[l];
      const bo = this.biasOffsets[l];
      for (let u = 0; u < nOut; u++) {
        let s = w[bo + u];
        for (let v = 0; v < nIn; v++) s += w[wo + v] * prev[v];
        wo += nIn;
        z[u] = s;
        if (l < this.L) act[u] = relu ? (s > 0 ? s : 0) : Math.tanh(s);
      }
    }
    return this.zs[this.L];
  }

  /** The head's loss at the output z for target t (value only). */
  private headValue(z: Float64Array, t: number): number {
    if (this.head === 'regression') {
      const r = z[0] - t;
      return r * r;
    }
    if (this.head === 'binary') return softplus(z[0]) - t * z[0];
    return logSumExp(z, z.length) - z[t];
  }

  /** The head's loss, writing dl/dz_L into delta[L]. */
  private headGradient(z: Float64Array, t: number): number {
    const d = this.delta[this.L];
    if (this.head === 'regression') {
      const r = z[0] - t;
      d[0] = 2 * r;
      return r * r;
    }
    if (this.head === 'binary') {
      d[0] = sigmoid(z[0]) - t;
      return softplus(z[0]) - t * z[0];
    }
    const lse = logSumExpSoftmax(z, z.length, this.probs);
    for (let c = 0; c < z.length; c++) d[c] = this.probs[c] - (c === t ? 1 : 0);
    return lse - z[t];
  }

  /** phi'(z) from z and a = phi(z). */
  private slope(z: number, a: number): number {
    return this.activation === 'relu' ? (z > 0 ? 1 : 0) : 1 - a * a;
  }

  /** phi''(z) from a = phi(z): tanh'' = -2 a (1 - a^2); ReLU'' taken as 0. */
  private curvature(a: number): number {
    return this.activation === 'relu' ? 0 : -2 * a * (1 - a * a);
  }

  /** Backward pass from delta[L], adding the row's gradient into g (only the deltas when g is null). */
  private backward(w: Float64Array, g: Float64Array | null): void {
    for (let l = this.L; l >= 1; l--) {
      const nIn = this.sizes[l - 1];
      const nOut = this.sizes[l];
      const d = this.delta[l];
      const prev = this.a[l - 1];
      const wo = this.weightOffsets[l];
      const bo = this.biasOffsets[l];
      if (g !== null)
        for (let u = 0; u < nOut; u++) {
          const du = d[u];
          g[bo + u] += du;
          const row = wo + u * nIn;
          for (let v = 0; v < nIn; v++) g[row + v] += du * prev[v];
        }
      if (l > 1) {
        const below = this.delta[l - 1];
        const zb = this.zs[l - 1];
        for (let v = 0; v < nIn; v++) {
          let s = 0;
          for (let u = 0; u < nOut; u++) s += w[wo + u * nIn + v] * d[u];
          below[v] = this.slope(zb[v], prev[v]) * s;
        }
      }
    }
  }

  /**
   * H v for the current row (after forward and backward), added into out[k * stride + column] for
   * parameter k: the R-operator's forward pass (R z_l, R a_l), the head's second derivative, then its
   * backward pass. With stride n it fills column `column` of an n x n Hessian; with stride 1 and
   * column 0 it adds the product into a vector.
   */
  private addHessianVector(w: Float64Array, v: Float64Array, out: Float64Array, stride: number, column: number): void {
    const L = this.L;
    const n = stride;
    const h = out;
    this.ra[0].fill(0);
    for (let l = 1; l <= L; l++) {
      const nIn = this.sizes[l - 1];
      const nOut = this.sizes[l];
      const prev = this.a[l - 1];
      const rprev = this.ra[l - 1];
      const rz = this.rz[l];
      const wo = this.weightOffsets[l];
      const bo = this.biasOffsets[l];
      for (let u = 0; u < nOut; u++) {
        let s = v[bo + u];
        const row = wo + u * nIn;
        for (let q = 0; q < nIn; q++) s += v[row + q] * prev[q] + w[row + q] * rprev[q];
        rz[u] = s;
        if (l < L) this.ra[l][u] = this.slope(this.zs[l][u], this.a[l][u]) * s;
      }
    }
    const rzL = this.rz[L];
    const rdL = this.rdelta[L];
    const zL = this.zs[L];
    if (this.head === 'regression') rdL[0] = 2 * rzL[0];
    else if (this.head === 'binary') {
      const q = sigmoid(zL[0]);
      rdL[0] = q * (1 - q) * rzL[0];
    } else {
      const probs = this.probs;
      let dotp = 0;
      for (let c = 0; c < zL.length; c++) dotp += probs[c] * rzL[c];
      for (let c = 0; c < zL.length; c++) rdL[c] = probs[c] * (rzL[c] - dotp);
    }
    for (let l = L; l >= 1; l--) {
      const nIn = this.sizes[l - 1];
      const nOut = this.sizes[l];
      const d = this.delta[l];
      const rd = this.rdelta[l];
      const prev = this.a[l - 1];
      const rprev = this.ra[l - 1];
      const wo = this.weightOffsets[l];
      const bo = this.biasOffsets[l];
      for (let u = 0; u < nOut; u++) {
        h[(bo + u) * n + column] += rd[u];
        const row = wo + u * nIn;
        for (let q = 0; q < nIn; q++) h[(row + q) * n + column] += rd[u] * prev[q] + d[u] * rprev[q];
      }
      if (l > 1) {
        const zb = this.zs[l - 1];
        const rzb = this.rz[l - 1];
        const rbelow = this.rdelta[l - 1];
        for (let q = 0; q < nIn; q++) {
          let back = 0;
          let rback = 0;
          for (let u = 0; u < nOut; u++) {
            const k = wo + u * nIn + q;
            back += w[k] * d[u];
            rback += v[k] * d[u] + w[k] * rd[u];
          }
          rbelow[q] = this.curvature(prev[q]) * rzb[q] * back + this.slope(zb[q], prev[q]) * rback;
        }
      }
    }
  }

  protected sumValue(w: Float64Array, rows: Int32Array | null, count: number): number {
    if (this.L === 2 && this.sizes[2] === 1) return this.sumValueOneHidden(w, rows, count);
    const y = this.design.y;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      s += this.headValue(this.forward(w, i, null), y[i]);
    }
    return s;
  }

  /**
   * The value-only loop for the common shape (one hidden layer, one output), written out: it reads the
   * inputs straight from the design and folds the output unit into the hidden loop. Same arithmetic
   * as forward() + headValue(), in the same order.
   */
  private sumValueOneHidden(w: Float64Array, rows: Int32Array | null, count: number): number {
    const { x, y, p } = this.design;
    const hidden = this.sizes[1];
    const w1 = this.weightOffsets[1];
    const b1 = this.biasOffsets[1];
    const w2 = this.weightOffsets[2];
    const b2 = this.biasOffsets[2];
    const relu = this.activation === 'relu';
    const regression = this.head === 'regression';
    let total = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      const o = i * p;
      let z = w[b2];
      for (let u = 0, row = w1; u < hidden; u++, row += p) {
        let s = w[b1 + u];
        for (let j = 0; j < p; j++) s += w[row + j] * x[o + j];
        z += w[w2 + u] * (relu ? (s > 0 ? s : 0) : Math.tanh(s));
      }
      if (regression) {
        const r = z - y[i];
        total += r * r;
      } else total += softplus(z) - y[i] * z;
    }
    return total;
  }

  protected sumGradient(w: Float64Array, g: Float64Array, rows: Int32Array | null, count: number): number {
    const y = this.design.y;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      s += this.headGradient(this.forward(w, i, null), y[i]);
      this.backward(w, g);
    }
    return s;
  }

  protected sumHessian(w: Float64Array, g: Float64Array, h: Float64Array, rows: Int32Array | null, count: number): number {
    const y = this.design.y;
    const v = this.direction;
    let s = 0;
    for (let k = 0; k < count; k++) {
      const i = rows === null ? k : rows[k];
      s += this.headGradient(this.forward(w, i, null), y[i]);
      this.backward(w, g);
      for (let m = 0; m < this.dimension; m++) {
        v[m] = 1;
        this.addHessianVector(w, v, h, this.dimension, m);
        v[m] = 0;
      }
    }
    // Each column is exact; average the two triangles so rounding leaves H exactly symmetric.
    const n = this.dimension;
    for (let r = 0; r < n; r++)
      for (let c = 0; c < r; c++) {
        const mean = 0.5 * (h[r * n + c] + h[c * n + r]);
        h[r * n + c] = mean;
        h[c * n + r] = mean;
      }
    return s;
  }

  /**
   * H v over every row by the R-operator (one forward, one backward and one R pass per row, O(N n)),
   * never forming H: the same arithmetic as one column of sumHessian with v in place of e_m.
   */
  protected sumHessianVector(w: Float64Array, v: Float64Array, out: Float64Array): void {
    const y = this.design.y;
    for (let i = 0; i < this.rows; i++) {
      this.headGradient(this.forward(w, i, null), y[i]);
      this.backward(w, null);
      this.addHessianVector(w, v, out, 1, 0);
    }
  }

  /** First-layer units converted (units.ts); deeper layers never see the inputs and are unchanged. */
  toOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    if (this.design.standardised) this.eachFirstLayerUnit((ws, b) => unitToOriginal(out, ws, b, this.design.means, this.design.sds));
    return out;
  }

  fromOriginalUnits(params: ArrayLike<number>): number[] {
    const out = Array.from(params);
    if (this.design.standardised) this.eachFirstLayerUnit((ws, b) => unitToStandardised(out, ws, b, this.design.means, this.design.sds));
    return out;
  }

  private eachFirstLayerUnit(visit: (weightStart: number, biasIndex: number) => void): void {
    const p = this.sizes[0];
    for (let u = 0; u < this.sizes[1]; u++) visit(this.weightOffsets[1] + u * p, this.biasOffsets[1] + u);
  }

  /** Regression: the output; binary: P(y = 1); softmax: the class probabilities. */
  predict(params: ArrayLike<number>, inputRow: ArrayLike<number>): number | number[] {
    const { p, standardised, means, sds } = this.design;
    const input = new Float64Array(p);
    for (let j = 0; j < p; j++) input[j] = standardised ? (inputRow[j] - means[j]) / sds[j] : inputRow[j];
    const z = this.forward(Float64Array.from(params), -1, input);
    if (this.head === 'regression') return z[0];
    if (this.head === 'binary') return sigmoid(z[0]);
    const probs = new Float64Array(z.length);
    logSumExpSoftmax(z, z.length, probs);
    return Array.from(probs);
  }
}

function layout(inputs: readonly string[], sizes: readonly number[], classLabels: readonly string[]) {
  const L = sizes.length - 1;
  const names: string[] = [];
  const groups: ParameterGroup[] = [];
  const weightOffsets = [0];
  const biasOffsets = [0];
  const biases: number[] = [];
  for (let l = 1; l <= L; l++) {
    const nIn = sizes[l - 1];
    const nOut = sizes[l];
    const layer = l < L ? `h${l}` : 'out';
    const unitName = (u: number) => (l < L ? `${layer}.u${u + 1}` : nOut === 1 ? 'out' : `out.${classLabels[u] ?? `k${u + 1}`}`);
    const fromName = (q: number) => (l === 1 ? `w_${inputs[q]}` : `w${q + 1}`);
    weightOffsets.push(names.length);
    for (let u = 0; u < nOut; u++) {
      const start = names.length;
      for (let q = 0; q < nIn; q++) names.push(`${unitName(u)}.${fromName(q)}`);
      groups.push({ name: unitName(u), indices: Array.from({ length: nIn }, (_, q) => start + q), kind: 'weights' });
    }
    biasOffsets.push(names.length);
    const layerBiases: number[] = [];
    for (let u = 0; u < nOut; u++) {
      layerBiases.push(names.length);
      names.push(`${unitName(u)}.b`);
    }
    biases.push(...layerBiases);
    groups.push({ name: `${layer} biases`, indices: layerBiases, kind: 'bias' });
  }
  return { names, groups, weightOffsets, biasOffsets, biases };
}

/**
 * A seeded starting point: biases 0; weights of tanh layers and of the output layer from Glorot
 * uniform U(-r, r), r = sqrt(6 / (fan_in + fan_out)) (X. Glorot & Y. Bengio, "Understanding the
 * difficulty of training deep feedforward neural networks", AISTATS 2010); weights of ReLU layers
 * from He normal N(0, 2 / fan_in) (K. He, X. Zhang, S. Ren & J. Sun, "Delving deep into rectifiers",
 * ICCV 2015). Zeros would be a poor start: every hidden unit would stay identical.
 */
export function initialNetworkParameters(surface: MlpSurface, seed: number): number[] {
  const rng = createRng(seed);
  const out = new Array<number>(surface.dimension).fill(0);
  const { sizes } = surface;
  const L = sizes.length - 1;
  for (let l = 1; l <= L; l++) {
    const fanIn = sizes[l - 1];
    const fanOut = sizes[l];
    const he = l < L && surface.activation === 'relu';
    const r = Math.sqrt(6 / (fanIn + fanOut));
    const sd = Math.sqrt(2 / fanIn);
    const start = surface.weightOffsets[l];
    for (let k = 0; k < fanIn * fanOut; k++) out[start + k] = he ? sd * nextGaussian(rng) : r * (2 * nextUniform(rng) - 1);
  }
  return out;
}
