import { CandelaError } from '../../errors.js';

/**
 * Checks one column of posterior samples (and optional weights) before any
 * statistic is computed, so that no NaN reaches a summary. Used by every
 * weighted statistic of math/statistics and by the output layer's correlations.
 * @param values sample values (any unit).
 * @param weights optional non-negative sample weights, same length.
 * @param label parameter name used in the error path.
 * @throws CandelaError `math.empty_sample`, `math.non_finite_sample`,
 *   `math.bad_weight`, `math.weight_length` or `math.zero_weight`.
 */
export function checkSamples(values: ArrayLike<number>, weights: ArrayLike<number> | undefined, label: string): void {
  if (values.length === 0) {
    throw new CandelaError({ code: 'math.empty_sample', path: label, message: `no samples for ${label}`, fix: 'run the sampler longer or use a shorter burn-in' });
  }
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) {
      throw new CandelaError({
        code: 'math.non_finite_sample', path: label, row: i + 1,
        message: `sample ${i + 1} of ${label} is not a finite number`, expected: 'a finite number', found: String(values[i]),
        fix: 'drop samples whose log posterior is -Infinity before summarizing',
      });
    }
  }
  if (!weights) return;
  if (weights.length !== values.length) {
    throw new CandelaError({ code: 'math.weight_length', path: label, message: `${weights.length} weights for ${values.length} samples of ${label}`, expected: String(values.length), found: String(weights.length) });
  }
  let positive = 0;
  for (let i = 0; i < weights.length; i++) {
    const weight = weights[i];
    if (!(weight >= 0) || !Number.isFinite(weight)) {
      throw new CandelaError({ code: 'math.bad_weight', path: label, row: i + 1, message: `weight ${i + 1} is not a finite non-negative number`, expected: 'a finite number >= 0', found: String(weight) });
    }
    if (weight > 0) positive++;
  }
  if (positive === 0) {
    throw new CandelaError({ code: 'math.zero_weight', path: label, message: `every weight of ${label} is zero`, fix: 'pass weights with at least one positive value' });
  }
}
