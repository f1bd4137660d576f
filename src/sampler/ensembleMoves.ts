import type { RandomStream } from '../math/index.js';

/**
 * Proposal kernels of the ensemble sampler. A walker k of the active half
 * moves using walkers of the complementary half (positions rows
 * `complementStart .. complementStart + complementSize - 1`), which are held
 * fixed while the active half moves; this is what keeps the update a valid
 * Markov step when a whole half is proposed at once (Foreman-Mackey et al.
 * 2013, PASP 125, 306, algorithm 3). Each kernel draws its random numbers
 * from `rng` in a fixed order, writes the proposal into `out` at
 * `outOffset`, and returns the log of the proposal's acceptance correction.
 */

/** Optimal differential-evolution step for Gaussian targets, 2.38 / sqrt(2 d) (ter Braak 2006, section 3). */
export const DIFFERENTIAL_EVOLUTION_GAMMA_NUMERATOR = 2.38;
/**
 * Relative standard deviation of the random jitter on the differential-evolution
 * step gamma. Small: it only keeps proposals off an exact lattice of walker
 * differences (ter Braak 2006 adds a small random term for the same reason).
 * The value is common practice, not tuned.
 */
export const DIFFERENTIAL_EVOLUTION_GAMMA_JITTER = 1e-3;

/**
 * Draws the stretch factor z from g(z) proportional to 1/sqrt(z) on
 * [1/a, a] (Goodman & Weare 2010, eq. 9) by inversion of its distribution
 * function: z = ((a - 1) u + 1)^2 / a for u uniform on [0, 1).
 * @example stretchFactor(0.5, 2) // 1.125
 */
export function stretchFactor(uniform: number, scale: number): number {
  const root = (scale - 1) * uniform + 1;
  return (root * root) / scale;
}

/**
 * Stretch move (Goodman & Weare 2010, eq. 7): Y = X_j + z (X_k - X_j) for a
 * partner X_j drawn uniformly from the complement, z from {@link stretchFactor}.
 * Draws: partner index (one uniform), then z (one uniform).
 * Returns the acceptance correction (d - 1) ln z (their eq. 8).
 * Positions and `out` are row major, in parameter units.
 * Cost: O(dimension), no allocation. Never throws.
 * @example proposeStretch(rng, positions, 0, 4, 4, 2, 2, batch, 0) // writes walker 0's proposal to batch[0..1]
 */
export function proposeStretch(
  rng: RandomStream,
  positions: Float64Array,
  walker: number,
  complementStart: number,
  complementSize: number,
  dimension: number,
  scale: number,
  out: Float64Array,
  outOffset: number,
): number {
  const partner = complementStart + rng.integer(complementSize);
  const z = stretchFactor(rng.uniform(), scale);
  const from = walker * dimension;
  const anchor = partner * dimension;
  for (let k = 0; k < dimension; k++) {
    out[outOffset + k] = positions[anchor + k] + z * (positions[from + k] - positions[anchor + k]);
  }
  return (dimension - 1) * Math.log(z);
}

/**
 * Differential-evolution move (ter Braak 2006, "A Markov chain Monte Carlo
 * version of the genetic algorithm Differential Evolution", Stat. Comput. 16,
 * 239, eq. 2): Y = X_k + gamma (X_p - X_q) for two distinct partners p, q
 * from the complement, gamma = 2.38 / sqrt(2 d) times (1 + jitter x normal).
 * Draws: p (one uniform), q (one uniform), the jitter normal.
 * The proposal is symmetric, so the correction is 0.
 * Requires complementSize >= 2 (guaranteed by resolveEnsembleOptions).
 * Cost: O(dimension), no allocation. Never throws.
 * @example proposeDifferentialEvolution(rng, positions, 0, 4, 4, 2, batch, 0) // returns 0
 */
export function proposeDifferentialEvolution(
  rng: RandomStream,
  positions: Float64Array,
  walker: number,
  complementStart: number,
  complementSize: number,
  dimension: number,
  out: Float64Array,
  outOffset: number,
): number {
  const first = rng.integer(complementSize);
  let second = rng.integer(complementSize - 1);
  if (second >= first) second += 1;
  const gamma = (DIFFERENTIAL_EVOLUTION_GAMMA_NUMERATOR / Math.sqrt(2 * dimension)) *
    (1 + DIFFERENTIAL_EVOLUTION_GAMMA_JITTER * rng.normal());
  const from = walker * dimension;
  const p = (complementStart + first) * dimension;
  const q = (complementStart + second) * dimension;
  for (let k = 0; k < dimension; k++) {
    out[outOffset + k] = positions[from + k] + gamma * (positions[p + k] - positions[q + k]);
  }
  return 0;
}
