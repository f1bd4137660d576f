// standardize layer barrel: one export per line. May import errors, math, data types.
// host-mass step
export { highMassFraction } from './highMassFraction.js';
export { highMassFractions } from './highMassFraction.js';
export type { HostMassStep } from './highMassFraction.js';
// Tripp relation
export { trippCorrectedMagnitudes } from './trippCorrectedMagnitudes.js';
export { requireLightCurves } from './trippCorrectedMagnitudes.js';
export type { TrippCoefficients } from './trippCorrectedMagnitudes.js';
// error terms
export { lightCurveVariance } from './lightCurveVariance.js';
export { fixedScatterVariance } from './fixedScatterVariance.js';
export { LENSING_DISPERSION_PER_REDSHIFT } from './fixedScatterVariance.js';
export type { ScatterTerms } from './fixedScatterVariance.js';
export { propagateLightCurveCovariance } from './propagateLightCurveCovariance.js';
export { splitLightCurveCovariance } from './lightCurveCovarianceParts.js';
export { combineLightCurveCovariance } from './lightCurveCovarianceParts.js';
export type { LightCurveCovarianceParts } from './lightCurveCovarianceParts.js';
