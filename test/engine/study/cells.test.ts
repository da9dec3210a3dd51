import { describe, expect, it } from 'vitest';
import { buildOptimizer, cellPlans, logSpaced, RunCursor, runStudyCells, SettingError, studyOrder, studySize, validateStudy } from '../../../src/engine';
import { buildSurface } from '../../../src/problems';
import { multiStartStudy, rateSweepStudy, startMapStudy } from '../../study-examples';

const himmelblau = buildSurface({ kind: 'catalogue', id: 'himmelblau' });

describe('a study\'s cells as sweep plans', () => {
  it('sizes and run orders: a map coarse to fine, the others by index', () => {
    expect([startMapStudy(), multiStartStudy(), rateSweepStudy()].map(studySize)).toEqual([256, 40, 32]);
    const order = studyOrder(startMapStudy());
    expect(new Set(order).size).toBe(256);
    expect(Array.from(order.slice(0, 4))).toEqual([0, 8, 128, 136]); // the stride-8 grid of a 16 x 16 map first
    expect(Array.from(studyOrder(rateSweepStudy()))).toEqual(Array.from({ length: 32 }, (_, k) => k));
  });

  it('a sweep\'s cells go to one plan per optimizer, at the log-spaced rate of each cell', () => {
    const spec = rateSweepStudy();
    const plans = cellPlans(spec, himmelblau, [3, 20, 17, 5]);
    expect(plans.map((p) => Array.from(p.indices))).toEqual([[3, 5], [20, 17]]);
    const rates = logSpaced(spec.range[0], spec.range[1], spec.count);
    expect(Array.from(plans[1].plan.learningRates!)).toEqual([rates[4], rates[1]]);
    expect(plans[1].plan.optimizer).toBe(spec.optimizers[1].spec);
  });

  it('runStudyCells returns the cells in the order asked, each the run a RunCursor makes alone', () => {
    const spec = rateSweepStudy();
    const cells = [31, 0, 17];
    const r = runStudyCells(spec, himmelblau, cells);
    expect(Array.from(r.indices)).toEqual(cells);
    const rates = logSpaced(spec.range[0], spec.range[1], spec.count);
    cells.forEach((c, k) => {
      const o = spec.optimizers[Math.floor(c / spec.count)].spec;
      const cursor = new RunCursor(himmelblau, buildOptimizer({ ...o, learningRate: rates[c % spec.count] }), { start: spec.start, seed: spec.seed, stop: spec.stop });
      cursor.runToEnd();
      expect(Array.from(r.endPoints.subarray(2 * k, 2 * k + 2))).toEqual(Array.from(cursor.state.x));
      expect([r.steps[k], r.loss[k]]).toEqual([cursor.state.t, cursor.state.loss]);
      expect(r.outcomes[k]).toEqual(cursor.outcome);
    });
  });

  it('refuses cells outside the study, a cell twice, and names a bad field', () => {
    expect(() => cellPlans(startMapStudy(), himmelblau, [256])).toThrow('study cells: cell 256 is outside 0..255');
    expect(() => runStudyCells(startMapStudy(), himmelblau, [4, 4])).toThrow('study cells: a cell is listed twice');
    const bad = rateSweepStudy();
    bad.optimizers[1].spec.learningRate = 0;
    const e = (() => {
      try {
        validateStudy(bad, himmelblau);
      } catch (x) {
        return x;
      }
    })();
    expect(e).toBeInstanceOf(SettingError);
    expect((e as SettingError).field).toBe('optimizers.1.spec.learningRate');
  });
});
