// config layer barrel: one export per line.
// The configuration type
export type { CandelaConfig } from './candelaConfig.js';
export type { ResolvedPath } from './candelaConfig.js';
export type { SourcePosition } from './candelaConfig.js';
export type { SupernovaKind } from './candelaConfig.js';
export type { ColumnField } from './candelaConfig.js';
export type { ErrorField } from './candelaConfig.js';
export type { LightCurveQuantity } from './candelaConfig.js';
export type { TableOptions } from './candelaConfig.js';
export type { CovarianceSource } from './candelaConfig.js';
export type { CutOptions } from './candelaConfig.js';
export type { SupernovaDataSet } from './candelaConfig.js';
export type { StandardizationOptions } from './candelaConfig.js';
export type { PriorSpec } from './candelaConfig.js';
export type { ParameterSpec } from './candelaConfig.js';
export type { ModelSpec } from './candelaConfig.js';
export type { DerivedQuantity } from './candelaConfig.js';
export type { SamplerOptions } from './candelaConfig.js';
export type { FigureKind } from './candelaConfig.js';
export type { OutputOptions } from './candelaConfig.js';
export type { BlindingOptions } from './candelaConfig.js';
// Reading and validating
export { loadConfigFile } from './loadConfigFile.js';
export { readConfigFile } from './readConfigFile.js';
export { parseConfigText } from './parseConfigText.js';
export { TOP_LEVEL_KEYS } from './parseConfigText.js';
// Defaults
export { DEFAULT_SEED } from './defaults.js';
export { DEFAULT_TITLE } from './defaults.js';
export { DEFAULT_MAX_REDSHIFT_MISMATCH } from './defaults.js';
export { DEFAULT_TABLE } from './defaults.js';
export { DEFAULT_COVARIANCE } from './defaults.js';
export { DEFAULT_CUTS } from './defaults.js';
export { DEFAULT_STANDARDIZATION } from './defaults.js';
export { DEFAULT_MODEL } from './defaults.js';
export { DEFAULT_PRIORS } from './defaults.js';
export { NON_SAMPLED_DARK_ENERGY } from './defaults.js';
export { DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC } from './defaults.js';
export { DEFAULT_DERIVED_FLAT } from './defaults.js';
export { DEFAULT_DERIVED_CURVED } from './defaults.js';
export { DEFAULT_SAMPLER } from './defaults.js';
export { DEFAULT_FIGURES } from './defaults.js';
export { DEFAULT_OUTPUT } from './defaults.js';
export { DEFAULT_BLINDING_PARAMETERS } from './defaults.js';
export { DEFAULT_BLINDING_WIDTHS } from './defaults.js';
export { BLINDING_KEYS } from './readBlinding.js';
// Parameters of a model
export { parametersForModel } from './parametersForModel.js';
export type { ModelParameters } from './parametersForModel.js';
export { usedParameterBases } from './modelParameterNames.js';
export { parameterContext } from './modelParameterNames.js';
export type { ParameterContext } from './modelParameterNames.js';
export { derivedForModel } from './derivedForModel.js';
export { MIN_WALKERS_PER_PARAMETER } from './checkCrossFieldRules.js';
export { TRUNCATION_MAX_DISTANCE_SD } from './readParameters.js';
// Writing and describing
export { resolvedConfigToYaml } from './resolvedConfigToYaml.js';
export { resolvedConfigToJson } from './resolvedConfigToJson.js';
export { configToPlainObject } from './configToPlainObject.js';
export { plainConfiguration } from './plainConfiguration.js';
export type { PlainConfiguration } from './plainConfiguration.js';
export type { PlainConfigOptions } from './configToPlainObject.js';
export { describeConfig } from './describeConfig.js';
export { describePrior } from './describeConfig.js';
export { starterConfigText } from './starterConfigText.js';
export { STARTER_DATA_FOLDER } from './starterConfigText.js';
export { STARTER_TABLE_FILE } from './starterConfigText.js';
export type { StarterOptions } from './starterConfigText.js';
// Helpers
export { resolveConfigPath } from './resolveConfigPath.js';
// The configuration's vocabulary, for the command line: did-you-mean and the dark-energy law names.
export { closestWord } from '../math/index.js';
export { DARK_ENERGY_LAW_NAMES } from '../cosmology/index.js';
// Survey descriptions (candela simulate)
export type { SurveyDescription } from './surveyDescription.js';
export type { SurveyTruth } from './surveyDescription.js';
export type { SurveySample } from './surveyDescription.js';
export type { SurveyErrorLine } from './surveyDescription.js';
export type { SurveyOutput } from './surveyDescription.js';
export { surveyFromText } from './surveyFromText.js';
export { surveyFromFile } from './surveyFromFile.js';
export { SURVEY_TOP_LEVEL_KEYS } from './surveyFromText.js';
export { SURVEY_TRUTH_KEYS } from './surveyTruthReader.js';
export { SURVEY_SAMPLE_KEYS } from './surveySampleReader.js';
export { SURVEY_MAX_REDSHIFT } from './surveySampleReader.js';
export { DEFAULT_SURVEY_TITLE } from './surveyDefaults.js';
export { DEFAULT_SURVEY_SCATTER } from './surveyDefaults.js';
export { DEFAULT_SURVEY_TRUTH } from './surveyDefaults.js';
export { DEFAULT_SURVEY_SAMPLE } from './surveyDefaults.js';
export { DEFAULT_SURVEY_OUTPUT } from './surveyDefaults.js';
export { DEFAULT_ANALYSIS_SYSTEMATICS } from './surveyDefaults.js';
export type { SurveyAnalysisSystematics } from './surveyDescription.js';
export type { SystematicModeSource } from './candelaConfig.js';
export { DEFAULT_SYSTEMATIC_MODES } from './defaults.js';
export { SYSTEMATIC_MODE_KEYS } from './readSystematicModeSources.js';
