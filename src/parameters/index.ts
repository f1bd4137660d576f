// parameters layer barrel (a leaf: imports nothing): the one registry of parameter names.
export type { ParameterDefinition } from './parameterDefinition.js';
export type { ParameterSymbol } from './parameterDefinition.js';
export type { ParameterRole } from './parameterDefinition.js';
export type { DefaultPrior } from './parameterDefinition.js';
export { PARAMETERS } from './parameterRegistry.js';
export { PARAMETER_ORDER } from './parameterRegistry.js';
export type { ParameterName } from './parameterName.js';
export { parseParameterName } from './parameterName.js';
export { parameterRank } from './parameterName.js';
export { isPhysicalValue } from './parameterName.js';
export { physicalRangeText } from './parameterName.js';
