// math: pure numerical kernels. May import only ../errors.ts.
export { compensatedSum } from './compensatedSum.js';
export { choleskyInPlace, solveLowerInPlace, solveUpperTransposedInPlace, choleskySolveInPlace, logDeterminantFromCholesky } from './cholesky.js';
export type { CholeskyFailure, CholeskySuccess } from './cholesky.js';
export { referenceCholeskyInPlace, SMALL_CHOLESKY_DIMENSION } from './cholesky.js';
export { blockedCholeskyInPlace, BLOCK_ROWS, BLOCK_DEPTH } from './blockedCholesky.js';
export { wasmCholeskyInPlace, wasmCholeskyAvailable } from './wasmCholesky.js';
export { createRandomStream, deriveSeed } from './random.js';
export type { RandomStream, RandomState } from './random.js';
export { SPEED_OF_LIGHT_KM_PER_S, MEGAPARSEC_KM, GIGAYEAR_S, STEFAN_BOLTZMANN_W_PER_M2_K4, GRAVITATIONAL_CONSTANT_SI, SPEED_OF_LIGHT_M_PER_S, FIVE_OVER_LN10, HALF_LOG_TWO_PI } from './constants.js';
export { createFftPlan, fftOfRealSeries, nextPowerOfTwo } from './fft.js';
export type { FftDirection, FftPlan } from './fft.js';
export { nelderMeadSearch, minimizeNelderMead, NELDER_MEAD_EVALUATIONS_PER_DIMENSION, NELDER_MEAD_VALUE_TOLERANCE, NELDER_MEAD_POSITION_TOLERANCE } from './nelderMead.js';
export type { NelderMeadOptions, NelderMeadResult } from './nelderMead.js';
export { gaussLegendreRule, GAUSS_LEGENDRE_MAX_ORDER } from './gaussLegendreRule.js';
export type { QuadratureRule } from './gaussLegendreRule.js';
export { createCompositeGaussLegendre } from './compositeGaussLegendre.js';
export type { CompositeGaussLegendre, GaussLegendrePlan } from './compositeGaussLegendre.js';
export { adaptiveGaussKronrod } from './adaptiveGaussKronrod.js';
export type { AdaptiveQuadratureOptions, AdaptiveQuadratureResult } from './adaptiveGaussKronrod.js';

// Special functions
export { inverseNormalCdf } from './special/inverseNormalCdf.js';
export { complementaryErrorFunction } from './special/standardNormal.js';
export { standardNormalCumulative } from './special/standardNormal.js';
export { standardNormalSurvival } from './special/standardNormal.js';
export { standardNormalSurvivalQuantile } from './special/standardNormal.js';
export { logStandardNormalDensity } from './special/standardNormal.js';
export { logGamma } from './special/logGamma.js';
export { regularizedGammaP } from './special/regularizedGamma.js';
export { regularizedGammaQ } from './special/regularizedGamma.js';
export { logRegularizedGammaQ } from './special/regularizedGamma.js';

// Weighted statistics of samples
export { checkSamples } from './statistics/checkSamples.js';
export { weightedMoments, meanOf, sampleVarianceOf } from './statistics/weightedMoments.js';
export type { WeightedMoments } from './statistics/weightedMoments.js';
export { kishEffectiveCount } from './statistics/kishEffectiveCount.js';
export { sortSample } from './statistics/sortSample.js';
export type { SortedSample } from './statistics/sortSample.js';
export { weightedQuantileOfSorted, weightedQuantiles } from './statistics/weightedQuantile.js';
export { quantileOfDraws, quantileOfSortedDraws } from './statistics/quantileOfDraws.js';
export { curveQuantiles } from './statistics/curveQuantiles.js';
export { curveBands, CURVE_BAND_PROBABILITIES } from './statistics/curveBands.js';

// Kernel density estimates (one Gaussian-kernel estimator; the bandwidth rule is an option)
export { kernelBandwidth } from './density/kernelBandwidth.js';
export type { SampleSpread } from './density/kernelBandwidth.js';
export { marginalDensity1D } from './density/marginalDensity1D.js';
export { densityGrid2D } from './density/densityGrid2D.js';
export type { MarginalDensity1D, DensityGrid2D, BandwidthRule, HardBounds, MarginalDensityOptions, DensityGridOptions } from './density/densityTypes.js';

// Text
export { editDistance } from './text/editDistance.js';
export { closestWord } from './text/closestWord.js';
// Extent of an array; log-spaced grids and interpolation in ln x on them; resampling weighted (nested) draws to equal weights.
export { arrayExtent } from './arrayExtent.js';
export { logSpacedGrid } from './logSpacedGrid.js';
export { interpolateLogSpaced } from './interpolateLogSpaced.js';
export { resampleRowsByWeight } from './nestedResampleRows.js';
export { equalWeightRows } from './equalWeightRows.js';

// Importance reweighting of one set of draws, and the systematic budget built on it.
export { importanceWeights } from './reweighting/importanceWeights.js';
export type { ImportanceWeights } from './reweighting/importanceWeights.js';
export { reweightedShift } from './reweighting/reweightedShift.js';
export type { ReweightedShift } from './reweighting/reweightedShift.js';
export { quadratureDifference } from './reweighting/quadratureDifference.js';
export { gaussianLinearResponse } from './reweighting/gaussianLinearResponse.js';
export type { LinearResponse } from './reweighting/gaussianLinearResponse.js';
export { systematicBudget } from './reweighting/systematicBudget.js';
export type { SystematicBudget, SystematicBudgetEntry, SystematicBudgetInput, SystematicVariantLikelihoods, BudgetVariant, VariantParameterEstimate, ContributionEstimate } from './reweighting/systematicBudget.js';
export { varianceDifferenceError, contributionError } from './reweighting/varianceDifferenceError.js';
