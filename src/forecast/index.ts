// forecast layer barrel: one export per line.
export { centralDifferenceHessian } from './forecastHessian.js';
export type { FisherMarginals } from './forecastMarginals.js';
export { marginalizeFisher } from './forecastMarginals.js';
export { covarianceInformation } from './forecastCovarianceInformation.js';
export { covariancePart } from './forecastCovariancePart.js';
export { fisherForecast } from './fisherForecast.js';
export { STEP_FRACTION_OF_SIGMA } from './fisherForecast.js';
export type { FisherData, FisherParameter, FisherSetup, ModelForecast } from './fisherForecast.js';
export { PILOT_RELATIVE_STEP } from './fisherSteps.js';
