/** One-off computations in the engine worker, answered by request id: CSV parsing, profiles, data-fit outputs, probes. */
import type { FromWorker } from '../../protocol';
import type { RequestActions } from '../app-state';
import { freshId } from '../ids';
import type { SliceContext } from './context';

export function requestsSlice({ get, engine }: SliceContext): RequestActions {
  const { ask } = engine;
  return {
    async importCsv(text, options, onProgress) {
      try {
        const reply = await ask(
          { type: 'csv/parse', requestId: freshId('t'), text, options },
          (m): m is Extract<FromWorker, { type: 'csv/result' }> => m.type === 'csv/result',
          (m) => m.type === 'csv/progress' && onProgress?.(m.fraction, m.rowsRead),
        );
        return reply.result;
      } catch (e) {
        return { ok: false, message: (e as Error).message, problems: [], moreProblems: 0 };
      }
    },
    async sampleProfile(from, to, alphas = { from: -0.5, to: 1.5, count: 101 }) {
      const reply = await ask(
        { type: 'profile/sample', requestId: freshId('p'), surface: get().workspace.surface, from, to, alphas },
        (m): m is Extract<FromWorker, { type: 'profile/result' | 'profile/error' }> => m.type === 'profile/result' || m.type === 'profile/error',
      );
      if (reply.type === 'profile/error') throw new Error(reply.message);
      return { alphas: reply.alphas, values: reply.values };
    },
    async predictFit(params, rows, count) {
      const reply = await ask(
        { type: 'fit/predict', requestId: freshId('f'), surface: get().workspace.surface, params, rows, count },
        (m): m is Extract<FromWorker, { type: 'fit/predictions' | 'fit/error' }> => m.type === 'fit/predictions' || m.type === 'fit/error',
      );
      if (reply.type === 'fit/error') throw new Error(reply.message);
      return { outputs: reply.outputs, width: reply.width };
    },
    async probeSurface(points, count) {
      const reply = await ask(
        { type: 'probe/sample', requestId: freshId('q'), surface: get().workspace.surface, points, count },
        (m): m is Extract<FromWorker, { type: 'probe/result' | 'probe/error' }> => m.type === 'probe/result' || m.type === 'probe/error',
      );
      if (reply.type === 'probe/error') throw new Error(reply.message);
      return { values: reply.values, gradients: reply.gradients };
    },
  };
}
