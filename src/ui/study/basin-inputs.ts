import type { ToleranceTarget } from '../../engine';
import { referenceMinima } from '../../io/run-exports';
import { toleranceTarget } from '../../io/run-summary';
import type { KnownPoint } from '../../problems';

// The page's basin inputs live beside the study CSV (src/io/study-basins.ts), shared with the command line.
export { basinRadiusOf, knownMinima } from '../../io/study-basins';

/** What a study's steps to tolerance are measured against: as the run table and `fall run` measure them. */
export function studyTarget(knownPoints: readonly KnownPoint[], tolerance: number): ToleranceTarget | null {
  return toleranceTarget(referenceMinima(knownPoints), tolerance);
}
