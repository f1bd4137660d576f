import type { SamplerOptions } from '../../config/index.js';
import { weightedMoments } from '../../math/index.js';
import { EnsembleSampler, createInProcessEvaluator, initializeWalkers } from '../../sampler/index.js';
import { checkConvergence } from '../fit/samplingLoop.js';
import type { BuiltModel } from '../run/buildModel.js';

/** The mean and standard deviation of each parameter from a full fit of one variant. */
export interface VariantFit {
  mean: number[];
  sd: number[];
  /** The stopping rule of the run's configuration was met before its step limit. */
  converged: boolean;
  steps: number;
}

/**
 * Samples one variant's posterior in process with the affine-invariant
 * ensemble sampler (Goodman & Weare 2010), started as `candela fit` starts
 * (initializeWalkers around the mode) and stopped by the run's own rule
 * (checkConvergence every sampler.checkEvery steps: R-hat across the
 * ensembles and bulk ESS, up to sampler.maxSteps). The check of the budget's
 * fast path: the mean and standard deviation of each parameter after the
 * burn-in the rule chose.
 *
 * Cost: walkers x ensembles x steps likelihood evaluations, on this thread.
 * @param model the variant's model (variantLogLikelihoods builds it).
 * @param sampler the run's sampler settings.
 * @param seed the run's seed (the variant's name is appended).
 * @returns the moments, whether the rule was met, and the steps taken.
 * @throws CandelaError from the walker start (a posterior that is -Infinity everywhere it looked).
 */
export async function fullVariantFit(model: BuiltModel, sampler: SamplerOptions, seed: string): Promise<VariantFit> {
  const dimension = model.posterior.dimension;
  const evaluator = createInProcessEvaluator({ dimension, blobCount: 0, evaluate: (theta) => model.posterior.logPosterior(theta) });
  const start = await initializeWalkers({
    walkers: sampler.walkers, ensembles: sampler.ensembles, seed, sampleStart: (rng, out) => model.posterior.samplePrior(rng, out),
  }, evaluator);
  const ensemble = await EnsembleSampler.start({ dimension, walkers: sampler.walkers, ensembles: sampler.ensembles, seed }, evaluator, start.positions);
  const rule = { targetEss: sampler.targetEss, maxRhat: sampler.maxRhat };
  let check = checkConvergence(ensemble, rule);
  while (!check.converged && ensemble.stepCount < sampler.maxSteps) {
    await ensemble.advance(Math.min(sampler.checkEvery, sampler.maxSteps - ensemble.stepCount));
    check = checkConvergence(ensemble, rule);
  }
  const columns = Array.from({ length: dimension }, () => [] as number[]);
  for (let k = 0; k < sampler.ensembles; k++) {
    const chain = ensemble.chain(k);
    for (let s = check.burnInSteps; s < chain.steps; s++) {
      for (let w = 0; w < chain.walkers; w++) for (let d = 0; d < dimension; d++) columns[d].push(chain.positions[(s * chain.walkers + w) * dimension + d]);
    }
  }
  const moments = columns.map((values, d) => weightedMoments(values, undefined, model.posterior.names[d]));
  return { mean: moments.map((m) => m.mean), sd: moments.map((m) => m.sd), converged: check.converged, steps: ensemble.stepCount };
}
