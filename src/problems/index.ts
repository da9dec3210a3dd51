// The problems folder's one door: the catalogue of test surfaces and surface specs.
export * from './catalogue';
export { buildSurface, describeSurface, SURFACE_KINDS, type CatalogueSpec, type DataFitSpec, type FormulaSpec, type SurfaceDescription, type SurfaceSpec, type SurfaceSpecKind } from './spec';
export { FORMULA_VIEW_HALF_WIDTH } from './kinds/formula-kind';
export * from './datafit';
export * from './datasets';
