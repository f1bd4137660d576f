import { compensatedSum } from '../compensatedSum.js';
import { checkSamples } from './checkSamples.js';
import { kishEffectiveCount } from './kishEffectiveCount.js';

/** Weighted mean and spread of one column. */
export interface WeightedMoments {
  /** Weighted mean, unit of the sample. */
  mean: number;
  /** Weighted variance with the reliability-weight correction (unit squared); 0 for one sample. */
  variance: number;
  /** Its square root, the standard deviation (unit of the sample). */
  sd: number;
  /** Sum of the weights (n for unit weights). */
  totalWeight: number;
  /** Kish effective count (sum w)^2 / sum w^2 (n for unit weights). */
  effectiveCount: number;
}

/**
 * Weighted mean and variance by two passes with compensated sums (Neumaier
 * 1974): the mean first, then the weighted sum of squared deviations S. The
 * variance uses reliability weights, S / (W - sum w^2 / W) with W = sum w,
 * which is the usual n - 1 estimator for unit weights (R's `var`) and matches
 * R's cov.wt(method = "unbiased") for weights. For unit weights the mean and
 * variance are bit for bit those of the two-pass textbook formulas
 * (Chan, Golub & LeVeque 1983, "Algorithms for computing the sample
 * variance", Am. Stat. 37, 242, recommend two passes for accuracy).
 *
 * Cost: O(n) time, one array of n doubles.
 * @param values sample values (any unit), finite.
 * @param weights optional non-negative weights.
 * @param label parameter name for error messages.
 * @throws CandelaError `math.empty_sample`, `math.non_finite_sample` or a weight error of {@link checkSamples}.
 * @example weightedMoments([1, 2, 3, 4]) // { mean: 2.5, variance: 1.667, sd: 1.291, totalWeight: 4, effectiveCount: 4 }
 */
export function weightedMoments(values: ArrayLike<number>, weights?: ArrayLike<number>, label = 'sample'): WeightedMoments {
  checkSamples(values, weights, label);
  const count = values.length;
  const terms = new Float64Array(count);
  let totalWeight = count;
  let squaredWeightTotal = count;
  if (weights) {
    for (let i = 0; i < count; i++) terms[i] = weights[i];
    totalWeight = compensatedSum(terms);
    for (let i = 0; i < count; i++) terms[i] = weights[i] * weights[i];
    squaredWeightTotal = compensatedSum(terms);
    for (let i = 0; i < count; i++) terms[i] = weights[i] * values[i];
  } else {
    terms.set(values as ArrayLike<number>);
  }
  const mean = compensatedSum(terms) / totalWeight;
  for (let i = 0; i < count; i++) {
    const deviation = values[i] - mean;
    terms[i] = weights ? weights[i] * deviation * deviation : deviation * deviation;
  }
  const denominator = totalWeight - squaredWeightTotal / totalWeight;
  const variance = denominator > 0 ? compensatedSum(terms) / denominator : 0;
  return { mean, variance, sd: Math.sqrt(variance), totalWeight, effectiveCount: kishEffectiveCount(weights ?? count) };
}

/**
 * Arithmetic mean with a compensated sum (Neumaier 1974); the unit-weight
 * case of {@link weightedMoments}. Cost O(n).
 * @example meanOf(Float64Array.of(1, 2, 3, 4)) // 2.5
 */
export function meanOf(values: ArrayLike<number>): number {
  return weightedMoments(values).mean;
}

/**
 * Sample variance with the n - 1 denominator, two-pass, as R's `var`; the
 * unit-weight case of {@link weightedMoments}. Cost O(n).
 * @example sampleVarianceOf(Float64Array.of(1, 2, 3, 4)) // 1.6666666666666667
 */
export function sampleVarianceOf(values: ArrayLike<number>): number {
  return weightedMoments(values).variance;
}
