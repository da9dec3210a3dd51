import type { FromPoolMember, FromWorker } from '../protocol';
import type { WorkerLike } from './grid-pool';

/**
 * The page's pool workers, shared by the grid pool (bands of a grid) and the study pool (parts of a
 * study): each worker is made once and may have any number of listeners, so the two pools use the same
 * threads instead of each starting a set (on a machine with few cores, more busy threads than cores
 * only slows every one of them, the page's own included).
 */
export function sharedWorkers(factory: (index: number) => WorkerLike, size: number): WorkerLike[] {
  return Array.from({ length: size }, (_, index) => share(factory(index)));
}

function share(worker: WorkerLike): WorkerLike {
  const onMessages: ((msg: FromPoolMember | FromWorker) => void)[] = [];
  const onFailures: ((message: string) => void)[] = [];
  let failed: string | null = null;
  let terminated = false;
  worker.listen(
    (msg) => onMessages.forEach((l) => l(msg)),
    (message) => {
      failed = message;
      onFailures.forEach((l) => l(message));
    },
  );
  return {
    postMessage: (msg) => worker.postMessage(msg),
    listen(onMessage, onFailure) {
      onMessages.push(onMessage);
      onFailures.push(onFailure);
      if (failed !== null) onFailure(failed);
    },
    terminate() {
      if (terminated) return;
      terminated = true;
      worker.terminate();
    },
  };
}
