/**
 * Parameter values by name, free and fixed together, e.g.
 * `{ omega_m: 0.3, alpha: 0.14, h0: 70 }`. Units are those of each parameter
 * (h0 in km/s/Mpc, abs_mag and mass_step in mag, sigma_int in mag).
 */
export type ParameterValues = Readonly<Record<string, number>>;

/**
 * One independent factor of the likelihood (a supernova sample, a Gaussian
 * prior from another probe, ...). The posterior is the prior times the
 * product of its terms, so the log-likelihood is the sum of the terms'.
 *
 * @example
 * const term: LikelihoodTerm = {
 *   name: 'h0_prior', requires: ['h0'], dataCount: 1,
 *   logLikelihood: (p) => -0.5 * ((p.h0 - 73) / 1) ** 2,
 *   rejectionReason: () => null,
 * };
 */
export interface LikelihoodTerm {
  /** Short label used in messages and summaries. */
  readonly name: string;
  /** Names of the parameters it reads; each must be free or fixed in the posterior. */
  readonly requires: readonly string[];
  /** Number of data points it contributes, for information criteria. */
  readonly dataCount: number;
  /** ln L at the given values: -Infinity when unphysical, never NaN. Allocates nothing. */
  logLikelihood(p: ParameterValues): number;
  /** Why logLikelihood(p) is -Infinity, or null when it is finite. */
  rejectionReason(p: ParameterValues): string | null;
  /** Extra numbers worth reporting at a best fit (chi-square, a marginalized offset, ...). */
  bestFitExtras?(p: ParameterValues): Record<string, number>;
}
