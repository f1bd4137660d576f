import { CandelaError } from '../errors.js';

/**
 * The Hessian of a scalar function by central finite differences:
 *
 *   H_ii = [f(x + h_i) - 2 f(x) + f(x - h_i)] / h_i^2
 *   H_ij = [f(x + h_i + h_j) - f(x + h_i - h_j) - f(x - h_i + h_j) + f(x - h_i - h_j)] / (4 h_i h_j)
 *
 * (Abramowitz & Stegun 1964, section 25.3; formula numbers 25.3.23 and
 * 25.3.26 from memory), both with error
 * O(h^2) times fourth derivatives; exact for a quadratic up to rounding.
 * Values are differenced against f(x) to keep large constants out of the
 * differences. Cost: 1 + 2P + 2P(P - 1) evaluations for P parameters.
 * @param f the function (e.g. minus a log-likelihood); must be finite near `center`.
 * @param center the point x.
 * @param steps one step h_i > 0 per parameter, in the parameter's units.
 * @param names parameter names, for messages.
 * @param reason why f is not finite at a point (for messages), or null.
 * @returns the P x P Hessian, row major.
 * @throws CandelaError `forecast.not_finite` when f is not finite at one of the points, naming the parameters and the reason.
 * @example centralDifferenceHessian((x) => x[0] * x[0] + 3 * x[0] * x[1], Float64Array.of(1, 2), Float64Array.of(0.1, 0.1), ['a', 'b'], () => null)
 *   // [2, 3, 3, 0]
 */
export function centralDifferenceHessian(
  f: (theta: Float64Array) => number, center: Float64Array, steps: Float64Array, names: readonly string[],
  reason: (theta: Float64Array) => string | null,
): Float64Array {
  const size = center.length;
  const point = Float64Array.from(center);
  const at = (moved: string): number => {
    const value = f(point);
    if (!Number.isFinite(value)) {
      throw new CandelaError({
        code: 'forecast.not_finite', path: moved,
        message: `the log-likelihood is not finite one finite-difference step away from the truth (${moved}): ${reason(point) ?? 'non-finite value'}`,
        fix: 'move the truth away from the edge of the physical region, or fix the parameter',
      });
    }
    return value;
  };
  const centerValue = at('the truth itself');
  const hessian = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    point[i] = center[i] + steps[i];
    const plus = at(names[i]) - centerValue;
    point[i] = center[i] - steps[i];
    const minus = at(names[i]) - centerValue;
    point[i] = center[i];
    hessian[i * size + i] = (plus + minus) / (steps[i] * steps[i]);
    for (let j = 0; j < i; j++) {
      let sum = 0;
      for (const [si, sj] of [[1, 1], [1, -1], [-1, 1], [-1, -1]] as const) {
        point[i] = center[i] + si * steps[i];
        point[j] = center[j] + sj * steps[j];
        sum += si * sj * (at(`${names[i]} and ${names[j]}`) - centerValue);
      }
      point[i] = center[i];
      point[j] = center[j];
      const value = sum / (4 * steps[i] * steps[j]);
      hessian[i * size + j] = value;
      hessian[j * size + i] = value;
    }
  }
  return hessian;
}
