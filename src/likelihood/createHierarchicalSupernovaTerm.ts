import { CandelaError } from '../errors.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { createBlockEvaluator, createDenseEvaluator, createHierarchicalEvaluation, type HierarchicalEvaluation } from './hierarchicalEvaluator.js';
import { hierarchicalHubbleDiagram, latentPosterior } from './hierarchicalLatent.js';
import { createBlockModesEvaluator } from './hierarchicalModesEvaluator.js';
import { createHierarchicalModel, type HierarchicalModel } from './hierarchicalModel.js';
import type { HierarchicalTerm, HierarchicalTermOptions } from './hierarchicalTermOptions.js';

/**
 * Below this many supernovae a per-sample population (mean and width of x1
 * and c) is only weakly constrained and its posterior leans on the prior
 * (common practice: a width estimated from n points has relative error
 * ~1/sqrt(2n), 22% at n = 10).
 */
export const MIN_SUPERNOVAE_PER_POPULATION = 10;

function collectWarnings(model: HierarchicalModel, options: HierarchicalTermOptions): string[] {
  const warnings: string[] = [];
  const { table } = options;
  if (model.frozen) {
    warnings.push('dense covariance frozen: alpha, beta, the population widths and sigma_int enter Sigma at their frozen values only ' +
      '(exact only there; the widths and sigma_int are then not constrained by this term)');
  } else if (options.standardization.alphaBetaCovariance === 'frozen') {
    warnings.push("alphaBetaCovariance 'frozen' has no effect here: every covariance is per supernova, so the exact O(N) blocks path is used");
  }
  if (model.names.readsAbsMag && !model.names.hasCalibrators && !(options.fixed && 'h0' in options.fixed)) {
    warnings.push('abs_mag and h0 are degenerate without calibrators: only abs_mag + 5 log10(c/H0) is constrained; fix h0 or marginalize the offset');
  }
  if (options.population.perSample) {
    const counts = new Int32Array(table.sampleNames.length);
    for (let i = 0; i < table.count; i++) counts[table.sampleIndex[i]]++;
    table.sampleNames.forEach((sample, s) => {
      if (counts[s] < MIN_SUPERNOVAE_PER_POPULATION) {
        warnings.push(`sample ${sample} has ${counts[s]} supernovae (< ${MIN_SUPERNOVAE_PER_POPULATION}): its x1 and colour population is weakly constrained`);
      }
    });
  }
  return warnings;
}

/**
 * The hierarchical (latent-variable) Type Ia supernova likelihood for stretch
 * and colour (March, Trotta, Berkes, Starkman & Vaudrevange 2011, MNRAS 418,
 * 2308; latent variables as in Kelly 2007, ApJ 665, 1489). The true x1 and c
 * of each supernova are drawn from Gaussian populations, N(x1_mean, x1_width^2)
 * and N(color_mean, color_width^2) (per sample, optionally with means linear
 * in z); integrating them out analytically gives one 3-variate Gaussian per
 * supernova in the observed (m_B, x1, c), derived in hierarchicalBlock.ts.
 * This removes the attenuation of alpha and beta that the conventional
 * likelihood suffers when x1 and c are noisy (regression dilution: the fitted
 * slope shrinks by the reliability ratio R^2/(R^2 + sigma^2); Fuller 1987,
 * Measurement Error Models, section 1.1, from memory).
 *
 * Reported value: ln L = -(chi^2 + ln det Sigma + 3N ln 2 pi)/2 over the 3N
 * observations, fully normalized (ln det Sigma depends on alpha, beta, the
 * widths and sigma_int). The model is linear in M = abs_mag, so with offset
 * 'marginalize' M is integrated out with a flat prior exactly as in the
 * conventional term (Goliath et al. 2001; Conley et al. 2011, appendix C):
 * chi^2 at its best fit plus ln(E/2 pi), E = u^T Sigma^-1 u, u = 1 on the m_B entries.
 *
 * Paths: 'blocks' (every covariance per supernova: O(N) per call; with K
 * systematic modes on m_B, O(N K^2) through the Woodbury identity, Woodbury
 * 1950, see hierarchicalModes.ts) or 'dense' (a 3N x 3N or N x N matrix
 * couples supernovae, modes then added to it: Cholesky O((3N)^3/3) per
 * change of alpha, beta, widths or sigma_int, or once when frozen).
 * Unphysical points (no Big Bang, a width <= 0, a non-finite parameter, a
 * block that is not positive definite) give -Infinity with a reason, never NaN.
 *
 * Parameters read: omega_m, omega_de (curved), w0, wa, h0 (km/s/Mpc; when
 * needed), abs_mag (mag; sampled offset), alpha, beta, mass_step (mag),
 * sigma_int[_sample] (mag), x1_mean[_sample], x1_width[_sample],
 * color_mean[_sample] (mag), color_width[_sample] (mag), x1_mean_slope and
 * color_mean_slope (per unit z). Default priors: hierarchicalPopulationPriors.
 * Cost of construction: O(N log N) plus scans of the matrices.
 * @param options plain options (see HierarchicalTermOptions)
 * @throws CandelaError for a magnitude table, missing or non-finite light-curve values, wrong matrix or mode sizes, non-finite modes,
 *   a Hubble-flow z <= 0, or a frozen covariance without values
 * @example
 * const term = createHierarchicalSupernovaTerm({ name: 'sn', table, covariances: [], cosmologyModel: { darkEnergy: 'lambda', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
 *   standardization: { massStep, scatter, intrinsicScatter: 'global', alphaBetaCovariance: 'exact' }, population: { perSample: false, redshiftDependentMeans: false }, offset: 'marginalize' });
 * term.logLikelihood({ omega_m: 0.3, alpha: 0.14, beta: 3.1, sigma_int: 0.1, x1_mean: 0, x1_width: 1, color_mean: 0, color_width: 0.1 }); // a finite number
 */
export function createHierarchicalSupernovaTerm(options: HierarchicalTermOptions): HierarchicalTerm {
  const model = createHierarchicalModel(options);
  const evaluator = model.data.dense ? createDenseEvaluator(model) : model.data.modes ? createBlockModesEvaluator(model) : createBlockEvaluator(model);
  const warnings = collectWarnings(model, options);
  const record: HierarchicalEvaluation = createHierarchicalEvaluation();
  const n = model.count;
  const evaluate = (p: ParameterValues): HierarchicalEvaluation => {
    evaluator.evaluate(p, record);
    return record;
  };
  const accepted = (p: ParameterValues, what: string): HierarchicalEvaluation => {
    const result = evaluate(p);
    if (result.reason) throw new CandelaError({ code: 'likelihood.unphysical_point', path: options.name, message: `no ${what} at this point: ${result.reason}` });
    return result;
  };
  const offsetAt = (p: ParameterValues, result: HierarchicalEvaluation): number => (model.names.readsAbsMag ? p.abs_mag : result.bestAbsoluteMagnitude);
  const { population } = options;

  return {
    name: options.name,
    requires: model.names.requires,
    dataCount: 3 * n,
    path: evaluator.path,
    warnings,
    logLikelihood: (p) => evaluate(p).logLikelihood,
    rejectionReason: (p) => evaluate(p).reason,
    bestFitExtras(p): Record<string, number> {
      const result = evaluate(p);
      if (result.reason) return {};
      return {
        chi_square: result.chiSquare, log_det_covariance: result.logDeterminant,
        abs_mag_best_fit: result.bestAbsoluteMagnitude, offset_marginalization_term: result.marginalizationTerm,
      };
    },
    bestFitOffset: (p) => accepted(p, 'best-fit offset').bestAbsoluteMagnitude,
    hubbleDiagram(p) {
      const result = accepted(p, 'Hubble diagram');
      return hierarchicalHubbleDiagram(model, p, offsetAt(p, result));
    },
    latentEstimates(p) {
      const result = accepted(p, 'latent estimates');
      return latentPosterior(model, evaluator.denseFactor, evaluator.modes, p, offsetAt(p, result));
    },
    describe() {
      const samples = options.table.sampleNames.length;
      return [
        `${options.name}: ${n} supernovae (light curves), hierarchical stretch and colour model (March et al. 2011), ` +
          `${model.names.hasCalibrators ? 'with calibrators (distance ladder)' : 'no calibrators'}`,
        ...evaluator.describe(),
        `populations: Gaussian x1 and c, ${population.perSample ? `one per sample (${samples})` : 'one for all samples'}` +
          `${population.redshiftDependentMeans ? ', means linear in z' : ''}; latent x1 and c integrated out analytically`,
        `ln L = -(chi^2 + ln det Sigma + 3N ln 2 pi${options.offset === 'marginalize' ? ' + ln(E/2 pi)' : ''})/2 over 3N = ${3 * n} observations, fully normalized`,
        options.offset === 'marginalize'
          ? 'abs_mag marginalized analytically with a flat prior (Goliath et al. 2001; Conley et al. 2011, appendix C)'
          : 'abs_mag sampled',
        `covariance: ${model.data.parts.join(' + ')} + population and intrinsic terms`,
        ...warnings.map((warning) => `warning: ${warning}`),
      ];
    },
  };
}
