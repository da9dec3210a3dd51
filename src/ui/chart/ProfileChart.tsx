import { useEffect, useRef, useState } from 'react';
import { focusRun } from '../../store/app-store';
import { useActions, useApp, useLiveRuns } from '../app-context';
import { prepareCanvas, useElementSize } from '../view/use-canvas-size';
import { drawProfile } from './profile-chart';

/**
 * The loss along the straight line from a run's start to where it is now, a little past both ends
 * (Goodfellow, Vinyals & Saxe, ICLR 2015): a barrier on the line shows as a bump between 0 and 1.
 */
export function ProfileChart() {
  const actions = useActions();
  const live = useLiveRuns();
  const focus = useApp(focusRun);
  const surface = useApp((s) => s.workspace.surface);
  const run = focus;
  const [profile, setProfile] = useState<{ alphas: Float64Array; values: Float64Array; label: string } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const size = useElementSize(boxRef);

  useEffect(() => setProfile(null), [surface]);
  useEffect(() => {
    if (!profile || !size || !canvasRef.current) return;
    const ctx = prepareCanvas(canvasRef.current, size);
    if (ctx) drawProfile(ctx, size, profile.alphas, profile.values);
  }, [profile, size]);

  async function sample() {
    const buffer = run && live.trajectory(run.id);
    if (!run || !buffer || buffer.count < 2) return setError('the run needs at least one step first');
    setError(null);
    try {
      const p = await actions.sampleProfile(Array.from(buffer.point(0)), Array.from(buffer.point(buffer.count - 1)));
      setProfile({ ...p, label: `${run.label}, start to step ${buffer.stepOf(buffer.count - 1)}` });
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    }
  }

  return (
    <section className="panel profile-panel" aria-label="Loss along a line">
      <h2>Loss along a line</h2>
      <button type="button" onClick={sample} disabled={!run}>
        Profile {run ? run.label : 'a run'}: start to current point
      </button>
      {error && (
        <div className="field-error" role="alert">
          {error}
        </div>
      )}
      <div ref={boxRef} className="profile-box" hidden={!profile}>
        <canvas ref={canvasRef} data-testid="profile-chart" role="img" aria-label={profile ? `Loss along the line: ${profile.label}` : 'Loss along a line'} />
      </div>
      {profile && <p className="field-help">{profile.label}</p>}
    </section>
  );
}
