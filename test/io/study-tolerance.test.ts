import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { buildOptimizer, RunCursor, runStudyCells, studyOrder, studySize, type StudySpec, type Surface, type ToleranceTarget } from '../../src/engine';
import { referenceMinima } from '../../src/io/run-exports';
import { emptySummary, toleranceTarget, updateSummary, type ReferenceMinimum } from '../../src/io/run-summary';
import { cellTable, studyCsvOf } from '../../src/io/study-exports';
import { buildSurface, describeSurface, type SurfaceSpec } from '../../src/problems';
import type { FromWorker } from '../../src/protocol';
import { StudyRunner } from '../../src/worker/studies';
import { multiStartStudy, startMapStudy } from '../study-examples';

// The six-hump camel's global minimum value is -1.0316... (not 0), so the test also checks that the
// tolerance is measured from it (loss - f_min <= tolerance) as the run summary measures it.
const camel: SurfaceSpec = { kind: 'catalogue', id: 'six-hump-camel' };
const TOLERANCE = 1e-4;
const view = { a: [-2, 2] as [number, number], b: [-1, 1] as [number, number] };

/** The lone run of a study cell through RunCursor, summarised by the run table's own code (updateSummary). */
function loneStepsToTolerance(surface: Surface, cursor: RunCursor, minima: readonly ReferenceMinimum[]): number | null {
  let summary = emptySummary();
  for (;;) {
    const batch = cursor.advance(500);
    summary = updateSummary(summary, batch, minima, TOLERANCE);
    if (cursor.outcome) return summary.stepsToTolerance;
  }
}

function csvColumn(csv: string): string[] {
  const { data } = Papa.parse<string[]>(csv.trim());
  const at = data[0].indexOf('steps_to_tolerance');
  expect(at).toBeGreaterThan(0);
  return data.slice(1).map((row) => row[at]);
}

describe('steps to tolerance in the studies', () => {
  const surface = buildSurface(camel);
  const info = describeSurface(camel);
  const minima = referenceMinima(info.knownPoints);
  const target = toleranceTarget(minima, TOLERANCE) as ToleranceTarget;

  it('the target is the lowest known minimum value; none on a surface without a known minimum', () => {
    expect(target).toEqual({ value: -1.0316284534898774, tolerance: TOLERANCE });
    expect(toleranceTarget(referenceMinima(describeSurface({ kind: 'formula', text: 'x^2 + y^2' }).knownPoints), TOLERANCE)).toBeNull();
  });

  it("a start-point map's CSV row holds its lone run's first step within the tolerance (RunCursor + run summary)", () => {
    const spec: StudySpec = { ...startMapStudy(), box: view, resolution: 16, stop: { maxSteps: 400, lossChangeTolerance: 1e-12, gradientNormTolerance: 1e-8 } };
    const cells = runStudyCells(spec, surface, studyOrder(spec), target);
    const column = csvColumn(studyCsvOf(spec, surface, info, view, cellTable(spec, 2, [cells])));
    const optimizer = buildOptimizer(spec.optimizer);
    let reached = 0;
    for (let c = 0; c < studySize(spec); c++) {
      const i = c % 16;
      const j = Math.floor(c / 16);
      const start = [-2 + ((i + 0.5) * 4) / 16, -1 + ((j + 0.5) * 2) / 16];
      const alone = loneStepsToTolerance(surface, new RunCursor(surface, optimizer, { start, stop: spec.stop, seed: spec.seed }), minima);
      expect(column[c], `cell ${c}`).toBe(alone === null ? '' : String(alone));
      if (alone !== null) reached++;
    }
    // Both kinds of row occur: some runs reach the global minimum's value, others end in a local minimum.
    expect(reached).toBeGreaterThan(0);
    expect(reached).toBeLessThan(256);
  });

  it('without a target the column is empty in every row', () => {
    const spec: StudySpec = { ...startMapStudy(), box: view, resolution: 16 };
    const cells = runStudyCells(spec, surface, studyOrder(spec), null);
    expect(csvColumn(studyCsvOf(spec, surface, info, view, cellTable(spec, 2, [cells]))).every((v) => v === '')).toBe(true);
  });

  it("a multi-start run in the page's worker (RunCursor per start) and on the sweep engine (command line) agree", () => {
    const spec = { ...multiStartStudy(), distribution: { kind: 'uniform' as const, box: [[-2, 2], [-1, 1]] as [number, number][] }, count: 24 };
    const viaSweep = runStudyCells(spec, surface, studyOrder(spec), target);
    const got = new Int32Array(spec.count).fill(-2);
    const slices: (() => void)[] = [];
    let clock = 0;
    const runner = new StudyRunner((msg: FromWorker) => {
      if (msg.type === 'study/cells') msg.cells.indices.forEach((cell, k) => (got[cell] = msg.cells.stepsToTolerance[k]));
      if (msg.type === 'study/error') throw new Error(msg.message);
    }, { now: () => (clock += 0.01), later: (fn) => slices.push(fn) });
    runner.start('s', camel, spec, target);
    while (slices.length) slices.shift()!();
    expect(Array.from(got)).toEqual(Array.from(viaSweep.stepsToTolerance));
    expect(viaSweep.stepsToTolerance.some((s) => s > 0)).toBe(true);
  });
});
