import type { Surface } from '../../engine';
import { formatValue } from '../plot';
import { useApp } from '../app-context';
import { slicePoint } from '../../store/slice-plane';
import { probe } from './probe';
import { reportedUnits } from '../../store/units';

/** Point, loss and gradient norm under the pointer (computed exactly at that point). */
export function HoverReadout({ surface }: { surface: Surface | null }) {
  const hover = useApp((s) => s.hover);
  const slice = useApp((s) => s.slice);
  const variables = useApp((s) => s.surfaceInfo.variables);
  if (!hover || !surface) return <div className="hover-readout" aria-live="polite">Point at the surface to read the loss.</div>;
  const at = slicePoint(slice, variables.length, hover.a, hover.b);
  const { loss, gradNorm } = probe(surface, at);
  const x = reportedUnits(surface).toReported(at);
  return (
    <div className="hover-readout mono" aria-live="polite" data-testid="hover-readout">
      {x.length > 6 ? `${x.length} parameters (${variables.slice(0, 3).map((v, k) => `${v} = ${formatValue(x[k])}`).join(', ')}, ...)` : variables.map((v, k) => `${v} = ${formatValue(x[k])}`).join(', ')} · loss {formatValue(loss)} · |gradient| {formatValue(gradNorm)}
    </div>
  );
}
