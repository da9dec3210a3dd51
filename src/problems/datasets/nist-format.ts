/**
 * A reader for the text format of the NIST Statistical Reference Datasets (StRD) for linear and
 * nonlinear least-squares regression (https://www.itl.nist.gov/div898/strd/). Written from the files
 * themselves: a header that says where the certified values and the data are ("Data (lines 61 to
 * 74)", 1-based line numbers), the model as a line `y = ... + e`, a table of parameters with
 * (nonlinear) two starting values, the certified estimate and its standard deviation, the residual
 * statistics, then the data columns under a `Data:  y  x` heading.
 *
 * The two suites print the residual statistics differently: nonlinear files have "Residual Sum of
 * Squares:", "Residual Standard Deviation:", "Degrees of Freedom:" and "Number of Observations:"
 * lines; linear files have a "Residual / Standard Deviation" pair of lines, "R-Squared" and an
 * analysis-of-variance table whose "Residual" row holds the degrees of freedom and the residual sum of
 * squares. Every number the parser needs must be found, or it throws naming what is missing.
 */
export interface NistFile {
  /** As in the file's "Dataset Name:" line, e.g. 'Misra1a'. */
  name: string;
  procedure: 'linear' | 'nonlinear';
  /** "Lower", "Average" or "Higher" level of difficulty, as the file says. */
  difficulty: string;
  /** The model's right-hand side as printed, e.g. 'b1*(1-exp[-b2*x])' (square brackets kept). */
  modelText: string;
  /** Parameter names in table order: b1, b2, ... (nonlinear) or B0, B1, ... (linear). */
  parameters: string[];
  /** Nonlinear files: the two starting points, "Start 1" (far) and "Start 2" (closer). Empty for linear. */
  starts: number[][];
  certified: number[];
  certifiedSd: number[];
  residualSumOfSquares: number;
  residualSd: number;
  degreesOfFreedom: number;
  observations: number;
  /** Linear files only. */
  rSquared?: number;
  /** Column names of the data section in order, response first (e.g. ['y', 'x']). */
  columns: string[];
  /** Data rows, each in `columns` order. */
  data: number[][];
}

const NUMBER = String.raw`[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?`;
const num = (s: string) => Number(s);

function fail(name: string, what: string): never {
  throw new Error(`NIST StRD file ${name}: could not find ${what}`);
}

function matchLine(lines: string[], pattern: RegExp): RegExpMatchArray | null {
  for (const line of lines) {
    const m = line.match(pattern);
    if (m) return m;
  }
  return null;
}

export function parseNistFile(text: string): NistFile {
  const lines = text.split(/\r?\n/);
  const name = matchLine(lines, /^Dataset Name:\s+(\S+)/)?.[1] ?? fail('(unnamed)', "the 'Dataset Name:' line");
  const procedureText = matchLine(lines, /^Procedure:\s+(.*?)\s*$/)?.[1] ?? fail(name, "the 'Procedure:' line");
  const procedure = /^nonlinear/i.test(procedureText) ? 'nonlinear' : /^linear/i.test(procedureText) ? 'linear' : fail(name, `a known procedure (got '${procedureText}')`);
  const difficulty = matchLine(lines, /^\s+(Lower|Average|Higher) Level of Difficulty/)?.[1] ?? fail(name, 'the level of difficulty');
  const modelText = matchLine(lines, /^\s+y\s*=\s*(.*?)\s*\+\s*e\s*$/)?.[1] ?? fail(name, "the model line 'y = ... + e'");

  const parameters: string[] = [];
  const starts: number[][] = [[], []];
  const certified: number[] = [];
  const certifiedSd: number[] = [];
  const nonlinearRow = new RegExp(String.raw`^\s*(b\d+)\s*=\s*(${NUMBER})\s+(${NUMBER})\s+(${NUMBER})\s+(${NUMBER})\s*$`);
  const linearRow = new RegExp(String.raw`^\s*(B\d+)\s+(${NUMBER})\s+(${NUMBER})\s*$`);
  for (const line of lines) {
    const m = procedure === 'nonlinear' ? line.match(nonlinearRow) : line.match(linearRow);
    if (!m) continue;
    parameters.push(m[1]);
    if (procedure === 'nonlinear') {
      starts[0].push(num(m[2]));
      starts[1].push(num(m[3]));
      certified.push(num(m[4]));
      certifiedSd.push(num(m[5]));
    } else {
      certified.push(num(m[2]));
      certifiedSd.push(num(m[3]));
    }
  }
  if (parameters.length === 0) fail(name, 'the table of certified parameters');

  const statistic = (label: string) => {
    const m = matchLine(lines, new RegExp(String.raw`^${label}:\s+(${NUMBER})\s*$`));
    return m ? num(m[1]) : fail(name, `'${label}:'`);
  };
  let residualSumOfSquares: number;
  let residualSd: number;
  let degreesOfFreedom: number;
  let observations: number;
  let rSquared: number | undefined;
  if (procedure === 'nonlinear') {
    residualSumOfSquares = statistic('Residual Sum of Squares');
    residualSd = statistic('Residual Standard Deviation');
    degreesOfFreedom = statistic('Degrees of Freedom');
    observations = statistic('Number of Observations');
  } else {
    const sd = matchLine(lines, new RegExp(String.raw`^\s+Standard Deviation\s+(${NUMBER})\s*$`)) ?? fail(name, 'the residual standard deviation');
    residualSd = num(sd[1]);
    const r2 = matchLine(lines, new RegExp(String.raw`^\s+R-Squared\s+(${NUMBER})\s*$`)) ?? fail(name, 'R-Squared');
    rSquared = num(r2[1]);
    const anova = matchLine(lines, new RegExp(String.raw`^Residual\s+(\d+)\s+(${NUMBER})\s+(${NUMBER})\s*$`)) ?? fail(name, "the 'Residual' row of the ANOVA table");
    degreesOfFreedom = num(anova[1]);
    residualSumOfSquares = num(anova[2]);
    const obs = matchLine(lines, /^\s+(\d+) Observations/) ?? fail(name, "the 'Observations' count");
    observations = num(obs[1]);
  }

  const range = matchLine(lines, /Data\s+\(lines\s+(\d+)\s+to\s+(\d+)\)/) ?? fail(name, "the 'Data (lines a to b)' pointer");
  const first = num(range[1]);
  const last = num(range[2]);
  const heading = lines[first - 2]?.match(/^\s*Data:\s+(.*?)\s*$/) ?? fail(name, `the 'Data:' column heading on line ${first - 1}`);
  const columns = heading[1].split(/\s+/);
  const data: number[][] = [];
  for (let lineNo = first; lineNo <= last; lineNo++) {
    const fields = (lines[lineNo - 1] ?? '').trim().split(/\s+/);
    const row = fields.map(num);
    if (row.length !== columns.length || row.some((v) => !Number.isFinite(v)))
      throw new Error(`NIST StRD file ${name}: line ${lineNo} should hold ${columns.length} numbers, got '${lines[lineNo - 1] ?? ''}'`);
    data.push(row);
  }
  if (data.length !== observations) throw new Error(`NIST StRD file ${name}: ${data.length} data rows, but the file says ${observations} observations`);

  return {
    name,
    procedure,
    difficulty,
    modelText,
    parameters,
    starts: procedure === 'nonlinear' ? starts : [],
    certified,
    certifiedSd,
    residualSumOfSquares,
    residualSd,
    degreesOfFreedom,
    observations,
    ...(rSquared !== undefined ? { rSquared } : {}),
    columns,
    data,
  };
}
