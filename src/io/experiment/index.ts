// The experiment file (`.fall.json`): its versioned schema, reading with migrations, and the checks
// the page, the command line and the tests share.
export { CURRENT_VERSION, experimentSchema, type Experiment } from './versions';
export { readExperiment, type ReadResult } from './read';
export { checkMeaning } from './meaning';
export { formatProblem, jsonPathText, type FileProblem } from './problems';
export { OPTIMIZER_KINDS } from './fields';
export { experimentJsonSchema } from './json-schema';
