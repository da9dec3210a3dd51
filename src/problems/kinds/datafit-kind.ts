import type { Surface } from '../../engine';
import { buildDataFitSurface, describeDataFit, validateDataFitSpec, type DataFitSpec } from '../datafit';
import type { SurfaceDescription, SurfaceKind } from '../types';

/** Data-fit specs: a dataset, a model and its options; the loss over the model's parameters. */
export const dataFitKind: SurfaceKind<DataFitSpec> = {
  validate: (spec) => validateDataFitSpec(spec),
  build: (spec): Surface => buildDataFitSurface(spec),
  describe: (spec): SurfaceDescription => describeDataFit(spec),
};
