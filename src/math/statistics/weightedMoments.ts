import { checkSamples } from './sampleErrors.js';

/** Weighted mean and standard deviation of one column. */
export interface WeightedMoments {
  /** Weighted mean, unit of the sample. */
  mean: number;
  /** Weighted standard deviation with the reliability-weight correction; 0 for one sample. */
  sd: number;
  /** Sum of the weights (n for unit weights). */
  totalWeight: number;
  /** Kish effective count (sum w)^2 / sum w^2. */
  effectiveCount: number;
}

/**
 * Weighted mean and standard deviation in one stable pass: West's update
 * (West 1979, "Updating mean and variance estimates: an improved method",
 * Comm. ACM 22, 532), the weighted form of Welford's algorithm. The variance
 * uses reliability weights, S / (W - sum w^2 / W) with S the weighted sum of
 * squared deviations and W = sum w, which is the usual n - 1 estimator for
 * unit weights and matches R's cov.wt(method = "unbiased").
 *
 * Cost: O(n), no allocation.
 * @param values sample values (any unit), finite.
 * @param weights optional non-negative weights.
 * @param label parameter name for error messages.
 * @throws CandelaError on non-finite values or bad weights.
 * @example weightedMoments([1, 2, 3, 4]) // { mean: 2.5, sd: 1.291, totalWeight: 4, effectiveCount: 4 }
 */
export function weightedMoments(values: ArrayLike<number>, weights?: ArrayLike<number>, label = 'sample'): WeightedMoments {
  checkSamples(values, weights, label);
  let totalWeight = 0;
  let sumSquaredWeights = 0;
  let mean = 0;
  let squaredDeviations = 0;
  for (let i = 0; i < values.length; i++) {
    const weight = weights ? weights[i] : 1;
    if (weight === 0) continue;
    totalWeight += weight;
    sumSquaredWeights += weight * weight;
    const delta = values[i] - mean;
    mean += (weight / totalWeight) * delta;
    squaredDeviations += weight * delta * (values[i] - mean);
  }
  const denominator = totalWeight - sumSquaredWeights / totalWeight;
  const variance = denominator > 0 ? Math.max(squaredDeviations, 0) / denominator : 0;
  return { mean, sd: Math.sqrt(variance), totalWeight, effectiveCount: (totalWeight * totalWeight) / sumSquaredWeights };
}
