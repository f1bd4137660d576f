// diagnostics layer barrel: one export per line. Imports only errors and math.

// Convergence of several chains (Vehtari, Gelman, Simpson, Carpenter & Buerkner 2021)
export { rankNormalizedSplitRhat, rankNormalizedSplitRhatParts } from './rankNormalizedSplitRhat.js';
export type { RankNormalizedRhat } from './rankNormalizedSplitRhat.js';
export { splitRhat } from './splitRhat.js';
export { essBulk } from './essBulk.js';
export { essTail, essQuantile, TAIL_LOWER_PROBABILITY, TAIL_UPPER_PROBABILITY } from './essTail.js';
export { essBasic } from './essBasic.js';
export { essMean } from './essMean.js';
export { mcseMean } from './mcseMean.js';
// Monte Carlo errors of correlated draws: sqrt(draws / ESS), never below 1.
export { essErrorInflation } from './essErrorInflation.js';

// Building blocks
export { splitChains } from './splitChains.js';
export { rankNormalize, RANK_OFFSET } from './rankNormalize.js';
export { foldAboutMedian } from './foldAboutMedian.js';
export { MINIMUM_DRAWS_PER_CHAIN, CONSTANT_SPREAD_TOLERANCE } from './checkChains.js';

// Ensemble samplers
export { integratedAutocorrelationTime, SOKAL_WINDOW_FACTOR, RELIABLE_STEPS_PER_TAU, RELIABLE_MAXIMUM_WINDOW_SHARE, MINIMUM_STEPS_FOR_TAU } from './integratedAutocorrelationTime.js';
export type { AutocorrelationTimeEstimate } from './integratedAutocorrelationTime.js';
export { ensembleAutocorrelation } from './ensembleAutocorrelation.js';
export type { EnsembleAutocorrelation } from './ensembleAutocorrelation.js';
export { acceptanceSummary, STUCK_SHARE_OF_MEDIAN } from './acceptanceSummary.js';
export type { AcceptanceSummary } from './acceptanceSummary.js';
export { chooseBurnIn, BURN_IN_TAU_MULTIPLE, MAXIMUM_BURN_IN_SHARE } from './chooseBurnIn.js';
export { diagnoseEnsembleChains } from './diagnoseEnsembleChains.js';
export type { EnsembleTrace, ParameterDiagnostics } from './diagnoseEnsembleChains.js';
// Burn-in, tau, R-hat and ESS of a run's traces in one call.
export type { TraceDiagnosis } from './diagnoseTraces.js';
export { diagnoseTraces } from './diagnoseTraces.js';
export { traceAutocorrelationTimes } from './diagnoseTraces.js';
