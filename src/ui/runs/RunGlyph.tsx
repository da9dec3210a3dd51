import { markerGeometry, runStyle } from '../plot';

/** The run's colour and marker as a small inline SVG, matching what the canvas draws. */
export function RunGlyph({ style, size = 14 }: { style: number; size?: number }) {
  const s = runStyle(style);
  const g = markerGeometry(s.marker, size * 0.7);
  const c = size / 2;
  return (
    <svg className="run-glyph" width={size} height={size} viewBox={`0 0 ${size} ${size}`} aria-hidden="true">
      {g.kind === 'circle' ? (
        <circle cx={c} cy={c} r={g.r} fill={s.colour} stroke={s.halo} strokeWidth={1} />
      ) : (
        <polygon points={g.points.map((p) => `${c + p.px},${c + p.py}`).join(' ')} fill={s.colour} stroke={s.halo} strokeWidth={1} />
      )}
    </svg>
  );
}
