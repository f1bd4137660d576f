import { logBayesFactor, type ModelComparison } from '../../compare/index.js';
import { isCandelaError } from '../../errors.js';
import { COMPARISON_SCHEMA, type ComparisonJson, type SavageDickeyJson } from '../../output/index.js';
import type { AnalyzedRun } from './compareInputs.js';
import type { ComparedModel } from './compareModelRecord.js';
import type { DetectedNestedPair, PairSavageDickey } from './compareNestedPairs.js';


/** What the comparison document is built from. */
export interface ComparisonParts {
  runs: readonly AnalyzedRun[];
  models: readonly ComparedModel[];
  pairs: ReadonlyArray<{ pair: DetectedNestedPair; savageDickey: PairSavageDickey }>;
  comparison: ModelComparison;
  changedInputs: Array<{ model: string; path: string; recorded: string | null; current: string }>;
  warnings: string[];
  figures: string[];
}

function finiteOrNull(value: number | null | undefined): number | null {
  return value === null || value === undefined || !Number.isFinite(value) ? null : value;
}

/**
 * ln B01 = ln Z(simpler) - ln Z(extended) of a nested pair from the two
 * runs' evidences, with the errors added in quadrature (independent runs):
 * the compare layer's logBayesFactor.
 * Cost: O(1).
 * @param pair a detected pair.
 * @returns ln B01 and its error (nats), or null when either run lacks a usable evidence (ensemble runs).
 * @throws nothing.
 * @example evidenceLogBayesFactor01(pair) // { value: 1.56, error: 0.17 }
 */
export function evidenceLogBayesFactor01(pair: DetectedNestedPair): { value: number; error: number } | null {
  const simple = pair.base.run.record.evidence;
  const wide = pair.extended.run.record.evidence;
  if (!simple || !wide) return null;
  try {
    const { logBayesFactor: value, error } = logBayesFactor({ logZ: simple.log_z, logZError: simple.log_z_error }, { logZ: wide.log_z, logZError: wide.log_z_error });
    return { value, error };
  } catch (failure) {
    if (isCandelaError(failure)) return null; // a stored ln Z or error that is not a finite number
    throw failure;
  }
}

/**
 * comparison.json's content (schema COMPARISON_SCHEMA, fields in
 * output/compare/comparisonJson.ts) from the compare layer's result and the runs: per model the run folder, sampler, N, k, chi-square and
 * ln L at the best fit, AIC, BIC, DIC with p_D (or `dic_missing`: why there is none), ln Z with its error, ln B
 * against the base with its source and Kass & Raftery (1995) reading; per
 * nested pair the extra parameters and their fixed values, delta chi-square
 * with its p-value and Gaussian equivalent, the Savage-Dickey ln B01 (with
 * its ingredients, or why there is none) next to ln B01 from the evidences;
 * then the notes (including the caution that delta chi-square ignores the
 * priors), changed input files, warnings and the figure files.
 *
 * Cost: O(models + pairs).
 * @param parts the runs, records, pairs, compareModels result, changed inputs, warnings, figure names.
 * @returns the JSON-ready document (numbers finite or null).
 * @throws nothing.
 * @example JSON.stringify(comparisonDocument(parts), null, 2)
 */
export function comparisonDocument(parts: ComparisonParts): ComparisonJson {
  const { comparison } = parts;
  const models = comparison.rows.map((row, k) => {
    const { run, analysis } = parts.runs[k];
    const compared = parts.models[k];
    return {
      label: row.label,
      run_dir: run.dir,
      base: row.isBase,
      sampler: analysis.method,
      dark_energy: run.record.model.dark_energy,
      curvature: run.record.model.curvature,
      n_data: row.dataCount,
      k_free: row.freeParameterCount,
      chi_square_best_fit: row.chiSquareMinimum,
      log_likelihood_best_fit: row.logLikelihoodMaximum,
      aic: row.aic,
      bic: row.bic,
      dic: finiteOrNull(row.dic),
      dic_missing: compared.dicMissing,
      dic_effective_parameters: finiteOrNull(row.effectiveParameters),
      deviance_at_posterior_mean: finiteOrNull(compared.record.devianceAtPosteriorMean),
      posterior_mean: compared.posteriorMean,
      delta_aic: row.deltaAic,
      delta_bic: row.deltaBic,
      delta_dic: finiteOrNull(row.deltaDic),
      log_z: finiteOrNull(row.logZ),
      log_z_error: finiteOrNull(row.logZError),
      log_bayes_factor_vs_base: finiteOrNull(row.logBayesFactor),
      log_bayes_factor_error: finiteOrNull(row.logBayesFactorError),
      bayes_factor_source: row.bayesFactorSource,
      strength: row.strength,
      favours: row.favours,
      reading: row.reading,
    };
  });
  const nested = parts.pairs.map(({ pair, savageDickey }) => {
    const row = comparison.nested.find((entry) => entry.base === pair.base.run.record.model.label && entry.extended === pair.extended.run.record.model.label);
    const evidence = evidenceLogBayesFactor01(pair);
    return {
      base: pair.base.run.record.model.label,
      extended: pair.extended.run.record.model.label,
      fixed_in_base: Object.fromEntries(pair.extra.map((entry) => [entry.name, entry.value])),
      extended_priors: Object.fromEntries(pair.extra.map((entry) => [entry.name, entry.prior])),
      prior_mismatches: pair.priorMismatches,
      extra_parameters: row?.extraParameters ?? pair.extra.length,
      delta_chi_square: finiteOrNull(row?.deltaChiSquare),
      p_value: finiteOrNull(row?.pValue),
      gaussian_sigma: finiteOrNull(row?.sigma),
      savage_dickey: (savageDickey.ok
        ? {
          log_bayes_factor_01: savageDickey.estimate.logBayesFactor,
          error: savageDickey.estimate.logBayesFactorError,
          posterior_density: savageDickey.estimate.posteriorDensity,
          prior_density: savageDickey.estimate.priorDensity,
          effective_draws: savageDickey.estimate.effectiveSampleSize,
          draws_used: savageDickey.drawsUsed,
          thinning_steps: savageDickey.thinning,
          bandwidth: savageDickey.estimate.bandwidth,
          reading: row?.savageDickeyReading ?? null,
        }
        : { unavailable: savageDickey.reason }) as SavageDickeyJson,
      evidence_log_bayes_factor_01: evidence ? { value: evidence.value, error: evidence.error } : null,
    };
  });
  return {
    schema: COMPARISON_SCHEMA,
    base: comparison.baseLabel,
    models,
    nested_pairs: nested,
    notes: comparison.notes,
    changed_inputs: parts.changedInputs,
    warnings: parts.warnings,
    figures: parts.figures,
  };
}
