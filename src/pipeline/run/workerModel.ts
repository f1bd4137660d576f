/**
 * Entry point that every sampler worker thread imports: it rebuilds the
 * model's log-probability function from the resolved configuration (plain
 * data, structured-cloned to the worker) by reading the same input files.
 * The function is pure, so chains do not depend on which thread evaluates a
 * point.
 */
import type { CandelaConfig } from '../../config/index.js';
import type { LogProbabilityModel } from '../../sampler/index.js';
import { buildModel } from './buildModel.js';
import { loadSupernovae } from './loadSupernovae.js';

/** What the pipeline sends to each worker. */
export interface WorkerModelInit {
  config: CandelaConfig;
  modelIndex: number;
}

/** Builds the log-probability model inside a worker. */
export function createWorkerModel(init: WorkerModelInit): LogProbabilityModel {
  const data = loadSupernovae(init.config);
  return buildModel(init.config, init.modelIndex, data).logProbability;
}

/**
 * URL of the compiled form of this module (workers run plain JavaScript):
 * when running from TypeScript source (tests), src/pipeline/run/x.ts maps to
 * dist/src/pipeline/run/x.js, which `npm test` builds first.
 */
export function workerModelUrl(): string {
  return import.meta.url.replace(/\/src\/pipeline\/run\/([^/]+)\.ts$/, '/dist/src/pipeline/run/$1.js');
}
