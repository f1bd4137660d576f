import type { ComparisonJson } from '../../../src/output/index.js';

/**
 * A hand-built comparison.json of two ensemble runs and their nested pair
 * (numbers invented, shaped like a Pantheon 2018 binned comparison).
 */
export function handBuiltComparison(): ComparisonJson {
  const model = {
    run_dir: 'out/fit/flat_lcdm', sampler: 'ensemble', dark_energy: 'lambda', curvature: 'flat', n_data: 40,
    log_likelihood_best_fit: 78.2, deviance_at_posterior_mean: -156.4, posterior_mean: { omega_m: 0.297 },
    log_z: null, log_z_error: null, log_bayes_factor_vs_base: null, log_bayes_factor_error: null, bayes_factor_source: null, strength: null, favours: null, reading: null,
  } as const;
  return {
    schema: 'candela-comparison-1',
    base: 'flat_lcdm',
    models: [
      { ...model, label: 'flat_lcdm', base: true, k_free: 1, chi_square_best_fit: 39.2979, aic: -154.433, bic: -152.744, dic: -154.4425, dic_missing: null, dic_effective_parameters: 0.9938, delta_aic: 0, delta_bic: 0, delta_dic: 0, posterior_mean: { omega_m: 0.297 } },
      { ...model, label: 'flat_wcdm', run_dir: 'out/fit/flat_wcdm', dark_energy: 'constant_w', base: false, k_free: 2, chi_square_best_fit: 39.207, aic: -152.52, bic: -149.14, dic: null, dic_missing: 'no posterior mean', dic_effective_parameters: null, delta_aic: 1.91, delta_bic: 3.6, delta_dic: null, posterior_mean: { omega_m: 0.3, w0: -1.02 } },
    ],
    nested_pairs: [{
      base: 'flat_lcdm', extended: 'flat_wcdm', fixed_in_base: { w0: -1 }, extended_priors: { w0: { kind: 'uniform', min: -3, max: 1 } }, prior_mismatches: [],
      extra_parameters: 1, delta_chi_square: 0.0908, p_value: 0.763, gaussian_sigma: 0.301,
      savage_dickey: { log_bayes_factor_01: 1.9064, error: 0.027, posterior_density: 1.68, prior_density: 0.25, effective_draws: 3840, draws_used: 3840, thinning_steps: 19, bandwidth: [0.0429], reading: null },
      evidence_log_bayes_factor_01: { value: 1.86, error: 0.04 },
    }],
    notes: [],
    changed_inputs: [{ model: 'flat_wcdm', path: 'data/bins.txt', recorded: null, current: 'ab12' }],
    warnings: ['flat_wcdm: DIC missing'],
    figures: [],
  };
}
