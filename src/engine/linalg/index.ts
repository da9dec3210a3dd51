// Small dense linear algebra for Hessians (row-major Float64Array, n x n).
export { choleskyDecompose, choleskySolve } from './cholesky';
export { luDecompose, luSolve, type LuFactors } from './lu';
export { symmetricEigen, type SymmetricEigen } from './jacobi';
