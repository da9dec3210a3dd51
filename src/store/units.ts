// The unit system the page reports lives in src/io/units.ts (the command line uses it too).
export * from '../io/units';
