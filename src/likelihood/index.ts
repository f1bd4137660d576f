// likelihood layer barrel: one export per line.
// priors
export type { Prior } from './prior.js';
export { PRIOR_KINDS } from './prior.js';
export { priorLogDensity } from './priorLogDensity.js';
export { priorContains } from './priorContains.js';
export { priorCumulative } from './priorCumulative.js';
export { priorQuantile } from './priorQuantile.js';
export { samplePrior } from './samplePrior.js';
export { validatePrior } from './validatePrior.js';
export { priorSearchStep } from './priorSearchStep.js';
export { PRIOR_SPREAD_DRAWS, SEARCH_STEP_FRACTION, SMALLEST_SEARCH_STEP } from './priorSearchStep.js';
// posterior
export type { ParameterValues } from './likelihoodTerm.js';
export type { LikelihoodTerm } from './likelihoodTerm.js';
export type { Posterior } from './createPosterior.js';
export type { PosteriorSpec } from './createPosterior.js';
export { createPosterior } from './createPosterior.js';
// Gaussian core
export type { Whitener } from './whitener.js';
export { createDenseWhitener } from './whitener.js';
export { createDiagonalWhitener } from './whitener.js';
export type { OffsetMarginal } from './marginalizeOffset.js';
export { marginalizeOffset } from './marginalizeOffset.js';
export { createOffsetMarginal } from './marginalizeOffset.js';
export type { GaussianLogLikelihood } from './gaussianLogLikelihood.js';
export { createMeasurementTerm } from './createMeasurementTerm.js';
export type { MeasurementTermOptions } from './createMeasurementTerm.js';
export { gaussianLogLikelihood } from './gaussianLogLikelihood.js';
// supernova term
export type { SupernovaTermOptions } from './supernovaTermOptions.js';
export type { SupernovaTerm } from './supernovaTermOptions.js';
export type { SupernovaPath } from './supernovaTermOptions.js';
export type { HubbleDiagram } from './supernovaTermOptions.js';
export { createSupernovaTerm } from './createSupernovaTerm.js';
export { DEFAULT_COMPRESSION_TOLERANCE } from './createSupernovaTerm.js';
export { AUTO_COMPRESSION_MIN_DIAGONAL_COUNT } from './createSupernovaTerm.js';
export { NOMINAL_H0_KM_PER_S_PER_MPC } from './hubbleFlowModuli.js';
// hierarchical (latent stretch and colour) supernova term
export type { HierarchicalTermOptions } from './hierarchicalTermOptions.js';
export type { HierarchicalTerm } from './hierarchicalTermOptions.js';
export type { HierarchicalPath } from './hierarchicalTermOptions.js';
export type { PopulationModel } from './hierarchicalTermOptions.js';
export type { LatentEstimates } from './hierarchicalTermOptions.js';
export { createHierarchicalSupernovaTerm } from './createHierarchicalSupernovaTerm.js';
export { MIN_SUPERNOVAE_PER_POPULATION } from './createHierarchicalSupernovaTerm.js';
export { HIERARCHICAL_POPULATION_PRIORS } from './hierarchicalPopulationPriors.js';
export { hierarchicalPopulationPriors } from './hierarchicalPopulationPriors.js';
// diagonal plus low-rank covariance (Woodbury identity)
export type { LowRankGaussian } from './lowRankGaussian.js';
export type { LowRankGaussianOptions } from './lowRankGaussian.js';
export { createLowRankGaussian } from './lowRankGaussian.js';
export { createLowRankEvaluation } from './lowRankGaussian.js';
export type { LowRankWhitener } from './lowRankWhitener.js';
export { createLowRankWhitener } from './lowRankWhitener.js';
export { buildLowRankCapacitance } from './lowRankCapacitance.js';
export type { LowRankCapacitance } from './lowRankCapacitance.js';
