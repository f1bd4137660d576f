// probes layer barrel: likelihood terms beside the supernovae, each declared by its own folder.
export type { ProbeDefinition } from './probeDefinition.js';
export type { ProbeBlock } from './probeDefinition.js';
export type { ProbeSettings } from './probeDefinition.js';
export type { ProbeModel } from './probeDefinition.js';
export type { LoadedProbe } from './probeDefinition.js';
export type { SettingSpec } from './probeDefinition.js';
export type { ProbeDiagram } from './probeDefinition.js';
export { PROBES } from './registry.js';
export { probeDefinition } from './registry.js';
