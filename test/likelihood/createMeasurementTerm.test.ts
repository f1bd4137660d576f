import { describe, expect, it } from 'vitest';
import { createMeasurementTerm } from '../../src/likelihood/index.js';

describe('createMeasurementTerm', () => {
  const correlated = () => createMeasurementTerm({
    name: 'pair', requires: ['a', 'b'], observed: Float64Array.of(1, 2), covariance: Float64Array.of(4, 1, 1, 2),
    predict: (p, out) => {
      if (p.a < 0) return 'a must be >= 0';
      out[0] = p.a;
      out[1] = p.b;
      return null;
    },
  });

  it('gives chi-square r^T C^-1 r and the fully normalized Gaussian log density', () => {
    // Worked by hand (common practice): C = [[4, 1], [1, 2]], det 7, C^-1 = [[2, -1], [-1, 4]] / 7; r = (1, 1) -> chi^2 = 4/7.
    const term = correlated();
    expect(term.bestFitExtras?.({ a: 0, b: 1 }).chi_square).toBeCloseTo(4 / 7, 14);
    expect(term.logLikelihood({ a: 0, b: 1 })).toBeCloseTo(-0.5 * (4 / 7 + Math.log(7) + 2 * Math.log(2 * Math.PI)), 13);
    expect(term.bestFitExtras?.({ a: 1, b: 2 }).chi_square).toBe(0);
  });

  it('turns a prediction failure or a non-finite value into -Infinity with a reason, never NaN', () => {
    const term = correlated();
    expect(term.logLikelihood({ a: -1, b: 0 })).toBe(-Infinity);
    expect(term.rejectionReason({ a: -1, b: 0 })).toBe('a must be >= 0');
    expect(term.logLikelihood({ a: NaN, b: 0 })).toBe(-Infinity);
    expect(term.rejectionReason({ a: NaN, b: 0 })).toMatch(/not finite/);
  });
});
