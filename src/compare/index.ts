// compare layer barrel: one export per line. Imports only errors, math and the diagnostics barrel.

// Information criteria
export { akaikeInformationCriterion } from './informationCriteria.js';
export { bayesianInformationCriterion } from './informationCriteria.js';
export { devianceInformationCriterion } from './devianceInformationCriterion.js';
export type { DevianceInformation } from './devianceInformationCriterion.js';

// Bayes factors
export { logBayesFactor } from './logBayesFactor.js';
export type { LogEvidence } from './logBayesFactor.js';
export type { LogBayesFactorEstimate } from './logBayesFactor.js';
export { readBayesFactor } from './readBayesFactor.js';
export { KASS_RAFTERY_BOUNDARIES } from './readBayesFactor.js';
export type { BayesFactorReading } from './readBayesFactor.js';
export type { EvidenceStrength } from './readBayesFactor.js';

// Savage-Dickey density ratio (its kernel density is math/density's, as the plotted marginals)
export { savageDickeyRatio } from './savageDickeyRatio.js';
export { DEFAULT_BOOTSTRAP_REPLICATES } from './savageDickeyRatio.js';
export { DEFAULT_BOOTSTRAP_SEED } from './savageDickeyRatio.js';
export type { SavageDickeyInput } from './savageDickeyRatio.js';
export type { SavageDickeyEstimate } from './savageDickeyRatio.js';
export { savageDickeyRatio2D } from './savageDickeyRatio2D.js';
export type { SavageDickeyInput2D } from './savageDickeyRatio2D.js';

// Frequentist significance of a chi-square improvement
export { deltaChiSquareSignificance } from './deltaChiSquareSignificance.js';
export { twoSidedGaussianSigma } from './deltaChiSquareSignificance.js';
export { SIGNIFICANCE_CAUTION } from './deltaChiSquareSignificance.js';
export type { ChiSquareSignificance } from './deltaChiSquareSignificance.js';

// Comparison tables
export { compareModels } from './compareModels.js';
export { comparisonMarkdown } from './comparisonMarkdown.js';
export { comparisonLatex } from './comparisonLatex.js';
export type { ModelFitRecord } from './modelComparison.js';
export type { NestedModelPair } from './modelComparison.js';
export type { ComparisonOptions } from './modelComparison.js';
export type { ModelComparison } from './modelComparison.js';
export type { ModelComparisonRow } from './modelComparison.js';
export type { NestedComparisonRow } from './modelComparison.js';
export type { ModelComparisonReport } from './modelComparison.js';
