// The run summary is pure and shared with the command line: it lives in src/io/run-summary.ts.
export * from '../io/run-summary';
