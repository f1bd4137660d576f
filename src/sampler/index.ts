// sampler layer barrel: one export per line.
// evaluation contract
export type { LogProbabilityModel } from './logProbabilityModel.js';
export type { WorkerModelSpec } from './logProbabilityModel.js';
export type { BatchEvaluator } from './logProbabilityModel.js';
export { createInProcessEvaluator } from './inProcessEvaluator.js';
export { createWorkerPoolEvaluator } from './workerPoolEvaluator.js';
export type { WorkerPoolOptions } from './workerPoolEvaluator.js';
// ensemble sampler
export { EnsembleSampler } from './ensembleSampler.js';
export { resolveEnsembleOptions } from './ensembleOptions.js';
export { DEFAULT_STRETCH_SCALE } from './ensembleOptions.js';
export { DEFAULT_ENSEMBLE_COUNT } from './ensembleOptions.js';
export type { EnsembleRunOptions } from './ensembleOptions.js';
export type { ResolvedEnsembleOptions } from './ensembleOptions.js';
export { stretchFactor } from './ensembleMoves.js';
export { ensembleSpanProblem } from './ensembleSpan.js';
export type { ChainView } from './chainStorage.js';
export type { SamplerStorageOptions } from './ensembleSampler.js';
export type { RestoreStorageOptions } from './ensembleSampler.js';
// bounded diagnostic traces
export type { TraceView } from './thinnedTrace.js';
export { traceCapacitySteps } from './thinnedTrace.js';
// checkpoints
export { checkSnapshotShape } from './samplerSnapshot.js';
export type { SamplerSnapshot } from './samplerSnapshot.js';
export type { EnsembleSnapshot } from './samplerSnapshot.js';
export { SNAPSHOT_FORMAT } from './samplerSnapshot.js';
export { SNAPSHOT_VERSION } from './samplerSnapshot.js';
// starting the walkers
export { initializeWalkers } from './initializeWalkers.js';
export type { WalkerStartOptions } from './initializeWalkers.js';
export type { WalkerStart } from './initializeWalkers.js';
export { locatePosteriorMode } from './locatePosteriorMode.js';
export type { PosteriorMode } from './locatePosteriorMode.js';
export { curvatureWidths } from './curvatureWidths.js';
// nested sampling (evidence)
export { runNestedSampling } from './nested/runNestedSampling.js';
export { NestedRun } from './nested/nestedRun.js';
export { BOUND_REBUILD_SHARE } from './nested/nestedRun.js';
export { MAX_CALLS_PER_REPLACEMENT } from './nested/nestedRun.js';
export { resolveNestedOptions } from './nested/resolveNestedOptions.js';
export { DEFAULT_ELLIPSOID_ENLARGEMENT } from './nested/resolveNestedOptions.js';
export type { ResolvedNestedOptions } from './nested/resolveNestedOptions.js';
export type { NestedProblem } from './nested/nestedProblem.js';
export type { NestedOptions } from './nested/nestedProblem.js';
export type { NestedResult } from './nested/nestedProblem.js';
export type { NestedProgress } from './nested/nestedProblem.js';
