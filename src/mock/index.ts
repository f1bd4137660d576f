// mock: drawing mock supernova surveys from a known truth. May import errors, math, data, standardize, cosmology.
// the survey design
export type { MockSampleDesign } from './mockSurveyOptions.js';
export type { MockSurveyOptions } from './mockSurveyOptions.js';
export type { MockTruth } from './mockSurveyOptions.js';
export type { LinearErrorModel } from './mockSurveyOptions.js';
// drawing
export { generateMockSurvey } from './generateMockSurvey.js';
export type { MockSurvey } from './generateMockSurvey.js';
export { drawRedshifts } from './drawRedshifts.js';
export { REDSHIFT_GRID_POINTS } from './drawRedshifts.js';
export { lightCurveErrors } from './lightCurveErrors.js';
export { errorAtRedshift } from './lightCurveErrors.js';
export type { LightCurveErrors } from './lightCurveErrors.js';
// systematic modes
export { systematicCovariance } from './systematicCovariance.js';
export { MAX_COVARIANCE_SUPERNOVAE } from './systematicCovariance.js';
// expectations
export { expectedResidualVariance } from './expectedResidualVariance.js';
export { systematicModes } from './systematicModes.js';
export { systematicModeNames } from './systematicModes.js';
export { REDSHIFT_DRIFT_MODE } from './systematicModes.js';
export { CALIBRATION_MODE_PREFIX } from './systematicModes.js';
// systematics of the analysis (written as modes, not drawn into the data)
export { analysisSystematicModes } from './analysisSystematicModes.js';
export { HOST_MASS_SPLIT_MODE } from './analysisSystematicModes.js';
export { COHERENT_VELOCITY_MODE } from './analysisSystematicModes.js';
export type { AnalysisSystematics } from './analysisSystematicModes.js';
export type { AnalysisModeInput } from './analysisSystematicModes.js';
