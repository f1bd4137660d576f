/**
 * `sampler`: the affine-invariant ensemble sampler (Goodman & Weare 2010) or
 * nested sampling, and when to stop.
 */
import { isScalar } from 'yaml';
import type { SamplerOptions } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_SAMPLER } from './defaults.js';

const KEYS = [
  'method', 'walkers', 'ensembles', 'stretch_scale', 'differential_evolution_weight', 'max_steps', 'check_every',
  'target_ess', 'max_rhat', 'max_minutes', 'workers', 'checkpoint_every', 'nested',
] as const;
const NESTED_KEYS = ['live_points', 'max_unexplored_ln_z', 'max_iterations'] as const;

/**
 * Reads the sampler block, filling defaults. The walker count is checked
 * against the number of free parameters later (checkCrossFieldRules), once
 * the models are known.
 * @param reader the document reader.
 * @param at the `sampler` value (absent: all defaults).
 * @example readSampler(reader, at).walkers // 32
 */
export function readSampler(reader: ConfigReader, at: Located): SamplerOptions {
  const options = structuredClone(DEFAULT_SAMPLER);
  const fields = reader.mapping(at, KEYS);
  if (!fields) return options;
  const get = (key: string): Located | undefined => fields.get(key);
  options.method = reader.choice(get('method'), ['ensemble', 'nested'] as const) ?? options.method;
  options.walkers = reader.number(get('walkers'), { integer: true, min: 2 }) ?? options.walkers;
  options.ensembles = reader.number(get('ensembles'), {
    integer: true, min: 1, fix: 'set sampler.ensembles to an integer >= 1 (4 or more gives a meaningful R-hat)',
  }) ?? options.ensembles;
  // a > 1 is required for the stretch move's proposal density g(z) ~ 1/sqrt(z) on [1/a, a] (Goodman & Weare 2010).
  options.stretchScale = reader.number(get('stretch_scale'), { min: 1, exclusiveMin: true }) ?? options.stretchScale;
  options.differentialEvolutionWeight = reader.number(get('differential_evolution_weight'), { min: 0, max: 1 })
    ?? options.differentialEvolutionWeight;
  options.maxSteps = reader.number(get('max_steps'), { integer: true, min: 1 }) ?? options.maxSteps;
  // An unset check_every takes the default but never more than max_steps, so that a short run is still
  // checked at its end and its resolved configuration (which writes check_every out) reads back valid.
  options.checkEvery = reader.number(get('check_every'), { integer: true, min: 1 })
    ?? Math.min(options.checkEvery, options.maxSteps);
  options.targetEss = reader.number(get('target_ess'), { min: 0, exclusiveMin: true }) ?? options.targetEss;
  options.maxRhat = reader.number(get('max_rhat'), {
    min: 1, exclusiveMin: true, fix: 'set sampler.max_rhat slightly above 1, e.g. 1.01 (Vehtari et al. 2021)',
  }) ?? options.maxRhat;
  options.maxMinutes = reader.number(get('max_minutes'), { min: 0, exclusiveMin: true }) ?? options.maxMinutes;
  const workers = get('workers');
  if (workers?.node && isScalar(workers.node) && typeof workers.node.value === 'string') {
    options.workers = reader.choice(workers, ['auto'] as const) ?? options.workers;
  } else {
    options.workers = reader.number(workers, { integer: true, min: 1, fix: 'write workers: auto, or an integer >= 1' }) ?? options.workers;
  }
  options.checkpointEvery = reader.number(get('checkpoint_every'), { integer: true, min: 0 }) ?? options.checkpointEvery;
  const nested = reader.mapping(get('nested'), NESTED_KEYS);
  if (nested) {
    options.nested.livePoints = reader.number(nested.get('live_points'), { integer: true, min: 2 }) ?? options.nested.livePoints;
    options.nested.maxUnexploredLnZ = reader.number(nested.get('max_unexplored_ln_z'), { min: 0, exclusiveMin: true }) ?? options.nested.maxUnexploredLnZ;
    options.nested.maxIterations = reader.number(nested.get('max_iterations'), { integer: true, min: 1 }) ?? options.nested.maxIterations;
  }
  const checkEvery = get('check_every');
  if (checkEvery && options.checkEvery > options.maxSteps && !reader.failedAt(`${at.path}.check_every`)) {
    reader.report(checkEvery, 'config.out_of_range', 'sampler.check_every exceeds max_steps: convergence would never be checked', {
      expected: `at most max_steps (${options.maxSteps})`, found: String(options.checkEvery), fix: 'lower check_every or raise max_steps',
    });
  }
  return options;
}
