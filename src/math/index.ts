// math: pure numerical kernels. May import only ../errors.ts.
export { compensatedSum } from './compensatedSum.js';
export { choleskyInPlace, solveLowerInPlace, solveUpperTransposedInPlace, choleskySolveInPlace, logDeterminantFromCholesky } from './cholesky.js';
export type { CholeskyFailure, CholeskySuccess } from './cholesky.js';
export { createRandomStream, deriveSeed } from './random.js';
export type { RandomStream, RandomState } from './random.js';
export { SPEED_OF_LIGHT_KM_PER_S, MEGAPARSEC_KM, GIGAYEAR_S, STEFAN_BOLTZMANN_W_PER_M2_K4, GRAVITATIONAL_CONSTANT_SI, SPEED_OF_LIGHT_M_PER_S, FIVE_OVER_LN10 } from './constants.js';
