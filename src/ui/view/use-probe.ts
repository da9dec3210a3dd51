import { useEffect, useRef, useState } from 'react';
import { useActions } from '../app-context';

const specIds = new WeakMap<object, number>();
let nextSpecId = 0;

/** A short name for a spec object (the store replaces specs, never edits them), for probe keys. */
export function specKey(spec: object): number {
  if (!specIds.has(spec)) specIds.set(spec, nextSpecId++);
  return specIds.get(spec)!;
}

/**
 * The loss and gradient at a list of points, computed in the worker (actions.probeSurface), for the
 * hover readout and the gradient arrows: one request in flight; when the points change meanwhile, the
 * newest are asked for as soon as the answer is in (the ones between are skipped). `key` names the
 * points (null: none); the answer is returned with the key it belongs to, so a caller can tell a
 * stale one.
 */
export function useProbe(key: string | null, points: () => Float64Array, count: number): { key: string; values: Float64Array; gradients: Float64Array } | null {
  const actions = useActions();
  const [answer, setAnswer] = useState<{ key: string; values: Float64Array; gradients: Float64Array } | null>(null);
  const state = useRef({ inFlight: false, wanted: null as null | { key: string; points: () => Float64Array; count: number }, alive: true });
  useEffect(() => {
    const s = state.current;
    s.alive = true;
    return () => {
      s.alive = false;
    };
  }, []);
  useEffect(() => {
    const s = state.current;
    s.wanted = key === null ? null : { key, points, count };
    const ask = () => {
      const w = s.wanted;
      if (!w || s.inFlight) return;
      s.wanted = null;
      s.inFlight = true;
      actions
        .probeSurface(w.points(), w.count)
        .then((r) => s.alive && setAnswer({ key: w.key, ...r }))
        .catch(() => s.alive && setAnswer(null)) // a point of another surface, superseded by the newer spec
        .finally(() => {
          s.inFlight = false;
          ask();
        });
    };
    ask();
    // `points` is read when the request is sent; `key` stands for it (so it is not a dependency).
  }, [key, count, actions]);
  return answer;
}
