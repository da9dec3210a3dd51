export { classifyEigenvalues, classifyPoint, EXACT_CLASSIFY_LIMIT, type PointClass, type PointKind } from './classify';
