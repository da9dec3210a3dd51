export { axisPlane, distanceToPlane, planePoint, projectToPlane, type SlicePlane } from './plane';
export { finiteRange, gridA, gridB, MAX_GRID_SIDE, sampleGrid, sampleGridRows, validateGridRequest, type GridRequest } from './grid';
export { validateGroups, wholeVectorGroup } from './groups';
export { blockNorm, randomPlane, type RandomPlaneOptions } from './random';
export { pcaPlane, type PcaPlane, type PcaPlaneOptions } from './pca';
export { DEFAULT_ALPHAS, lineProfile, type AlphaRange, type LineProfile } from './line';
export { gridRangeForProjection, type PlaneRange } from './range';
