import { useId, useState } from 'react';
import { RULE_LIBRARY, compileRule, optimizerSettings, ruleProblems, validateOptimizerSpec, type HyperValue, type OptimizerSpec, type RuleError } from '../../engine';
import type { RunConfig } from '../../store/workspace';
import { useActions } from '../app-context';
import { CaretProblem } from '../fields/CaretProblem';

/**
 * The update rule of a run of kind 'rule': a name, the rule text, templates to start from (the rules
 * library), and every problem under its line with carets under the offending columns. Nothing is
 * applied until the rule compiles; then the run restarts with it. The rule's settings appear as
 * fields in the run editor below (its hyper lines).
 */
export function RuleEditor({ run }: { run: RunConfig }) {
  const actions = useActions();
  const id = useId();
  const opt = run.optimizer;
  const [name, setName] = useState(opt.rule?.name ?? 'My rule');
  const [text, setText] = useState(opt.rule?.text ?? '');
  const [rate, setRate] = useState<number | null>(null);
  const [problems, setProblems] = useState<RuleError[]>([]);
  const [warnings, setWarnings] = useState<readonly RuleError[]>(() => safeWarnings(opt.rule?.text));
  const [specError, setSpecError] = useState<string | null>(null);

  function apply() {
    const found = ruleProblems(text);
    setProblems(found);
    setSpecError(null);
    if (found.length > 0) return setWarnings([]);
    const rule = compileRule(text);
    setWarnings(rule.warnings);
    // A setting keeps the value typed in its field while the rule keeps its default; a new setting,
    // or a default changed in the text (another template, say), starts at the rule's default.
    const before = new Map(optimizerSettings(opt).map((h) => [h.name, h.default]));
    const hyper: Record<string, HyperValue> = {};
    for (const h of rule.hyperparameters) {
      const old = opt.hyper?.[h.name];
      hyper[h.name] = typeof old === 'number' && before.get(h.name) === h.default ? old : h.default;
    }
    const next: OptimizerSpec = { ...opt, rule: { name: name.trim() || 'My rule', text }, hyper, ...(rate !== null ? { learningRate: rate } : {}) };
    const invalid = validateOptimizerSpec(next);
    if (invalid.length > 0) return setSpecError(invalid[0].message);
    setRate(null);
    actions.updateRun(run.id, { optimizer: next, ...(run.label === opt.rule?.name ? { label: next.rule!.name } : {}) });
  }

  const lines = text.split('\n');
  return (
    <form
      className="rule-editor"
      aria-label="Update rule"
      onSubmit={(e) => {
        e.preventDefault();
        apply();
      }}
    >
      <div className="field">
        <label htmlFor={`${id}-template`}>Start from</label>
        <select
          id={`${id}-template`}
          value=""
          onChange={(e) => {
            const example = RULE_LIBRARY.find((r) => r.id === e.target.value);
            if (!example) return;
            setText(example.text);
            setName(example.label);
            setRate(example.defaultLearningRate);
            setProblems([]);
          }}
        >
          <option value="">a library rule…</option>
          {RULE_LIBRARY.map((r) => (
            <option key={r.id} value={r.id} title={r.source}>
              {r.label}
            </option>
          ))}
        </select>
      </div>
      <div className="field">
        <label htmlFor={`${id}-name`}>Rule name</label>
        <input id={`${id}-name`} type="text" maxLength={80} value={name} onChange={(e) => setName(e.target.value)} />
      </div>
      <div className="field">
        <label htmlFor={`${id}-text`}>Rule</label>
        <textarea
          id={`${id}-text`}
          className="mono rule-text"
          spellCheck={false}
          autoComplete="off"
          rows={Math.min(24, Math.max(6, lines.length + 1))}
          value={text}
          aria-invalid={problems.length > 0 || undefined}
          aria-describedby={`${id}-problems`}
          onChange={(e) => setText(e.target.value)}
        />
        <div id={`${id}-problems`}>
          {problems.map((p, k) => (
            <CaretProblem key={k} message={p.message} line={lines[p.line - 1]} start={p.column - 1} end={p.column - 1 + (p.end - p.start)} />
          ))}
          {specError && <CaretProblem message={specError} />}
          {warnings.map((w, k) => (
            <CaretProblem key={`w${k}`} tone="warning" message={`warning: ${w.message}`} line={lines[w.line - 1]} start={w.column - 1} end={w.column - 1 + (w.end - w.start)} />
          ))}
        </div>
      </div>
      <button type="submit">Use this rule</button>
      <p className="field-help">
        One statement a line: <code>hyper b = 0.9</code>, <code>state m = 0</code>, <code>let c = …</code>, <code>m = …</code>, and <code>x = …</code> for the new point. Reads{' '}
        <code>g</code> (gradient), <code>x</code>, <code>t</code> (step), <code>lr</code> (scheduled rate); element-wise, with <code>norm</code>, <code>dot</code>, <code>sum</code>,{' '}
        <code>largest</code> over all parameters, and <code>sign</code>, <code>clip</code>, <code>min</code>, <code>max</code>, <code>sqrt</code>… ; <code>#</code> starts a comment.
      </p>
    </form>
  );
}

function safeWarnings(text: string | undefined): readonly RuleError[] {
  if (!text) return [];
  try {
    return compileRule(text).warnings;
  } catch {
    return [];
  }
}
