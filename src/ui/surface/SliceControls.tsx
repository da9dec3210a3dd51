import { useActions, useApp } from '../app-context';
import { NumberField } from '../fields/NumberField';

/** For more than two variables: which two are drawn, and where the others are held. */
export function SliceControls() {
  const actions = useActions();
  const variables = useApp((s) => s.surfaceInfo.variables);
  const slice = useApp((s) => s.slice);
  if (variables.length <= 2) return null;
  const [i, j] = slice.axes;
  const axisSelect = (which: 0 | 1) => (
    <div className="field field-compact">
      <label htmlFor={`slice-axis-${which}`}>{which === 0 ? 'Horizontal axis' : 'Vertical axis'}</label>
      <select
        id={`slice-axis-${which}`}
        value={slice.axes[which]}
        onChange={(e) => {
          const k = Number(e.target.value);
          const other = slice.axes[1 - which];
          const axes: [number, number] = which === 0 ? [k, k === other ? i : other] : [k === other ? j : other, k];
          actions.setSlice({ axes });
        }}
      >
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
      {axisSelect(0)}
      {axisSelect(1)}
      {variables.map((v, k) =>
        k === i || k === j ? null : (
          <NumberField
            key={v}
            compact
            label={`${v} held at`}
            value={slice.at[k]}
            onCommit={(x) => {
              actions.setSlice({ at: slice.at.map((old, m) => (m === k ? x! : old)) });
              return null;
            }}
          />
        ),
      )}
    </fieldset>
  );
}
