import { useId } from 'react';
import {
  OPTIMIZERS,
  SCHEDULES,
  SettingError,
  optimizerInfo,
  optimizerLabel,
  optimizerSettings,
  validateOptimizerSpec,
  validateRunSettings,
  isRowwiseSurface,
  stepsForEpochs,
  type HyperparameterInfo,
  type OptimizerKind,
  type OptimizerSpec,
  type RunSettings,
  type ScheduleSpec,
} from '../../engine';
import type { RunConfig } from '../../store/workspace';
import { useActions, useApp } from '../app-context';
import { NumberField } from '../fields/NumberField';
import { VectorFields } from '../fields/VectorFields';
import { RuleEditor } from './RuleEditor';
import { useMainThreadSurface } from '../view/use-surface';
import { RateHint } from './RateHint';
import { optimizerMessage, runErrorMessage, runSettingsMessage } from '../messages';
import { reportedUnits } from '../../store/units';

/** Every setting of the selected run. Edits apply (and restart the run) only when they validate. */
export function RunEditor({ run }: { run: RunConfig }) {
  const actions = useActions();
  const variables = useApp((s) => s.surfaceInfo.variables);
  const runError = useApp((s) => s.status[run.id]?.error ?? null);
  const spec = useApp((s) => s.workspace.surface);
  const surface = useMainThreadSurface(spec);
  const rows = surface && isRowwiseSurface(surface) ? surface.rows : undefined;
  const info = optimizerInfo(run.optimizer.kind);
  const kindId = useId();
  const scheduleId = useId();

  /** Tries an optimizer change; returns the message for `field` if it does not validate. */
  function tryOptimizer(next: OptimizerSpec, field: string): string | null {
    const problems = validateOptimizerSpec(next);
    const mine = problems.find((p) => p.field === field) ?? problems[0];
    if (mine) return optimizerMessage(mine.message, next.kind);
    actions.updateRun(run.id, { optimizer: next });
    return null;
  }

  function trySettings(next: RunSettings): string | null {
    try {
      validateRunSettings(next, variables.length, rows);
    } catch (e) {
      if (e instanceof SettingError) return runSettingsMessage(e.message);
      throw e;
    }
    actions.updateRun(run.id, { settings: next });
    return null;
  }

  const opt = run.optimizer;
  const settings = optimizerSettings(opt);
  const hyper = (h: HyperparameterInfo) => opt.hyper?.[h.name] ?? h.default;
  const schedule: ScheduleSpec = opt.schedule ?? { kind: 'constant' };
  const scheduleInfo = SCHEDULES.find((s) => s.kind === schedule.kind)!;
  const stop = run.settings.stop;

  return (
    <section className="run-editor" aria-label={`Settings of ${run.label}`}>
      <div className="field">
        <label htmlFor={`${kindId}-label`}>Label</label>
        <input id={`${kindId}-label`} type="text" value={run.label} maxLength={80} onChange={(e) => actions.updateRun(run.id, { label: e.target.value })} />
      </div>
      <div className="field">
        <label htmlFor={kindId}>Optimizer</label>
        <select
          id={kindId}
          value={opt.kind}
          onChange={(e) => actions.changeOptimizer(run.id, e.target.value as OptimizerKind)}
        >
          {OPTIMIZERS.map((o) => (
            <option key={o.kind} value={o.kind}>
              {o.label}
            </option>
          ))}
        </select>
        <p className="field-help">{info.summary}</p>
      </div>
      {opt.kind === 'rule' && <RuleEditor key={run.id} run={run} />}
      {runError && (
        <div className="field-error" role="alert">
          {runErrorMessage(runError.message, opt.kind)}
        </div>
      )}
      <fieldset>
        <legend>Step size</legend>
        <NumberField label={opt.kind === 'lbfgs' ? 'first trial step' : opt.kind === 'newton' ? 'damping factor' : 'learning rate'} value={opt.learningRate} onCommit={(v) => tryOptimizer({ ...opt, learningRate: v! }, 'learningRate')} />
        <RateHint run={run} />
        {info.family === 'first-order' && (
          <>
            <div className="field">
              <label htmlFor={scheduleId}>Schedule</label>
              <select
                id={scheduleId}
                value={schedule.kind}
                onChange={(e) => {
                  const s = SCHEDULES.find((x) => x.kind === e.target.value)!;
                  const next = { kind: s.kind, ...Object.fromEntries(s.fields.filter((f) => f.required).map((f) => [f.name, f.default])) } as ScheduleSpec;
                  tryOptimizer({ ...opt, schedule: next }, 'schedule');
                }}
              >
                {SCHEDULES.map((s) => (
                  <option key={s.kind} value={s.kind}>
                    {s.label}
                  </option>
                ))}
              </select>
            </div>
            {[...scheduleInfo.fields, { name: 'warmupSteps', label: 'warm-up steps', default: 0, help: 'Linear ramp to the base rate first.', required: false }].map((f) => (
              <NumberField
                key={f.name}
                compact
                label={f.label}
                help={f.help}
                optional={!f.required}
                value={(schedule as unknown as Record<string, number | undefined>)[f.name]}
                onCommit={(v) => tryOptimizer({ ...opt, schedule: withField(schedule, f.name, v) }, `schedule.${f.name}`)}
              />
            ))}
          </>
        )}
      </fieldset>
      {settings.length > 0 && (
        <fieldset>
          <legend>{optimizerLabel(opt)} settings</legend>
          {settings.map((h) => (
            <HyperField key={h.name} info={h} value={hyper(h)} onChange={(v) => tryOptimizer({ ...opt, hyper: { ...opt.hyper, [h.name]: v } }, `hyper.${h.name}`)} />
          ))}
        </fieldset>
      )}
      <fieldset>
        <legend>Regularisation</legend>
        {info.family === 'first-order' && <NumberField compact optional label="clip gradient norm at" value={opt.clipNorm} onCommit={(v) => tryOptimizer(omitUndefined({ ...opt, clipNorm: v }), 'clipNorm')} />}
        <NumberField compact optional label="L2 penalty (coupled)" value={opt.l2Penalty} onCommit={(v) => tryOptimizer(omitUndefined({ ...opt, l2Penalty: v }), 'l2Penalty')} />
        {info.family === 'first-order' && opt.kind !== 'rule' && (
          <NumberField compact optional label="weight decay (decoupled)" value={opt.weightDecay ?? info.defaultWeightDecay} onCommit={(v) => tryOptimizer(omitUndefined({ ...opt, weightDecay: v }), 'weightDecay')} />
        )}
      </fieldset>
      <fieldset>
        <legend>Start point{reportedUnits(surface).standardised ? ' (standardised coordinates)' : ''}</legend>
        <VectorFields
          names={variables}
          values={run.settings.start}
          label={(name) => name}
          noun="coordinate"
          onCommit={(i, v) => trySettings({ ...run.settings, start: run.settings.start.map((x, k) => (k === i ? v : x)) })}
        />
      </fieldset>
      <fieldset>
        <legend>Stopping and noise</legend>
        <NumberField compact label="max steps" value={stop.maxSteps} onCommit={(v) => trySettings({ ...run.settings, stop: { ...stop, maxSteps: v! } })} />
        <NumberField compact optional label="loss change below" value={stop.lossChangeTolerance} onCommit={(v) => trySettings({ ...run.settings, stop: omitUndefined({ ...stop, lossChangeTolerance: v }) })} />
        <NumberField compact optional label="gradient norm below" value={stop.gradientNormTolerance} onCommit={(v) => trySettings({ ...run.settings, stop: omitUndefined({ ...stop, gradientNormTolerance: v }) })} />
 {rows !== undefined && (
          <>
            <NumberField
              compact
              optional
              label={`batch size (of ${rows} rows)`}
              help="Empty: every step uses all rows (full batch). Otherwise each step uses the next batch of a seeded shuffle; the recorded loss is always the full-data loss."
              value={run.settings.minibatch?.size}
              onCommit={(v) => trySettings(omitUndefined({ ...run.settings, minibatch: v === undefined ? undefined : { size: v } }))}
            />
            {run.settings.minibatch && (
              <p className="field-help">
                {stepsPerEpoch(rows, run.settings.minibatch.size)} steps per epoch; {(stop.maxSteps / stepsPerEpoch(rows, run.settings.minibatch.size)).toFixed(1)} epochs at most
              </p>
            )}
          </>
        )}
        <NumberField compact optional label="gradient noise (std)" value={run.settings.gradientNoise} onCommit={(v) => trySettings(omitUndefined({ ...run.settings, gradientNoise: v }))} />
        <NumberField compact label="seed" value={run.settings.seed} onCommit={(v) => trySettings({ ...run.settings, seed: v! })} />
      </fieldset>
    </section>
  );
}

function HyperField({ info, value, onChange }: { info: HyperparameterInfo; value: number | boolean | string; onChange(v: number | boolean | string): string | null }) {
  const id = useId();
  if (typeof info.default === 'boolean')
    return (
      <div className="field field-compact field-check">
        <input id={id} type="checkbox" checked={value === true} onChange={(e) => onChange(e.target.checked)} />
        <label htmlFor={id} title={info.help}>
          {info.label}
        </label>
      </div>
    );
  if (info.choices)
    return (
      <div className="field field-compact">
        <label htmlFor={id}>{info.label}</label>
        <select id={id} value={String(value)} title={info.help} onChange={(e) => onChange(e.target.value)}>
          {info.choices.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </select>
      </div>
    );
  return <NumberField compact label={info.label} help={info.help} value={value as number} onCommit={(v) => onChange(v!)} />;
}

function stepsPerEpoch(rows: number, size: number): number {
  return stepsForEpochs(rows, size, 1);
}

function withField(schedule: ScheduleSpec, name: string, value: number | undefined): ScheduleSpec {
  const next: Record<string, unknown> = { ...schedule, [name]: value };
  if (value === undefined) delete next[name];
  return next as unknown as ScheduleSpec;
}

function omitUndefined<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}
