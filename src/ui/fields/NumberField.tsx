import { useEffect, useId, useState } from 'react';

export interface NumberFieldProps {
  label: string;
  value: number | undefined;
  /** Called with a parsed finite number; returns an error message to show instead of applying, or null. */
  onCommit(value: number | undefined): string | null;
  /** Allow an empty field (meaning "not set"). */
  optional?: boolean;
  /** An error from elsewhere (e.g. the optimizer's validation) about this field. */
  error?: string | null;
  help?: string;
  step?: number | string;
  compact?: boolean;
}

/**
 * A number typed as text: the draft survives bad input (never lost work), and a message saying exactly
 * what is wrong appears right under the field. Applies on Enter or when focus leaves.
 */
export function NumberField({ label, value, onCommit, optional, error, help, compact }: NumberFieldProps) {
  const id = useId();
  const [draft, setDraft] = useState(format(value));
  const [localError, setLocalError] = useState<string | null>(null);
  useEffect(() => {
    setDraft(format(value));
    setLocalError(null);
  }, [value]);

  function commit() {
    const text = draft.trim();
    if (text === '' && optional) {
      setLocalError(onCommit(undefined));
      return;
    }
    const parsed = parseNumber(text);
    if (typeof parsed === 'string') {
      setLocalError(`${label}: ${parsed}`);
      return;
    }
    if (parsed === value) {
      setLocalError(null);
      return;
    }
    setLocalError(onCommit(parsed));
  }

  const shown = localError ?? error ?? null;
  return (
    <div className={compact ? 'field field-compact' : 'field'}>
      <label htmlFor={id}>{label}</label>
      <input
        id={id}
        type="text"
        inputMode="decimal"
        value={draft}
        title={help}
        aria-invalid={shown ? true : undefined}
        aria-describedby={shown ? `${id}-error` : undefined}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === 'Enter') commit();
          if (e.key === 'Escape') {
            setDraft(format(value));
            setLocalError(null);
          }
        }}
      />
      {shown && (
        <div className="field-error" id={`${id}-error`} role="alert">
          {shown}
        </div>
      )}
    </div>
  );
}

function format(v: number | undefined): string {
  return v === undefined || Number.isNaN(v) ? '' : String(v);
}

/** Parses a typed number ("1e-3", "-0.5", "2."); returns a message when it is not one. */
export function parseNumber(text: string): number | string {
  if (text === '') return 'a number is needed here';
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(text)) return `"${text}" is not a number`;
  const v = Number(text);
  if (!Number.isFinite(v)) return `${text} is too large`;
  return v;
}
