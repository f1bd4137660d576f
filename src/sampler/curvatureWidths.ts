import { evaluateBatchChecked } from './evaluateBatchChecked.js';
import type { BatchEvaluator } from './logProbabilityModel.js';

/**
 * Second pass of the curvature estimate: the finite-difference step is this
 * fraction of the first pass's width, small enough for the quadratic
 * approximation and large enough that rounding in the log posterior
 * (relative 1e-16 of values up to ~1e4) stays far below the curvature signal.
 * Common practice.
 */
export const CURVATURE_REFINED_STEP_FRACTION = 0.1;

/**
 * Per-parameter widths of the posterior at its mode from the diagonal of the
 * Hessian of the log posterior, by central second differences
 * (Press et al. 2007, Numerical Recipes 3rd ed., section 5.7):
 * H_ii = (L(x + h e_i) - 2 L(x) + L(x - h e_i)) / h^2 and width_i = 1 / sqrt(-H_ii),
 * the conditional standard deviation of parameter i for a Gaussian posterior.
 *
 * Two passes: first with `probeSteps`, then with steps of
 * CURVATURE_REFINED_STEP_FRACTION x the first widths. A parameter whose
 * curvature is not negative and finite in either pass (mode on a prior edge,
 * flat direction) gets `fallbackWidths[i]`; every width is capped at `maxWidths[i]`.
 * All in parameter units. Cost: 4 x dimension model evaluations in two
 * batches. Throws CandelaError `sampler.invalid_log_probability` for NaN values.
 * @example await curvatureWidths(evaluator, mode, modeLogProb, probe, fallback, cap) // Float64Array of widths
 */
export async function curvatureWidths(
  evaluator: BatchEvaluator,
  mode: Float64Array,
  modeLogProb: number,
  probeSteps: ArrayLike<number>,
  fallbackWidths: ArrayLike<number>,
  maxWidths: ArrayLike<number>,
): Promise<Float64Array> {
  const dimension = mode.length;
  const pass = async (steps: ArrayLike<number>): Promise<Float64Array> => {
    const points = new Float64Array(2 * dimension * dimension);
    for (let i = 0; i < dimension; i++) {
      points.set(mode, 2 * i * dimension);
      points.set(mode, (2 * i + 1) * dimension);
      points[2 * i * dimension + i] += steps[i];
      points[(2 * i + 1) * dimension + i] -= steps[i];
    }
    const { logProb } = await evaluateBatchChecked(evaluator, points, 2 * dimension);
    return Float64Array.from({ length: dimension }, (_, i) => {
      const curvature = -(logProb[2 * i] - 2 * modeLogProb + logProb[2 * i + 1]) / (steps[i] * steps[i]);
      return curvature > 0 && curvature < Infinity ? 1 / Math.sqrt(curvature) : NaN;
    });
  };
  const first = await pass(probeSteps);
  const refinedSteps = first.map((width, i) => (Number.isFinite(width) ? CURVATURE_REFINED_STEP_FRACTION * Math.min(width, maxWidths[i]) : probeSteps[i]));
  const second = await pass(refinedSteps);
  return second.map((width, i) => {
    const chosen = Number.isFinite(width) ? width : Number.isFinite(first[i]) ? first[i] : fallbackWidths[i];
    return Math.min(chosen, maxWidths[i]);
  });
}
