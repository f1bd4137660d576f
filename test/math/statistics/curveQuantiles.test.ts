import { describe, expect, it } from 'vitest';
import { curveQuantiles } from '../../../src/math/index.js';

describe('curveQuantiles', () => {
  it('gives at each abscissa the type-7 quantile of the curves there, as R quantile() prints it', () => {
    // Abscissa 0 holds 1..10 in shuffled curve order; abscissa 1 holds ten times as much.
    // R 4.2.2: quantile(1:10, c(0.05, 0.95, 0.5)) = 1.45, 9.5499999999999989, 5.5
    const order = [7, 3, 10, 1, 5, 9, 2, 8, 4, 6];
    const curves = order.map((v) => Float64Array.of(v, 10 * v));
    const [low, high, median] = curveQuantiles(curves, 2, [0.05, 0.95, 0.5]);
    expect(low[0]).toBe(1.45);
    expect(high[0]).toBe(9.5499999999999989);
    expect(median).toEqual(Float64Array.of(5.5, 55));
    // R 4.2.2: quantile(10 * (1:10), 0.05) = 14.5
    expect(low[1]).toBeCloseTo(14.5, 12);
  });

  it('reads only the first `points` values of each curve and leaves NaN at the top of the order (Float64Array sort)', () => {
    const curves = [Float64Array.of(1, 5, 99), Float64Array.of(Number.NaN, 3, 99), Float64Array.of(2, 4, 99)];
    const [lowest, median] = curveQuantiles(curves, 2, [0, 0.5]);
    expect(lowest).toEqual(Float64Array.of(1, 3));
    expect(median[0]).toBe(2); // sorted column 1, 2, NaN: the middle order statistic
    expect(median[1]).toBe(4);
  });

  it('gives NaN everywhere when there are no curves', () => {
    const [median] = curveQuantiles([], 3, [0.5]);
    expect(Array.from(median).every(Number.isNaN)).toBe(true);
  });
});
