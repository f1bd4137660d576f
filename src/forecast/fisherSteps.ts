import { CandelaError } from '../errors.js';
import { centralDifferenceHessian } from './forecastHessian.js';

/**
 * Pilot step of the finite differences, relative to max(1, |value|): only
 * sets the scale of the final step (F_ii to ~1e-8).
 */
export const PILOT_RELATIVE_STEP = 1e-4;

/**
 * The step rule of the Fisher forecast: a pilot pass of central second
 * differences on the diagonal, h = PILOT_RELATIVE_STEP max(1, |theta_i|),
 * gives the conditional curvature F_ii; the final step of parameter i is
 * stepFraction / sqrt(F_ii), that fraction of its conditional error.
 * Cost: 3 evaluations of f per parameter.
 * @param f -ln L up to a constant (chi^2 / 2).
 * @param center the evaluation point, in the parameters' units.
 * @param names parameter names, in the order of `center` (for messages).
 * @param reason why a point is outside the model, or null (stops the differences there).
 * @param stepFraction the fraction of each conditional error.
 * @returns the steps, in the parameters' units.
 * @throws CandelaError `forecast.unconstrained` for a parameter whose conditional curvature is not positive.
 * @example chooseFisherSteps((t) => 2 * t[0] ** 2, Float64Array.of(0), ['x'], () => null, 1e-3)[0] // 5e-4 (F = 4)
 */
export function chooseFisherSteps(
  f: (theta: Float64Array) => number, center: Float64Array, names: readonly string[], reason: (theta: Float64Array) => string | null,
  stepFraction: number,
): Float64Array {
  const pilot = Float64Array.from(center, (value) => PILOT_RELATIVE_STEP * Math.max(1, Math.abs(value)));
  const steps = new Float64Array(center.length);
  for (let i = 0; i < center.length; i++) {
    const curvature = centralDifferenceHessian((x) => f(withOne(center, i, x[0])), Float64Array.of(center[i]), Float64Array.of(pilot[i]), [names[i]], (x) => reason(withOne(center, i, x[0])))[0];
    if (!(curvature > 0)) {
      throw new CandelaError({
        code: 'forecast.unconstrained', path: names[i],
        message: `the survey carries no information on ${names[i]} (curvature of ln L ${curvature.toPrecision(3)} at the truth)`,
        fix: `fix ${names[i]} or give it a Gaussian prior in the fit configuration`,
      });
    }
    steps[i] = stepFraction / Math.sqrt(curvature);
  }
  return steps;
}

function withOne(center: Float64Array, index: number, value: number): Float64Array {
  const copy = Float64Array.from(center);
  copy[index] = value;
  return copy;
}

