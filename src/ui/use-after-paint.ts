import { useEffect, useState } from 'react';

/**
 * False on a component's first render, true from a task after the next frame. A panel that renders its
 * heavy children only once this is true keeps them out of the task that mounted it: applying a data fit
 * mounts the data view, its parameter table and the line profile, and rendering them in the click's
 * own task made it one long task (about 100 ms for a 32-32 network).
 */
export function useAfterPaint(): boolean {
  const [ready, setReady] = useState(false);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const frame = requestAnimationFrame(() => (timer = setTimeout(() => setReady(true), 0)));
    return () => {
      cancelAnimationFrame(frame);
      if (timer !== undefined) clearTimeout(timer);
    };
  }, []);
  return ready;
}
