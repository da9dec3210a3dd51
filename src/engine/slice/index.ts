export { axisPlane, distanceToPlane, planePoint, projectToPlane, type SlicePlane } from './plane';
export { finiteRange, gridA, gridB, MAX_GRID_SIDE, sampleGrid, validateGridRequest, type GridRequest } from './grid';
