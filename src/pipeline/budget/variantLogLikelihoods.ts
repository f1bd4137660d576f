import type { CandelaConfig } from '../../config/index.js';
import { buildModel, type BuiltModel } from '../run/buildModel.js';
import type { LoadedSupernovae } from '../run/loadSupernovae.js';
import type { BudgetDraws } from './budgetDraws.js';

/**
 * ln L of one variant of the data at every draw: the model rebuilt on the
 * variant's data (its own covariance and factorization), evaluated at each
 * draw's parameters. The priors, the probes and every other term are those
 * of the run, so differences between variants are differences of the
 * supernova term only. A draw the variant rejects gets -Infinity.
 *
 * Cost: one model build (a Cholesky factorization of the variant's
 * covariance) plus n likelihood evaluations.
 * @param config the run's configuration.
 * @param modelIndex the run's model in config.models.
 * @param data the variant's data (variantData).
 * @param draws the draws (theta order of the run's posterior).
 * @returns ln L per draw (nats) and the built model.
 */
export function variantLogLikelihoods(config: CandelaConfig, modelIndex: number, data: LoadedSupernovae, draws: BudgetDraws): { logLikelihood: Float64Array; model: BuiltModel } {
  const model = buildModel(config, modelIndex, data);
  const p = model.posterior.dimension;
  const theta = new Float64Array(p);
  const parts = { logPrior: 0, logLikelihood: 0 };
  const logLikelihood = new Float64Array(draws.count);
  for (let i = 0; i < draws.count; i++) {
    theta.set(draws.values.subarray(i * p, (i + 1) * p));
    const logPosterior = model.posterior.evaluate(theta, parts);
    logLikelihood[i] = Number.isFinite(logPosterior) ? parts.logLikelihood : -Infinity;
  }
  return { logLikelihood, model };
}
