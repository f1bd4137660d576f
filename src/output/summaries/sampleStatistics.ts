import { ONE_SIGMA_MASS, TWO_SIGMA_MASS } from './credibleMass.js';
import { highestDensityIntervalOfSorted } from './highestDensityInterval.js';
import { sortSample, weightedMoments, weightedQuantileOfSorted } from '../../math/index.js';

/** Summary statistics of one parameter's posterior samples (all in the parameter's unit). */
export interface SampleStatistics {
  /** Number of samples with positive weight. */
  count: number;
  /** Kish effective count (sum w)^2 / sum w^2 (equals count for unit weights). */
  effectiveCount: number;
  mean: number;
  /** Standard deviation (reliability-weight estimator, n - 1 for unit weights). */
  sd: number;
  median: number;
  /** Equal-tailed 68.27% interval: quantiles 0.158655 and 0.841345. */
  ci68: [number, number];
  /** Equal-tailed 95.45% interval: quantiles 0.022750 and 0.977250. */
  ci95: [number, number];
  /** Shortest interval holding 68.27% (Chen & Shao 1999). */
  hdi68: [number, number];
  /** Smallest and largest sample. */
  min: number;
  max: number;
  /** Value at the sample with the highest log posterior, when log posteriors were given. */
  map?: number;
}

/** Options of {@link sampleStatistics}. */
export interface SampleStatisticsOptions {
  /** Non-negative sample weights (nested sampling); unit weights when omitted. */
  weights?: ArrayLike<number>;
  /** Index of the maximum-posterior sample (see summarizePosterior), for `map`. */
  mapIndex?: number;
  /** Parameter name for error messages. */
  label?: string;
}

/**
 * Mean, standard deviation, median, equal-tailed 68.27% / 95.45% intervals,
 * 68.27% highest-density interval and MAP value of one parameter.
 * Quantiles follow {@link weightedQuantileOfSorted} (Hyndman & Fan 1996
 * definition 2, weighted); moments follow West (1979).
 *
 * Cost: O(n log n) for one sort.
 * @param values sample values (unit of the parameter), finite.
 * @param options weights, MAP index and label.
 * @throws CandelaError on empty input, non-finite values or bad weights.
 * @example sampleStatistics([1, 2, 3, 4, 5]).median // 3
 */
export function sampleStatistics(values: ArrayLike<number>, options: SampleStatisticsOptions = {}): SampleStatistics {
  const label = options.label ?? 'sample';
  const moments = weightedMoments(values, options.weights, label);
  const sorted = sortSample(values, options.weights, label);
  const tail68 = (1 - ONE_SIGMA_MASS) / 2;
  const tail95 = (1 - TWO_SIGMA_MASS) / 2;
  const statistics: SampleStatistics = {
    count: sorted.values.length,
    effectiveCount: moments.effectiveCount,
    mean: moments.mean,
    sd: moments.sd,
    median: weightedQuantileOfSorted(sorted, 0.5),
    ci68: [weightedQuantileOfSorted(sorted, tail68), weightedQuantileOfSorted(sorted, 1 - tail68)],
    ci95: [weightedQuantileOfSorted(sorted, tail95), weightedQuantileOfSorted(sorted, 1 - tail95)],
    hdi68: highestDensityIntervalOfSorted(sorted, ONE_SIGMA_MASS),
    min: sorted.values[0],
    max: sorted.values[sorted.values.length - 1],
  };
  if (options.mapIndex !== undefined && options.mapIndex >= 0 && options.mapIndex < values.length) {
    statistics.map = values[options.mapIndex];
  }
  return statistics;
}
