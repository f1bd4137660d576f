/**
 * Types of a model comparison: what each fitted model contributes, and the
 * JSON-ready result (numbers are finite or null, never NaN or Infinity).
 */
import type { EvidenceStrength } from './readBayesFactor.js';

/** One fitted model, as the pipeline summarizes it. */
export interface ModelFitRecord {
  /** Model name shown in tables (unique). */
  label: string;
  /** Best-fit chi-square (dimensionless). */
  chiSquareMinimum: number;
  /** Number of data points N used in the fit (supernovae). */
  dataCount: number;
  /** Number of free parameters k. */
  freeParameterCount: number;
  /** ln L_max including the likelihood's normalization (nats); AIC and BIC use -2 times it. */
  logLikelihoodMaximum: number;
  /** -2 ln L at posterior draws, for DIC (optional). */
  devianceSamples?: ArrayLike<number>;
  /** Weights of those draws (optional). */
  devianceWeights?: ArrayLike<number>;
  /** -2 ln L at the posterior mean, for DIC (required with devianceSamples). */
  devianceAtPosteriorMean?: number;
  /** ln Z from nested sampling (optional, nats). */
  logZ?: number;
  /** Its error (required with logZ). */
  logZError?: number;
}

/** A simpler model nested in an extended one (the extended model reduces to it at fixed parameter values). */
export interface NestedModelPair {
  /** Label of the simpler model. */
  base: string;
  /** Label of the extended model. */
  extended: string;
  /** Optional Savage-Dickey ln B_01 (base over extended) and its error, e.g. from savageDickeyRatio. */
  savageDickey?: { logBayesFactor: number; logBayesFactorError: number };
}

/** What to compare against. */
export interface ComparisonOptions {
  /** Label of the reference model; every delta and Bayes factor is relative to it. */
  baseLabel: string;
  /** Nested pairs for delta chi-square significances and Savage-Dickey ratios. */
  nestedPairs?: NestedModelPair[];
}

/** One model's line of the comparison. Deltas are this model minus the base. */
export interface ModelComparisonRow {
  label: string;
  isBase: boolean;
  freeParameterCount: number;
  dataCount: number;
  chiSquareMinimum: number;
  logLikelihoodMaximum: number;
  aic: number;
  bic: number;
  dic: number | null;
  /** p_D of the DIC. */
  effectiveParameters: number | null;
  deltaAic: number;
  deltaBic: number;
  deltaDic: number | null;
  logZ: number | null;
  logZError: number | null;
  /** ln B of this model against the base (positive favours this model). */
  logBayesFactor: number | null;
  logBayesFactorError: number | null;
  /** Where ln B came from: two evidences, or a Savage-Dickey ratio of a nested pair. */
  bayesFactorSource: 'evidence' | 'savage-dickey' | null;
  strength: EvidenceStrength | null;
  favours: 'model' | 'base' | 'neither' | null;
  /** Sentence on the Kass & Raftery (1995) scale. */
  reading: string | null;
}

/** One nested pair's line of the comparison. */
export interface NestedComparisonRow {
  base: string;
  extended: string;
  /** m = k_extended - k_base. */
  extraParameters: number;
  /** chi2_min(base) - chi2_min(extended). */
  deltaChiSquare: number;
  pValue: number;
  logPValue: number;
  /** Two-sided Gaussian equivalent of the p-value. */
  sigma: number;
  /** Savage-Dickey ln B_01 (positive favours the base). */
  savageDickeyLogBayesFactor: number | null;
  savageDickeyError: number | null;
  savageDickeyReading: string | null;
}

/** The structured comparison (JSON-ready). */
export interface ModelComparison {
  baseLabel: string;
  rows: ModelComparisonRow[];
  nested: NestedComparisonRow[];
  /** Conventions and cautions, one sentence each, printed under the tables. */
  notes: string[];
}

/** The comparison with its two table renderings. */
export interface ModelComparisonReport {
  comparison: ModelComparison;
  markdown: string;
  latex: string;
}
