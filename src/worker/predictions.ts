import { buildSurface, type DataFitSurface, type SurfaceSpec } from '../problems';
import type { FromWorker } from '../protocol';
import { errorText } from './runs';

/**
 * A data-fit model's predictions at one parameter vector for a batch of input rows, for the page's data
 * view (the fitted curve, predicted against observed, the shaded class regions). A network's forward
 * pass over thousands of lattice points takes far longer than a frame, so it runs here, never on the
 * page. The surface of the last spec is kept (one entry): the view asks again at every run update.
 */
export class FitPredictor {
  private cache: { key: string; surface: DataFitSurface } | null = null;

  constructor(private readonly post: (msg: FromWorker) => void) {}

  /** `rows`: count x d input rows in the data's original units, in the model's input order. */
  predict(requestId: string, spec: SurfaceSpec, params: Float64Array, rows: Float64Array, count: number): void {
    try {
      const surface = this.surfaceFor(spec);
      const d = surface.inputs.length;
      if (params.length !== surface.dimension) throw new Error(`predictions: the model has ${surface.dimension} parameters, got ${params.length}`);
      if (!(Number.isInteger(count) && count >= 0 && rows.length === count * d)) throw new Error(`predictions: expected ${count} rows of ${d} inputs, got ${rows.length} numbers`);
      let width = 0;
      let outputs = new Float64Array(0);
      for (let k = 0; k < count; k++) {
        const out = surface.predict(params, rows.subarray(k * d, (k + 1) * d));
        if (k === 0) {
          width = typeof out === 'number' ? 1 : out.length;
          outputs = new Float64Array(count * width);
        }
        if (typeof out === 'number') outputs[k] = out;
        else outputs.set(out, k * width);
      }
      this.post({ type: 'fit/predictions', requestId, outputs, width }); // copied: see runs.ts
    } catch (e) {
      this.post({ type: 'fit/error', requestId, message: errorText(e) });
    }
  }

  private surfaceFor(spec: SurfaceSpec): DataFitSurface {
    if (spec.kind !== 'datafit') throw new Error(`predictions: the surface is a ${spec.kind} surface, not a model fitted to data`);
    const key = JSON.stringify(spec);
    if (this.cache?.key !== key) this.cache = { key, surface: buildSurface(spec) as DataFitSurface };
    return this.cache.surface;
  }
}
