import { useId, useState } from 'react';
import { focusRun } from '../../store/app-store';
import { useActions, useApp, useLiveRuns } from '../app-context';
import { NumberField } from '../fields/NumberField';
import { LIST_ALL_UP_TO, VectorFields } from '../fields/VectorFields';
import { useMainThreadSurface } from '../view/use-surface';
import { pcaPlaneSlice, randomPlaneSlice } from './plane-choices';

type Centre = 'start' | 'current' | 'known';

/**
 * For more than two variables: the plane to draw. Two chosen variables with the others held at a point;
 * a filter-normalised random plane; or the plane of a run's principal directions. Runs always move in
 * all variables; the view draws their projection onto the plane.
 */
export function SliceControls() {
  const actions = useActions();
  const live = useLiveRuns();
  const variables = useApp((s) => s.surfaceInfo.variables);
  const knownPoints = useApp((s) => s.surfaceInfo.knownPoints);
  const slice = useApp((s) => s.workspace.slice);
  const focus = useApp(focusRun);
  const spec = useApp((s) => s.workspace.surface);
  const surface = useMainThreadSurface(spec);
  const id = useId();
  const [seed, setSeed] = useState(1);
  const [centre, setCentre] = useState<Centre>('current');
  const [problem, setProblem] = useState<string | null>(null);
  if (variables.length <= 2) return null;
  const run = focus;
  const buffer = run ? live.trajectory(run.id) : undefined;
  const known = knownPoints.find((p) => p.kind === 'global-min');
  const [i, j] = slice.axes;

  /** The point a plane goes through (or the others are held at). */
  function centrePoint(which: Centre): { point: number[]; label: string } | null {
    if (which === 'known') return known ? { point: known.point, label: 'the known minimum' } : null;
    if (!run || !buffer || buffer.count === 0) return null;
    const k = which === 'start' ? 0 : buffer.count - 1;
    return { point: Array.from(buffer.point(k)), label: `${run.label} at step ${buffer.stepOf(k)}` };
  }

  function hold(which: Centre) {
    const c = centrePoint(which);
    if (!c) return setProblem(which === 'known' ? 'this surface has no known minimum' : 'select a run that has started');
    setProblem(null);
    actions.setSlice({ plane: null, at: c.point });
  }

  function drawRandom() {
    const c = centrePoint(centre);
    if (!surface || !c) return setProblem(centre === 'known' ? 'this surface has no known minimum' : 'select a run that has started');
    try {
      const { plane, view } = randomPlaneSlice(surface, c.point, seed, c.label);
      setProblem(null);
      actions.setSlice({ plane, view });
    } catch (e) {
      setProblem(e instanceof Error ? e.message : String(e));
    }
  }

  function drawPca() {
    if (!run || !buffer || buffer.count < 3) return setProblem('the run needs a few steps before its path has directions');
    try {
      const { plane, view } = pcaPlaneSlice(buffer, run.label);
      setProblem(null);
      actions.setSlice({ plane, view });
    } catch (e) {
      setProblem(e instanceof Error ? e.message : String(e));
    }
  }

  const chooseAxis = (which: 0 | 1, k: number) => {
    const other = slice.axes[1 - which];
    actions.setSlice({ plane: null, axes: which === 0 ? [k, k === other ? i : other] : [k === other ? j : other, k] });
  };
  const axisName = (which: 0 | 1) => (which === 0 ? 'Horizontal axis' : 'Vertical axis');
  // A menu of a thousand names is a thousand elements to restyle on every update of this panel (it
  // follows the focus run): past LIST_ALL_UP_TO variables the axis is chosen by number.
  const axisSelect = (which: 0 | 1) =>
    variables.length > LIST_ALL_UP_TO ? (
      <NumberField
        compact
        label={`${axisName(which)}: variable number (1 to ${variables.length})`}
        help={variables[slice.axes[which]]}
        value={slice.axes[which] + 1}
        onCommit={(v) => (Number.isInteger(v) && v! >= 1 && v! <= variables.length ? (chooseAxis(which, v! - 1), null) : `${axisName(which)}: a whole number from 1 to ${variables.length}`)}
      />
    ) : (
      <div className="field field-compact">
        <label htmlFor={`${id}-axis-${which}`}>{axisName(which)}</label>
        <select id={`${id}-axis-${which}`} value={slice.axes[which]} onChange={(e) => chooseAxis(which, Number(e.target.value))}>
          {variables.map((v, k) => (
            <option key={v} value={k}>
              {v}
            </option>
          ))}
        </select>
      </div>
    );

  return (
    <fieldset className="slice">
      <legend>Slice through {variables.length} variables</legend>
      <p className="slice-note">Runs move in all {variables.length} variables; the view shows their projection onto the plane drawn.</p>
      {slice.plane ? (
        <>
          <p className="slice-note" data-testid="plane-note">
            {slice.plane.note}
          </p>
          <button type="button" onClick={() => actions.setSlice({ plane: null })}>
            Back to two variables
          </button>
        </>
      ) : (
        <>
          {axisSelect(0)}
          {axisSelect(1)}
          <div className="row" role="group" aria-label="Hold the other variables at">
            <span className="slice-note">Hold the others at</span>
            <button type="button" onClick={() => hold('start')}>
              the run's start
            </button>
            <button type="button" onClick={() => hold('current')}>
              its current point
            </button>
            {known && (
              <button type="button" onClick={() => hold('known')}>
                the known minimum
              </button>
            )}
          </div>
          <div className="held-values" role="group" aria-label={`Held values of the other ${variables.length - 2} variables`} data-testid="held-values">
            <VectorFields
              names={variables}
              values={slice.at}
              skip={new Set([i, j])}
              label={(v) => `${v} held at`}
              noun="held value"
              onCommit={(k, x) => (actions.setSlice({ at: slice.at.map((old, m) => (m === k ? x : old)) }), null)}
            />
          </div>
        </>
      )}
      <div className="field field-compact">
        <label htmlFor={`${id}-centre`}>Plane through</label>
        <select id={`${id}-centre`} value={centre} onChange={(e) => setCentre(e.target.value as Centre)}>
          <option value="current">the run's current point</option>
          <option value="start">the run's start</option>
          {known && <option value="known">the known minimum</option>}
        </select>
      </div>
      <NumberField compact label="random seed" value={seed} onCommit={(v) => (Number.isInteger(v) ? (setSeed(v!), null) : 'random seed: a whole number')} />
      <div className="row">
        <button type="button" onClick={drawRandom}>
          Random directions
        </button>
        <button type="button" onClick={drawPca}>
          Principal directions of {run ? run.label : 'a run'}
        </button>
      </div>
      {problem && (
        <div className="field-error" role="alert">
          {problem}
        </div>
      )}
    </fieldset>
  );
}
