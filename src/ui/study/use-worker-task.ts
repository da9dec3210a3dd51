import { useState } from 'react';

/**
 * A one-off request to the study worker from a panel: `run(task)` marks the panel busy, clears the
 * last problem, and records the task's error message if it fails; the result goes wherever the task
 * puts it. Keeps the busy / error bookkeeping in one place for every such panel.
 */
export function useWorkerTask(initialProblem: string | null = null) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(initialProblem);
  const run = async (task: () => Promise<void>) => {
    setBusy(true);
    setProblem(null);
    try {
      await task();
    } catch (e) {
      setProblem((e as Error).message);
    } finally {
      setBusy(false);
    }
  };
  return { busy, problem, setProblem, run };
}
