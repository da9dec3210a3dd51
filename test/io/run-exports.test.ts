import { describe, expect, it } from 'vitest';
import { defaultOptimizerSpec, RunCursor, buildOptimizer, concatBatches } from '../../src/engine';
import { referenceMinima, resultsCsvOf, trajectoriesCsvOf, trajectoriesCsvPieces } from '../../src/io/run-exports';
import { emptySummary, updateSummary } from '../../src/io/run-summary';
import { buildSurface, describeSurface } from '../../src/problems';

const spec = { kind: 'catalogue', id: 'himmelblau' } as const;
const runs = [0.01, 0.02, 0.005].map((lr, k) => ({ id: `r${k}`, label: k === 1 ? '=odd, "label"' : `gd ${lr}`, optimizer: { ...defaultOptimizerSpec('gd'), learningRate: lr } }));
const trajectories = new Map(
  runs.map((r, k) => {
    const cursor = new RunCursor(buildSurface(spec), buildOptimizer(r.optimizer), { start: [k - 1, 1], seed: 1, stop: { maxSteps: 30 + k } });
    return [r.id, concatBatches(cursor.runToEnd(7), 2)];
  }),
);
const info = describeSurface(spec);

describe('run exports', () => {
  it('the trajectory CSV in per-run pieces joins to exactly the whole text', () => {
    const whole = trajectoriesCsvOf(runs, (id) => trajectories.get(id), info.variables);
    const pieces = [...trajectoriesCsvPieces(runs, (id) => trajectories.get(id), info.variables)];
    expect(pieces).toHaveLength(3);
    expect(pieces.join('')).toBe(whole);
    expect(pieces[1].startsWith('r1,')).toBe(true);
    const none = [...trajectoriesCsvPieces(runs, () => undefined, info.variables)];
    expect(none.join('')).toBe(trajectoriesCsvOf(runs, () => undefined, info.variables));
  });

  it('measures to the known minima only when the surface has a global one', () => {
    expect(referenceMinima(info.knownPoints).length).toBe(4);
    expect(referenceMinima(info.knownPoints.filter((p) => p.kind !== 'global-min'))).toEqual([]);
  });

  it('the results CSV names the nearest minimum and the steps to tolerance', () => {
    const minima = referenceMinima(info.knownPoints);
    const summaries = new Map(runs.map((r) => [r.id, updateSummary(emptySummary(), trajectories.get(r.id)!, minima, 1e-3)]));
    const csv = resultsCsvOf(runs, (id) => summaries.get(id), info);
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('run_id,run_label,optimizer,learning_rate,outcome,outcome_detail,outcome_step,steps,final_loss,final_grad_norm,point_kind,final_x,final_y,distance_to_nearest_minimum,nearest_minimum,steps_to_tolerance');
    expect(lines[2]).toMatch(/^r1,"'=odd, ""label""",Gradient descent,0\.02,/);
    // The detail of a step-limit end states the end point: stationary here, a minimum by the Hessian.
    expect(lines[1]).toMatch(/^r0,gd 0.01,Gradient descent,0.01,step-limit,"gradient norm [^"]+ \(stationary: [^"]+\); Hessian: minimum, [^"]+",30,30,[^,]+,[^,]+,minimum,-2.805[^,]*,3.131[^,]*,[^,]+,"\(-2.80511808695, 3.13131251825\)",10$/);
  });
});
