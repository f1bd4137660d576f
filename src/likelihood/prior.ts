/**
 * A prior on one parameter. Units are those of the parameter it belongs to
 * (e.g. km/s/Mpc for h0, mag for abs_mag).
 *
 * - `uniform`: flat on [min, max].
 * - `gaussian`: normal with mean and standard deviation sd (sd > 0), unbounded.
 * - `truncated_gaussian`: that normal restricted to [min, max] and renormalized.
 * - `log_uniform`: flat in ln x on [min, max], 0 < min < max (density 1/(x ln(max/min))).
 *
 * @example const prior: Prior = { kind: 'uniform', min: 0, max: 1 };
 */
export type Prior =
  | { kind: 'uniform'; min: number; max: number }
  | { kind: 'gaussian'; mean: number; sd: number }
  | { kind: 'truncated_gaussian'; mean: number; sd: number; min: number; max: number }
  | { kind: 'log_uniform'; min: number; max: number };

/** The names of the prior kinds, for validation messages. */
export const PRIOR_KINDS: readonly Prior['kind'][] = ['uniform', 'gaussian', 'truncated_gaussian', 'log_uniform'];
