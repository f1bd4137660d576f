import { join } from 'node:path';
import type { CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';

/**
 * One part of a configuration: one ensemble of one model, the unit of work
 * of a cluster job array. Part I of a configuration with M models and E
 * ensembles per model is model m = floor(I / E), ensemble k = I mod E
 * (I = m x E + k), for I = 0 .. M x E - 1.
 */
export interface FitPart {
  /** The part index I. */
  index: number;
  /** Position of the model in the configuration's `models`. */
  modelIndex: number;
  /** Model label. */
  label: string;
  /** Original ensemble index k within the model's run (0 .. E - 1). */
  ensemble: number;
  /** Ensembles per model in the full run (E). */
  ensembles: number;
  /** The part's run folder: `<out>/parts/<label>/ensemble-<k>`. */
  runDir: string;
}

/** What run.json of a part adds under `part` (read back by `candela merge`). */
export interface PartFacts {
  index: number;
  model_index: number;
  ensemble: number;
  ensembles_total: number;
  /** The bulk-ESS target of the part's own summary, target_ess / ensembles_total (informational: a part does not stop on it). */
  part_target_ess: number;
  /** The step count the part was asked to run to (--steps-per-part, default sampler.max_steps). */
  steps_target: number;
}

/** Name of the folder under the output folder that holds every part. */
export const PARTS_FOLDER = 'parts';

/**
 * Number of parts of a configuration: models x ensembles.
 * Cost: O(1).
 * @param config the validated configuration.
 * @returns M x E.
 * @throws nothing.
 * @example partCount(config) // 2 for one model with 2 ensembles
 */
export function partCount(config: CandelaConfig): number {
  return config.models.length * config.sampler.ensembles;
}

/**
 * The part folder of model `label`, ensemble `ensemble`, under `outDir`.
 * Cost: O(1).
 * @param outDir the configuration's output folder (or --out).
 * @param label model label.
 * @param ensemble original ensemble index.
 * @returns `<outDir>/parts/<label>/ensemble-<ensemble>`.
 * @throws nothing.
 * @example partFolder('out/pantheon', 'flat_lcdm', 1) // 'out/pantheon/parts/flat_lcdm/ensemble-1'
 */
export function partFolder(outDir: string, label: string, ensemble: number): string {
  return join(outDir, PARTS_FOLDER, label, `ensemble-${ensemble}`);
}

/**
 * Decodes part index I of a configuration (see {@link FitPart}).
 * Cost: O(1).
 * @param config the validated configuration.
 * @param index the part index (a Slurm array task id), integer.
 * @param outDir replaces output.dir.
 * @returns the model, ensemble and folder of the part.
 * @throws CandelaError `fit.bad_part` when I is not an integer in 0 .. M x E - 1,
 *   `fit.part_needs_ensembles` for a nested-sampling configuration (it has no ensembles to split).
 * @example locatePart(config, 3, 'out/x') // { modelIndex: 1, ensemble: 1, ... } for 2 ensembles per model
 */
export function locatePart(config: CandelaConfig, index: number, outDir?: string): FitPart {
  if (config.sampler.method === 'nested') {
    throw new CandelaError({ code: 'fit.part_needs_ensembles', path: 'sampler.method', message: 'a run in parts splits the ensembles of the ensemble sampler; nested sampling has none', fix: 'run nested sampling without --part, or use sampler.method: ensemble' });
  }
  const count = partCount(config);
  if (!Number.isInteger(index) || index < 0 || index >= count) {
    throw new CandelaError({
      code: 'fit.bad_part', path: '--part', message: `part ${index} does not exist in this configuration`,
      expected: `an integer from 0 to ${count - 1} (${config.models.length} models x ${config.sampler.ensembles} ensembles)`, found: String(index),
      fix: 'use the array range written by `candela fit CONFIG --plan slurm`',
    });
  }
  const ensembles = config.sampler.ensembles;
  const modelIndex = Math.floor(index / ensembles);
  const ensemble = index % ensembles;
  const label = config.models[modelIndex].label;
  return { index, modelIndex, label, ensemble, ensembles, runDir: partFolder(outDir ?? config.output.dir.resolved, label, ensemble) };
}
