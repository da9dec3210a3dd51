import type { FromWorker, ToWorker } from '../protocol';
import { GridSampler } from './grids';
import { sampleProfile } from './profiles';
import { RunPool } from './runs';
import { finishStudyParts, StudyRunner } from './studies';
import { sampleSharpness, searchCriticalPoints } from './analysis';
import { parseCsvInWorker } from './tables';
import { FitPredictor } from './predictions';
import { SurfaceProbe } from './probes';
import type { Timing } from './scheduler';

/** The worker's message switch, free of worker globals so tests can drive it directly. */
export function createHandler(post: (msg: FromWorker) => void, timing: Timing) {
  const runs = new RunPool(post, timing);
  const grids = new GridSampler(post, timing);
  const studies = new StudyRunner(post, timing);
  const predictions = new FitPredictor(post);
  const probes = new SurfaceProbe(post);
  return function handle(msg: ToWorker): void {
    switch (msg.type) {
      case 'run/start':
        return runs.start(msg.runId, msg.spec, msg.paused);
      case 'run/control':
        return runs.control(msg.runId, msg.action);
      case 'run/pace':
        return runs.setPace(msg.pace);
      case 'grid/sample':
        return grids.request(msg.requestId, msg.surface, msg.grid, msg.coarseFirst);
      case 'grid/cancel':
        return grids.cancel(msg.requestId);
      case 'csv/parse':
        return parseCsvInWorker(post, msg.requestId, msg.text, msg.options);
      case 'profile/sample':
        return sampleProfile(post, msg.requestId, msg.surface, msg.from, msg.to, msg.alphas);
      case 'study/start':
        return studies.start(msg.requestId, msg.surface, msg.study, msg.target, msg.part);
      case 'study/finish':
        return finishStudyParts(post, msg.requestId, msg.surface, msg.study, msg.outcomes, msg.curves);
      case 'study/cancel':
        return studies.cancel(msg.requestId);
      case 'sharpness/sample':
        return sampleSharpness(post, msg.requestId, msg.surface, msg.points, msg.count);
      case 'critical/find':
        return searchCriticalPoints(post, msg.requestId, msg.surface, msg.starts, msg.count);
      case 'fit/predict':
        return predictions.predict(msg.requestId, msg.surface, msg.params, msg.rows, msg.count);
      case 'probe/sample':
        return probes.probe(msg.requestId, msg.surface, msg.points, msg.count);
    }
  };
}
