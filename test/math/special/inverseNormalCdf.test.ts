import { describe, expect, it } from 'vitest';
import { inverseNormalCdf } from '../../../src/math/index.js';

// p -> qnorm(p) printed with 17 significant digits by R 4.2.2 (Wichura's AS241, the same
// algorithm) and by scipy 1.17.1 scipy.special.ndtri (Cephes, an independent algorithm).
const REFERENCE: Array<[number, number, number]> = [
  // [p, R qnorm, scipy ndtri]
  [1e-300, -37.047096299361201, -37.047096299361201],
  [1e-20, -9.2623400897984052, -9.2623400897984087],
  [1e-10, -6.3613409024040557, -6.3613409024040557],
  [1e-5, -4.2648907939228256, -4.2648907939228247],
  [0.001, -3.0902323061678132, -3.0902323061678132],
  [0.05, -1.6448536269514726, -1.6448536269514729],
  [0.075, -1.4395314709384557, -1.4395314709384563],
  [0.0751, -1.4388253927525398, -1.4388253927525403],
  [0.3, -0.52440051270804067, -0.52440051270804089],
  [0.5, 0, 0],
  [0.6, 0.25334710313579978, 0.25334710313579972],
  [0.925, 1.4395314709384559, 1.4395314709384563],
  [0.975, 1.9599639845400536, 1.959963984540054],
  [1 - 1e-10, 6.3613408896974208, 6.3613408896974217],
];

describe('inverseNormalCdf', () => {
  it('equals R qnorm (same algorithm, AS241) to 1 ulp over all three regions', () => {
    for (const [probability, fromR] of REFERENCE) {
      const found = inverseNormalCdf(probability);
      expect(Math.abs(found - fromR)).toBeLessThanOrEqual(Math.abs(fromR) * 2.3e-16);
    }
  });

  it('agrees with scipy.special.ndtri (independent algorithm) to 1e-15 relative', () => {
    for (const [probability, , fromScipy] of REFERENCE) {
      expect(Math.abs(inverseNormalCdf(probability) - fromScipy)).toBeLessThanOrEqual(Math.abs(fromScipy) * 1e-15);
    }
  });

  it('is odd about p = 1/2: Phi^-1(1 - p) = -Phi^-1(p) (symmetry of the normal law)', () => {
    for (const probability of [0.01, 0.2, 0.4, 0.45]) {
      expect(inverseNormalCdf(1 - probability)).toBeCloseTo(-inverseNormalCdf(probability), 14);
    }
  });

  it('maps 0 and 1 to -Infinity and +Infinity', () => {
    expect(inverseNormalCdf(0)).toBe(-Infinity);
    expect(inverseNormalCdf(1)).toBe(Infinity);
  });

  it('throws math.probability_range outside [0, 1] and for NaN', () => {
    for (const bad of [-0.1, 1.5, Number.NaN]) {
      expect(() => inverseNormalCdf(bad)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'math.probability_range' })] }));
    }
  });
});
