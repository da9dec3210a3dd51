import type { Surface } from '../../engine';
import { formatValue } from '../plot';
import { useApp, useHover } from '../app-context';
import { slicePoint } from '../../store/slice-plane';
import { reportedUnits } from '../../store/units';
import { specKey, useProbe } from './use-probe';

/** Point, loss and gradient norm under the pointer (computed exactly at that point, in the worker). */
export function HoverReadout({ surface }: { surface: Surface | null }) {
  const hover = useHover();
  const slice = useApp((s) => s.workspace.slice);
  const variables = useApp((s) => s.surfaceInfo.variables);
  const spec = useApp((s) => s.workspace.surface);
  const at = hover ? slicePoint(slice, variables.length, hover.a, hover.b) : null;
  const key = at ? `${specKey(spec)}|${at.join(',')}` : null;
  const answer = useProbe(key, () => Float64Array.from(at!), 1);
  if (!hover || !surface || !at) return <div className="hover-readout" aria-live="polite">Point at the surface to read the loss.</div>;
  const x = reportedUnits(surface).toReported(at);
  const n = variables.length;
  const fresh = answer?.key === key;
  const loss = fresh ? answer.values[0] : Number.NaN;
  const gradNorm = fresh ? Math.hypot(...answer.gradients.subarray(0, n)) : Number.NaN;
  return (
    <div className="hover-readout mono" aria-live="polite" data-testid="hover-readout" data-fresh={fresh ? 'yes' : 'no'}>
      {x.length > 6 ? `${x.length} parameters (${variables.slice(0, 3).map((v, k) => `${v} = ${formatValue(x[k])}`).join(', ')}, ...)` : variables.map((v, k) => `${v} = ${formatValue(x[k])}`).join(', ')} · loss {fresh ? formatValue(loss) : '…'} · |gradient| {fresh ? formatValue(gradNorm) : '…'}
    </div>
  );
}
