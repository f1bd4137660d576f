/** Version tag of comparison.json. */
export const COMPARISON_SCHEMA = 'candela-comparison-1';

/** One model of comparison.json (snake_case like summary.json; numbers finite or null). */
export interface ComparisonModelJson {
  label: string;
  run_dir: string;
  base: boolean;
  /** 'ensemble' or 'nested'. */
  sampler: string;
  dark_energy: string;
  curvature: string;
  n_data: number;
  k_free: number;
  chi_square_best_fit: number;
  log_likelihood_best_fit: number;
  aic: number;
  bic: number;
  dic: number | null;
  /** Why there is no DIC, or null. */
  dic_missing: string | null;
  dic_effective_parameters: number | null;
  deviance_at_posterior_mean: number | null;
  posterior_mean: Record<string, number>;
  delta_aic: number;
  delta_bic: number;
  delta_dic: number | null;
  log_z: number | null;
  log_z_error: number | null;
  log_bayes_factor_vs_base: number | null;
  log_bayes_factor_error: number | null;
  bayes_factor_source: 'evidence' | 'savage-dickey' | null;
  /** Kass & Raftery (1995) strength of the Bayes factor. */
  strength: string | null;
  favours: 'model' | 'base' | 'neither' | null;
  reading: string | null;
}

/** The Savage-Dickey entry of a nested pair in comparison.json: the estimate with its ingredients, or why there is none. */
export type SavageDickeyJson =
  | { log_bayes_factor_01: number; error: number; posterior_density: number; prior_density: number; effective_draws: number; draws_used: number; thinning_steps: number; bandwidth: number[]; reading: string | null }
  | { unavailable: string };

/** One nested pair of comparison.json. */
export interface ComparisonNestedPairJson {
  base: string;
  extended: string;
  /** Values the base model fixes, by parameter name. */
  fixed_in_base: Record<string, number>;
  extended_priors: Record<string, unknown>;
  prior_mismatches: string[];
  extra_parameters: number;
  delta_chi_square: number | null;
  p_value: number | null;
  gaussian_sigma: number | null;
  savage_dickey: SavageDickeyJson;
  /** ln B01 from the two runs' evidences (nats), or null for ensemble runs. */
  evidence_log_bayes_factor_01: { value: number; error: number } | null;
}

/** A changed input file: the SHA-256 the fit recorded and the current one. */
export interface ComparisonChangedInputJson {
  model: string;
  path: string;
  recorded: string | null;
  current: string;
}

/** comparison.json (schema {@link COMPARISON_SCHEMA}). */
export interface ComparisonJson {
  schema: typeof COMPARISON_SCHEMA;
  base: string;
  models: ComparisonModelJson[];
  nested_pairs: ComparisonNestedPairJson[];
  notes: string[];
  changed_inputs: ComparisonChangedInputJson[];
  warnings: string[];
  /** Figure files written, relative to the comparison folder. */
  figures: string[];
}

/**
 * comparison.json's text: the document indented by two spaces, ending in a
 * line break.
 * @param document the document (with any extra keys, e.g. a blinding entry).
 * @returns the JSON text.
 * @throws nothing.
 * @example comparisonJsonText(document).startsWith('{\n  "schema": "candela-comparison-1"') // true
 */
export function comparisonJsonText(document: ComparisonJson): string {
  return `${JSON.stringify(document, null, 2)}\n`;
}
