// The catalogue's one door.
export type { CatalogueEntry, ConstantInfo, KnownPoint, KnownPointsRule, PointKind } from './types';
export { CATALOGUE, catalogueEntry, catalogueIds, knownPointsFor, resolveConstants } from './list';
export { symmetricEigenvalues2 } from './eigen2';
