import { knownPointGlyph, type KnownPointKind } from '../plot';
import { useApp } from '../app-context';
import { KIND_OF_POINT } from './scene-input';

const NAMES: Record<KnownPointKind, string> = { minimum: 'minimum', saddle: 'saddle point', maximum: 'maximum' };
const SIZE = 12;

/** The key to the known-point glyphs on the map (the same glyph geometry the canvas draws), for the kinds this surface has. */
export function KnownPointKey() {
  const points = useApp((s) => s.surfaceInfo.knownPoints);
  const kinds = (['minimum', 'saddle', 'maximum'] as const).filter((k) => points.some((p) => KIND_OF_POINT[p.kind] === k));
  if (!kinds.length) return null;
  return (
    <span className="known-key" data-testid="known-point-key" aria-label="Key to the known points">
      {kinds.map((k) => (
        <span key={k} data-kind={k}>
          <Glyph kind={k} /> {NAMES[k]}
        </span>
      ))}
    </span>
  );
}

function Glyph({ kind }: { kind: KnownPointKind }) {
  const c = SIZE / 2 + 2;
  return (
    <svg width={SIZE + 4} height={SIZE + 4} viewBox={`0 0 ${SIZE + 4} ${SIZE + 4}`} aria-hidden="true">
      {knownPointGlyph(kind, SIZE * 0.8).map((part, k) =>
        part.kind === 'circle' ? (
          <circle key={k} cx={c} cy={c} r={part.r} fill={part.filled ? '#000' : 'none'} stroke="#000" strokeWidth={1.5} />
        ) : (
          <polyline key={k} points={part.points.map((p) => `${c + p.px},${c + p.py}`).join(' ') + (part.closed ? ` ${c + part.points[0].px},${c + part.points[0].py}` : '')} fill="none" stroke="#000" strokeWidth={1.5} />
        ),
      )}
    </svg>
  );
}
