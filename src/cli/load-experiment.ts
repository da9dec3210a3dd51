/** Reads and checks an experiment file; every problem is a line `file:line:column: $.path: reason`. */
import { readFileSync } from 'node:fs';
import { checkMeaning, formatProblem, readExperiment, type Experiment, type FileProblem } from '../io/experiment';
import { CliError } from './exit-codes';

export interface Loaded {
  experiment: Experiment;
  text: string;
}

export function checkFile(path: string): { loaded: Loaded | null; problems: string[] } {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    return { loaded: null, problems: [`${path}: cannot read the file: ${(e as Error).message}`] };
  }
  const read = readExperiment(text);
  const problems: FileProblem[] = read.ok ? checkMeaning(read.experiment, text) : read.problems;
  if (problems.length) return { loaded: null, problems: problems.map((p) => formatProblem(path, p)) };
  return { loaded: { experiment: (read as { experiment: Experiment }).experiment, text }, problems: [] };
}

export function loadExperiment(path: string): Loaded {
  const { loaded, problems } = checkFile(path);
  if (!loaded) throw new CliError(problems.join('\n'));
  return loaded;
}
