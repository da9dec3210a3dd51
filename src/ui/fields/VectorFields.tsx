import { useState, type ReactNode } from 'react';
import { NumberField } from './NumberField';

/** Up to this many entries every field is shown; beyond, one chosen entry at a time. */
export const LIST_ALL_UP_TO = 64;

export interface VectorFieldsProps {
  names: readonly string[];
  values: readonly number[];
  /** The field label of entry k (e.g. "x3 held at"). */
  label(name: string): string;
  /** Entries without a field (the slice's two axes). */
  skip?: ReadonlySet<number>;
  onCommit(k: number, value: number): string | null;
  /** What one entry is, in the chooser's label ("held value", "start coordinate"). */
  noun: string;
}

/**
 * One number field per entry of a vector (a start point, the held values of a slice). A network has
 * hundreds or thousands of parameters: a field each meant thousands of inputs in the page, and every
 * re-render of them took hundreds of milliseconds. Past LIST_ALL_UP_TO entries the fields give way to
 * the number of the entry to show and the one field for it.
 */
export function VectorFields({ names, values, label, skip, onCommit, noun }: VectorFieldsProps): ReactNode {
  const shown = names.map((_, k) => k).filter((k) => !skip?.has(k));
  const [chosen, setChosen] = useState(shown[0] ?? 0);
  if (shown.length <= LIST_ALL_UP_TO)
    return shown.map((k) => <NumberField key={names[k]} compact label={label(names[k])} value={values[k]} onCommit={(v) => onCommit(k, v!)} />);
  const k = shown.includes(chosen) ? chosen : shown[0];
  // A number, not a menu: a menu of a thousand names is a thousand elements to lay out and restyle.
  return (
    <>
      <NumberField
        compact
        label={`${noun} number (1 to ${shown.length})`}
        value={shown.indexOf(k) + 1}
        onCommit={(v) => (Number.isInteger(v) && v! >= 1 && v! <= shown.length ? (setChosen(shown[v! - 1]), null) : `${noun} number: a whole number from 1 to ${shown.length}`)}
      />
      <NumberField key={names[k]} compact label={label(names[k])} value={values[k]} onCommit={(v) => onCommit(k, v!)} />
    </>
  );
}
