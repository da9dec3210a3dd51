// Analysis of a surface at points: Hessian-vector products, extreme eigenvalues, classification of
// stationary points, sharpness along a path, and critical-point search.
export { hessianScratch, hessianVectorProduct, multiplyDense, type HessianScratch } from './hessian-vector';
export { defaultLanczosIterations, extremeEigenvalues, type ExtremeEigenvalues, type LanczosOptions, type SymmetricOperator } from './lanczos';
export { tridiagonalEigen, tridiagonalScratch, type TridiagonalScratch } from './tridiagonal';
export { classifyPoint, countSigns, type ClassifyOptions, type ExactPointClass, type LanczosPointClass, type PointClass, type PointKind } from './classify';
export { sharpnessAlong, type SharpnessOptions } from './sharpness';
export { findCriticalPoints, type CriticalPoint, type CriticalPointOptions, type CriticalPointSearch } from './critical';
