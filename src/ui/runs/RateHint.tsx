import { useMemo } from 'react';
import { curvatureAt, rateFamily, SAFE_FRACTION } from '../../store/suggest-rate';
import type { RunConfig } from '../../store/workspace';
import { formatValue } from '../plot';
import { useApp } from '../app-context';
import { useMainThreadSurface } from '../view/use-surface';

/** The largest curvature at the run's start and the learning rate it allows plain gradient steps. */
export function RateHint({ run }: { run: RunConfig }) {
  const spec = useApp((s) => s.workspace.surface);
  const surface = useMainThreadSurface(spec);
  const start = run.settings.start;
  const c = useMemo(() => (surface ? curvatureAt(surface, start) : null), [surface, start]);
  if (rateFamily(run.optimizer.kind) === 'own') return null;
  if (!surface || surface.dimension > 200) return <p className="field-help">Too many parameters to compute the curvature at the start.</p>;
  if (!c) return null;
  if (c.stableRate === null)
    return (
      <p className="field-help" data-testid="rate-hint">
        No positive curvature at the start (λmax = {formatValue(c.lambdaMax)}), so no rate bound from it.
      </p>
    );
  return (
    <p className="field-help" data-testid="rate-hint" data-stable-rate={String(c.stableRate)}>
      2/λmax at the start = {formatValue(Number(c.stableRate.toPrecision(4)))}
      {rateFamily(run.optimizer.kind) === 'gradient'
        ? `: plain gradient steps above it diverge on the local quadratic; ${SAFE_FRACTION} of it is ${formatValue(c.suggestedRate!)}.`
        : ' (a bound for plain gradient steps; adaptive methods rescale the step).'}
    </p>
  );
}
