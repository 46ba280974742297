export { type CompressedPattern, compressPattern } from './csc.js';
export type { FactorCapacity, SymbolicLu } from './lu-types.js';
export { formatMatrixMarket, type MatrixMarketMatrix, parseMatrixMarket } from './matrix-market.js';
export type { Ordering } from './ordering.js';
export { reportSmallPivots, type SmallPivotReport } from './rank-report.js';
export {
  createSparseRealSolver as createRealSolver,
  type LuStatistics,
  type PivotOrder,
  type SparseRealSolver,
  type SparseSolverOptions,
} from './solver.js';
export {
  createSparseComplexSolver as createComplexSolver,
  type SparseComplexSolver,
} from './solver-complex.js';
export { TypedArena } from './typed-arena.js';
export type { ComplexLinearSolver, CscPattern, FactorStatus, RealLinearSolver } from './types.js';
