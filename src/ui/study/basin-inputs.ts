// The page's basin inputs live beside the study CSV (src/io/study-basins.ts), shared with the command line.
export { basinRadiusOf, knownMinima } from '../../io/study-basins';
