import { describe, expect, it } from 'vitest';
import { buildDataFitSurface, describeSurface, designFor, linearLeastSquares, nistDataFitSpec, nistFile } from '../../src/problems';

/**
 * NIST StRD linear least squares, certified values (NIST Statistical Reference Datasets, ITL,
 * https://www.itl.nist.gov/div898/strd/lls/data/LINKS/DATA/Norris.dat and .../Longley.dat; public
 * domain). The numbers below are typed from those files, so the check does not lean on our parser;
 * a separate test checks the parser reads the same numbers. Our solution: Householder QR on the
 * column-scaled design (least-squares.ts), in original units and, separately, in standardised units
 * converted back.
 */
const CERTIFIED = {
  norris: {
    params: [-0.262323073774029, 1.00211681802045],
    residualSd: 0.884796396144373,
    rss: 26.6173985294224,
    rSquared: 0.999993745883712,
    df: 34,
  },
  longley: {
    params: [-3482258.63459582, 15.0618722713733, -0.35819179292591e-1, -2.02022980381683, -1.03322686717359, -0.511041056535807e-1, 1829.15146461355],
    residualSd: 304.854073561965,
    rss: 836424.055505915,
    rSquared: 0.995479004577296,
    df: 9,
  },
} as const;

/** Number of agreeing significant digits, the log relative error -log10(|x - c| / |c|) (capped at 15). */
const lre = (x: number, c: number) => Math.min(15, -Math.log10(Math.abs(x - c) / Math.abs(c)));

describe.each(['norris', 'longley'] as const)('NIST StRD %s', (id) => {
  const certified = CERTIFIED[id];
  const spec = nistDataFitSpec(id);
  const { inputs, target } = spec.model;

  it('the parser reads the certified values typed here', () => {
    const file = nistFile(id);
    expect(file.certified).toEqual([...certified.params]);
    expect(file.residualSd).toBe(certified.residualSd);
    expect(file.residualSumOfSquares).toBe(certified.rss);
    expect(file.rSquared).toBe(certified.rSquared);
    expect(file.degreesOfFreedom).toBe(certified.df);
  });

  it.each([
    ['original units', false],
    ['standardised units, converted back', true],
  ])('least squares in %s reaches the certified parameters, RSS and residual SD', (_, standardise) => {
    const design = designFor(spec.dataset, inputs, target, standardise);
    const surface = buildDataFitSurface({ ...spec, standardise });
    const solution = linearLeastSquares(design, 'rss', 0);
    const params = surface.toOriginalUnits(solution);
    const digits = params.map((p, j) => lre(p, certified.params[j]));
    const rss = surface.value(solution);
    const residualSd = Math.sqrt(rss / certified.df);
    const tss = design.targetSd ** 2 * (design.rows - 1);
    const rSquared = 1 - rss / tss;
    console.log(
      `${id} (${standardise ? 'standardised' : 'original units'}): parameter digits ${digits.map((d) => d.toFixed(1)).join(' ')}; ` +
        `RSS LRE ${lre(rss, certified.rss).toFixed(1)}, residual SD LRE ${lre(residualSd, certified.residualSd).toFixed(1)}, R^2 LRE ${lre(rSquared, certified.rSquared).toFixed(1)}`,
    );
    for (const d of digits) expect(d).toBeGreaterThanOrEqual(6);
    expect(Math.abs(rss - certified.rss) / certified.rss).toBeLessThan(1e-6);
    expect(Math.abs(residualSd - certified.residualSd) / certified.residualSd).toBeLessThan(1e-6);
    expect(Math.abs(rSquared - certified.rSquared) / certified.rSquared).toBeLessThan(1e-6);
  });

  it('describeSurface lists the closed-form minimum, at the certified parameters', () => {
    const d = describeSurface(spec);
    const min = d.knownPoints.find((p) => p.kind === 'global-min')!;
    expect(min.source).toBe('normal equations (closed form)');
    min.point.forEach((p, j) => expect(lre(p, certified.params[j])).toBeGreaterThanOrEqual(6));
    expect(Math.abs(min.value - certified.rss) / certified.rss).toBeLessThan(1e-6);
    expect(min.hessianEigenvalues!.every((v) => v > 0)).toBe(true);
    expect(d.logScaleOffset).toBe(min.value);
  });
});
