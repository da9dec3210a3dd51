import { useId, useState } from 'react';
import { FormulaSyntaxError, type FormulaError } from '../../engine';
import { buildSurface, type FormulaSpec } from '../../problems';
import { useActions } from '../app-context';
import { CaretProblem } from '../fields/CaretProblem';
import { parseConstants, formatConstants } from './constants-text';
import { surfaceMessage } from '../messages';

interface Problem {
  where: 'formula' | 'constants' | 'variables';
  message: string;
  /** For formula errors: the offending span, shown under the text. */
  span?: FormulaError;
}

/**
 * A typed formula in any number of variables. Nothing is applied until it compiles; each problem is
 * shown under the field it is in, formula errors with a marker under the offending columns.
 */
export function FormulaEditor({ initial }: { initial: FormulaSpec | null }) {
  const actions = useActions();
  const id = useId();
  const [text, setText] = useState(initial?.text ?? '(1 - x)^2 + 100*(y - x^2)^2');
  const [constantsText, setConstantsText] = useState(formatConstants(initial?.constants));
  const [variablesText, setVariablesText] = useState(initial?.variables?.join(', ') ?? '');
  const [problems, setProblems] = useState<Problem[]>([]);

  function apply() {
    const constants = parseConstants(constantsText);
    if (typeof constants === 'string') return setProblems([{ where: 'constants', message: constants }]);
    const variables = variablesText.trim() ? variablesText.split(',').map((v) => v.trim()) : undefined;
    if (variables?.some((v) => !/^[A-Za-z_][A-Za-z0-9_]*$/.test(v)))
      return setProblems([{ where: 'variables', message: `Variable order: each name must start with a letter or _ and contain only letters, digits and _ (got "${variablesText}")` }]);
    const spec: FormulaSpec = { kind: 'formula', text, ...(variables ? { variables } : {}), ...(Object.keys(constants).length ? { constants } : {}) };
    try {
      buildSurface(spec);
    } catch (e) {
      if (e instanceof FormulaSyntaxError) return setProblems(e.errors.map((span) => ({ where: 'formula', message: span.message, span })));
      return setProblems([{ where: 'formula', message: surfaceMessage(e instanceof Error ? e.message : String(e)) }]);
    }
    setProblems([]);
    actions.setSurface(spec);
  }

  const of = (where: Problem['where']) => problems.filter((p) => p.where === where);
  return (
    <form
      className="formula-editor"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <div className="field">
        <label htmlFor={`${id}-text`}>Formula</label>
        <input
          id={`${id}-text`}
          className="mono"
          type="text"
          spellCheck={false}
          autoComplete="off"
          value={text}
          aria-invalid={of('formula').length > 0 || undefined}
          aria-describedby={`${id}-formula-errors`}
          onChange={(e) => setText(e.target.value)}
        />
        <div id={`${id}-formula-errors`}>
          {of('formula').map((p, k) => (
            <FormulaProblem key={k} text={text} message={p.message} span={p.span} />
          ))}
        </div>
      </div>
      <div className="field">
        <label htmlFor={`${id}-constants`}>Named constants</label>
        <input id={`${id}-constants`} className="mono" type="text" placeholder="a = 1, b = 100" value={constantsText} onChange={(e) => setConstantsText(e.target.value)} />
        {of('constants').map((p, k) => (
          <div key={k} className="field-error" role="alert">
            {p.message}
          </div>
        ))}
      </div>
      <div className="field">
        <label htmlFor={`${id}-variables`}>Variable order (optional)</label>
        <input id={`${id}-variables`} className="mono" type="text" placeholder="alphabetical" value={variablesText} onChange={(e) => setVariablesText(e.target.value)} />
        {of('variables').map((p, k) => (
          <div key={k} className="field-error" role="alert">
            {p.message}
          </div>
        ))}
      </div>
      <button type="submit">Use this formula</button>
      <p className="field-help">
        Operators + - * / ^ (or **, the same power), functions such as sin, exp, log, sqrt, abs, min, max, sigmoid, softplus; constants pi and e.
      </p>
    </form>
  );
}

/** The message, then the formula with a row of carets under the offending columns. */
export function FormulaProblem({ text, message, span }: { text: string; message: string; span?: FormulaError }) {
  return <CaretProblem message={message} line={span ? text : undefined} start={span?.start} end={span?.end} />;
}
