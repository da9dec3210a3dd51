import { describe, expect, it } from 'vitest';
import { buildOptimizer, norm2, RunCursor, symmetricEigen, type OptimizerSpec } from '../../src/engine';
import { buildSurface, describeSurface, nistDataFitSpec, nistFile, type NistDatasetId } from '../../src/problems';

/**
 * NIST StRD nonlinear least squares (NIST Statistical Reference Datasets, ITL,
 * https://www.itl.nist.gov/div898/strd/nls/data/LINKS/DATA/<Name>.dat; public domain): Misra1a and
 * Chwirut2 (lower difficulty), BoxBOD (higher), each from the file's Start 1 (far) and Start 2
 * (closer), minimising the residual sum of squares with our L-BFGS and Newton variants through the
 * real run loop. Certified values are typed from the files below (a test checks the parser agrees).
 *
 * "Reached" means every parameter agrees with the certified value to at least 6 significant digits
 * (log relative error >= 6) and the RSS to a relative 1e-6. The expected table records which runs
 * do not reach it, and the printed table says where they stopped instead; docs/nist-results.md is
 * written from that output.
 */
const CERTIFIED: Record<'misra1a' | 'chwirut2' | 'boxbod', { params: number[]; rss: number; starts: number[][] }> = {
  misra1a: { params: [2.3894212918e2, 5.5015643181e-4], rss: 1.2455138894e-1, starts: [[500, 0.0001], [250, 0.0005]] },
  chwirut2: { params: [1.6657666537e-1, 5.1653291286e-3, 1.2150007096e-2], rss: 5.1304802941e2, starts: [[0.1, 0.01, 0.02], [0.15, 0.008, 0.01]] },
  boxbod: { params: [2.1380940889e2, 5.4723748542e-1], rss: 1.1680088766e3, starts: [[1, 1], [100, 0.75]] },
};

const METHODS: Record<string, OptimizerSpec> = {
  'L-BFGS': { kind: 'lbfgs', learningRate: 1 },
  Newton: { kind: 'newton', learningRate: 1 },
  'Newton + backtracking': { kind: 'newton', learningRate: 1, hyper: { lineSearch: 'backtracking' } },
  'saddle-free Newton + backtracking': { kind: 'newton', learningRate: 1, hyper: { variant: 'saddle-free', lineSearch: 'backtracking' } },
};

/** Which runs reach the certified values (set, start 1 and 2) per method; see the printed reasons. */
const EXPECTED_REACHED: Record<string, Record<keyof typeof CERTIFIED, [boolean, boolean]>> = {
  'L-BFGS': { misra1a: [true, true], chwirut2: [true, true], boxbod: [true, true] },
  Newton: { misra1a: [false, false], chwirut2: [false, true], boxbod: [false, false] },
  'Newton + backtracking': { misra1a: [false, false], chwirut2: [true, true], boxbod: [false, true] },
  'saddle-free Newton + backtracking': { misra1a: [true, true], chwirut2: [true, true], boxbod: [true, true] },
};

const STOP = { maxSteps: 5000, lossChangeTolerance: 1e-15, lossChangePatience: 10 };

const lre = (x: number, c: number) => Math.min(15, -Math.log10(Math.abs(x - c) / Math.abs(c)));

const rows: string[] = [];

describe.each(Object.keys(CERTIFIED) as (keyof typeof CERTIFIED)[])('NIST StRD %s', (id) => {
  const certified = CERTIFIED[id];
  const surface = buildSurface(nistDataFitSpec(id as NistDatasetId));

  it('the parser and describeSurface give the certified values, Start 1 as the suggested start', () => {
    const file = nistFile(id);
    expect(file.certified).toEqual(certified.params);
    expect(file.residualSumOfSquares).toBe(certified.rss);
    expect(file.starts).toEqual(certified.starts);
    const d = describeSurface(nistDataFitSpec(id as NistDatasetId));
    expect(d.knownPoints).toMatchObject([{ point: certified.params, value: certified.rss, kind: 'global-min' }]);
    expect(d.suggestedStart).toEqual(certified.starts[0]);
    // The RSS at the certified parameters, by our surface, is the certified RSS.
    expect(Math.abs(surface.value(certified.params) - certified.rss) / certified.rss).toBeLessThan(1e-9);
  });

  it.each(Object.keys(METHODS))('%s from Start 1 and Start 2', (method) => {
    certified.starts.forEach((start, s) => {
      const cursor = new RunCursor(surface, buildOptimizer(METHODS[method]), { start, seed: 1, stop: STOP });
      cursor.runToEnd();
      const x = Array.from(cursor.state.x);
      const digits = Math.min(...x.map((v, j) => lre(v, certified.params[j])));
      const rssError = Math.abs(cursor.state.loss - certified.rss) / certified.rss;
      const reached = digits >= 6 && rssError < 1e-6;
      rows.push(`| ${id} | ${s + 1} | ${method} | ${reached ? 'yes' : 'no'} | ${cursor.state.t} | ${Number.isFinite(digits) ? digits.toFixed(1) : '-'} | ${whereItStopped(cursor, certified.rss)} |`);
      expect(reached, `${id} start ${s + 1} ${method}: ${whereItStopped(cursor, certified.rss)}`).toBe(EXPECTED_REACHED[method][id][s]);
    });
  });
});

/** A plain description of the end of a run, for the table. */
function whereItStopped(cursor: RunCursor, certifiedRss: number): string {
  const o = cursor.outcome!;
  const x = Array.from(cursor.state.x).map((v) => v.toPrecision(6)).join(', ');
  if (o.kind === 'diverged') return `diverged at step ${o.step} (${o.reason})`;
  const n = cursor.surface.dimension;
  const g = new Float64Array(n);
  const h = new Float64Array(n * n);
  const loss = cursor.surface.valueGradientHessian(cursor.state.x, g, h);
  if (Math.abs(loss - certifiedRss) / certifiedRss < 1e-6) return `${o.kind} (${'rule' in o ? o.rule : ''}) at (${x}), RSS ${loss.toPrecision(11)}`;
  const eig = symmetricEigen(h, n).values;
  return `${o.kind} at (${x}), RSS ${loss.toPrecision(6)}, |g| ${norm2(g).toPrecision(2)}, Hessian eigenvalues ${Array.from(eig).map((v) => v.toPrecision(2)).join(', ')}`;
}

describe('NIST nonlinear summary', () => {
  it('prints the table', () => {
    console.log(['| set | start | method | reached | steps | min digits | where it stopped |', '|---|---|---|---|---|---|---|', ...rows].join('\n'));
    expect(rows.length).toBe(3 * 2 * Object.keys(METHODS).length);
  });
});
