// forecast layer barrel: one export per line.
export { centralDifferenceHessian } from './forecastHessian.js';
export type { FisherMarginals } from './forecastMarginals.js';
export { marginalizeFisher } from './forecastMarginals.js';
export { covarianceInformation } from './forecastCovarianceInformation.js';
export { covariancePart } from './forecastCovariancePart.js';
