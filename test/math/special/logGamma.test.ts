import { describe, expect, it } from 'vitest';
import { logGamma } from '../../../src/math/index.js';

describe('logGamma', () => {
  it('matches Gamma(x) of Abramowitz & Stegun (1964) Table 6.1 and mpmath 1.3.0 (30 digits) to 1e-14', () => {
    // [x, ln Gamma(x)] from mpmath.loggamma. A&S Table 6.1 tabulates Gamma on 1 <= x <= 2; its entries
    // Gamma(1.25) = 0.9064024771, Gamma(1.5) = 0.8862269255, Gamma(1.75) = 0.9190625268 (from memory) agree with mpmath.
    const reference: Array<[number, number]> = [
      [1e-8, 18.420680738180208905],
      [0.1, 2.2527126517342059599],
      [0.5, 0.57236494292470008707],
      [1.25, -0.098271836421813161464],
      [1.5, -0.12078223763524522235],
      [1.75, -0.084401121020485555958],
      [3.7, 1.4280723266653879219],
      [14.99, 25.164481163825505879],
      [15, 25.1912211827386815],
      [30.5, 72.953471184169408324],
      [1000, 5905.2204232091812118],
      [1e6, 12815504.56914761166],
    ];
    for (const [x, expected] of reference) expect(Math.abs(logGamma(x) - expected), `x = ${x}`).toBeLessThan(1e-14 * Math.max(1, Math.abs(expected)));
    expect(Math.exp(logGamma(1.25))).toBeCloseTo(0.9064024771, 10);
  });

  it('gives ln (n-1)! at the integers (Gamma(n) = (n-1)!, A&S eq. 6.1.6)', () => {
    let factorial = 1;
    for (let n = 1; n <= 20; n++) {
      expect(Math.abs(logGamma(n) - Math.log(factorial))).toBeLessThan(4e-15 * Math.max(1, Math.log(factorial)));
      factorial *= n;
    }
  });

  it('throws math.invalid_argument for x <= 0', () => {
    expect(() => logGamma(0)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'math.invalid_argument' })] }));
  });
});
