import { useState } from 'react';
import { formatValue } from '../plot';

/** Row height of the parameter table in CSS pixels (fixed in styles.css, so the window can be computed). */
export const PARAM_ROW_PX = 21;
/** Above this many parameters only the rows in the scrolled window are rendered. */
export const WINDOWED_ABOVE = 40;
/** Rows in view at once when windowed; a few more are rendered above and below. */
const VISIBLE_ROWS = 14;
const OVERSCAN = 6;

export interface ParamTableProps {
  caption: string;
  names: readonly string[];
  /** This run's values (original units), or null before it has any. */
  values: readonly number[] | null;
  known: { title: string; values: readonly number[] } | null;
}

/**
 * The parameters of the run beside the known answer. A network has hundreds to thousands of
 * parameters and the view updates as the run streams, so past WINDOWED_ABOVE rows the table scrolls
 * inside a fixed box and renders only the rows in view (spacer rows keep the scroll height right):
 * re-rendering every row on every update kept the page busy for tens of milliseconds each time.
 */
export function ParamTable({ caption, names, values, known }: ParamTableProps) {
  const [scrollTop, setScrollTop] = useState(0);
  const windowed = names.length > WINDOWED_ABOVE;
  const first = windowed ? Math.max(0, Math.floor(scrollTop / PARAM_ROW_PX) - OVERSCAN) : 0;
  const last = windowed ? Math.min(names.length, first + VISIBLE_ROWS + 2 * OVERSCAN) : names.length;
  const columns = known ? 3 : 2;
  const rows = [];
  for (let k = first; k < last; k++)
    rows.push(
      <tr key={names[k]}>
        <th scope="row" className="mono">
          {names[k]}
        </th>
        <td className="mono" data-col="run">
          {values ? formatValue(values[k]) : '—'}
        </td>
        {known && (
          <td className="mono" data-col="known">
            {formatValue(known.values[k])}
          </td>
        )}
      </tr>,
    );
  const table = (
    <table className="param-table" data-testid="param-table" data-rows={names.length}>
      <caption>{caption}</caption>
      <thead>
        <tr>
          <th scope="col">parameter</th>
          <th scope="col">this run</th>
          {known && <th scope="col">{known.title}</th>}
        </tr>
      </thead>
      <tbody>
        {first > 0 && <tr aria-hidden="true" style={{ height: first * PARAM_ROW_PX }}><td colSpan={columns} /></tr>}
        {rows}
        {last < names.length && <tr aria-hidden="true" style={{ height: (names.length - last) * PARAM_ROW_PX }}><td colSpan={columns} /></tr>}
      </tbody>
    </table>
  );
  if (!windowed) return table;
  return (
    <div className="param-scroll" style={{ maxHeight: VISIBLE_ROWS * PARAM_ROW_PX + 48 }} onScroll={(e) => setScrollTop(e.currentTarget.scrollTop)} tabIndex={0} aria-label={`${names.length} parameters, scroll to see them all`}>
      {table}
    </div>
  );
}
