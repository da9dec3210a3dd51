export { axisPlane, distanceToPlane, planePoint, projectToPlane, type SlicePlane } from './plane';
export { MAX_GRID_SIDE, validateGridBox, validateViewBox, type GridBox, type ViewBox } from './box';
export { finiteRange, gridA, gridB, sampleGrid, sampleGridRows, validateGridRequest, type GridRequest } from './grid';
export { validateGroups, wholeVectorGroup } from './groups';
export { blockNorm, randomPlane, type RandomPlaneOptions } from './random';
export { pcaPlane, type PcaPlane, type PcaPlaneOptions } from './pca';
export { DEFAULT_ALPHAS, lineProfile, type AlphaRange, type LineProfile } from './line';
export { gridRangeForProjection, type PlaneRange } from './range';
