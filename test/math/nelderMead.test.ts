import { describe, expect, it } from 'vitest';
import { minimizeNelderMead, nelderMeadSearch } from '../../src/math/index.js';

// Rosenbrock (1960, Computer Journal 3, 175) valley f(x, y) = 100 (y - x^2)^2 + (1 - x)^2,
// minimum 0 at (1, 1), classic start (-1.2, 1): the standard hard case for direct search.
const rosenbrock = (x: Float64Array): number => 100 * (x[1] - x[0] * x[0]) ** 2 + (1 - x[0]) ** 2;

describe('minimizeNelderMead', () => {
  it('finds the minimum (1, 1) of the Rosenbrock valley from (-1.2, 1)', () => {
    const result = minimizeNelderMead(rosenbrock, [-1.2, 1], { initialSteps: [0.1, 0.1], valueTolerance: 1e-14, positionTolerance: 1e-8 });
    expect(result.converged).toBe(true);
    // Tolerances: at convergence the simplex spans 1e-9 and values agree to 1e-14, so |x - 1| ~ sqrt(1e-14) x valley width.
    expect(result.point[0]).toBeCloseTo(1, 5);
    expect(result.point[1]).toBeCloseTo(1, 5);
    expect(result.value).toBeLessThan(1e-10);
    expect(result.values[0]).toBe(result.value);
    expect(Array.from(result.values)).toEqual(Array.from(result.values).sort((a, b) => a - b));
  });

  it('minimizes a 5-D ill-conditioned quadratic to its known minimizer (analytic: the centre)', () => {
    // f(x) = sum_i 10^i (x_i - c_i)^2 has its minimum 0 at c (condition number 1e4).
    const centre = [1, -2, 0.5, 3, -1];
    const quadratic = (x: Float64Array) => centre.reduce((sum, c, i) => sum + 10 ** i * (x[i] - c) ** 2, 0);
    const result = minimizeNelderMead(quadratic, [0, 0, 0, 0, 0], { initialSteps: [1, 1, 1, 1, 1], valueTolerance: 1e-16, positionTolerance: 1e-9 });
    expect(result.converged).toBe(true);
    // Within sqrt(1e-16 / 10^i) ~ 1e-8 in the stiffest coordinate; 1e-5 allowed for the flattest.
    result.point.forEach((value, i) => expect(Math.abs(value - centre[i])).toBeLessThan(1e-5));
  });

  it('treats NaN as +Infinity and walks back into the region where the objective is defined', () => {
    const bounded = (x: Float64Array) => (x[0] < 0 ? NaN : (x[0] - 0.2) ** 2 + x[1] ** 2);
    const result = minimizeNelderMead(bounded, [3, 1], { initialSteps: [1, 1] });
    expect(result.point[0]).toBeCloseTo(0.2, 3);
    expect(result.point[1]).toBeCloseTo(0, 3);
  });

  it('stops at the evaluation budget and says it did not converge', () => {
    const result = minimizeNelderMead(rosenbrock, [-1.2, 1], { initialSteps: [0.1, 0.1], maxEvaluations: 20 });
    expect(result.converged).toBe(false);
    expect(result.evaluations).toBeGreaterThanOrEqual(20);
    expect(result.evaluations).toBeLessThanOrEqual(23); // the budget is checked before an iteration, which adds at most 2 + n evaluations
  });

  it('throws RangeError for a non-positive step', () => {
    expect(() => minimizeNelderMead(rosenbrock, [0, 0], { initialSteps: [0.1, 0] })).toThrow(RangeError);
  });
});

describe('nelderMeadSearch', () => {
  it('asks for n + 1 points first, then gives the same result as the synchronous driver', () => {
    const search = nelderMeadSearch([-1.2, 1], { initialSteps: [0.1, 0.1] });
    let request = search.next();
    expect(request.done).toBe(false);
    expect(Array.from(request.value as Float64Array)).toEqual([-1.2, 1, -1.2 + 0.1, 1, -1.2, 1 + 0.1]); // start, then one step per axis
    while (!request.done) {
      const points = request.value;
      request = search.next(Float64Array.from({ length: points.length / 2 }, (_, k) => rosenbrock(points.subarray(2 * k, 2 * k + 2))));
    }
    const direct = minimizeNelderMead(rosenbrock, [-1.2, 1], { initialSteps: [0.1, 0.1] });
    expect(Array.from(request.value.point)).toEqual(Array.from(direct.point));
    expect(request.value.evaluations).toBe(direct.evaluations);
  });
});
