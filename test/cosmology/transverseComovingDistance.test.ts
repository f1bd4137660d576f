import { describe, expect, it } from 'vitest';
import { transverseComovingDistance } from '../../src/cosmology/index.js';

describe('transverseComovingDistance', () => {
  it('is sinh(sqrt(Ok) chi)/sqrt(Ok) for open, chi for flat, sin(sqrt(-Ok) chi)/sqrt(-Ok) for closed (Hogg 1999 eq. 16)', () => {
    expect(transverseComovingDistance(1, 0.25)).toBeCloseTo(2 * Math.sinh(0.5), 15);
    expect(transverseComovingDistance(1, -0.25)).toBeCloseTo(2 * Math.sin(0.5), 15);
    expect(transverseComovingDistance(0.7, 0)).toBe(0.7);
  });

  it('uses a series near flatness that agrees with sinh/sin to rounding and joins them smoothly', () => {
    // Just inside the series branch (|Ok chi^2| < 1e-2), compare with the closed functions (no cancellation there).
    for (const omegaCurvature of [9e-3, -9e-3, 1e-6, -1e-6]) {
      const root = Math.sqrt(Math.abs(omegaCurvature));
      const exact = omegaCurvature > 0 ? Math.sinh(root) / root : Math.sin(root) / root;
      expect(Math.abs(transverseComovingDistance(1, omegaCurvature) / exact - 1)).toBeLessThan(1e-15);
    }
    // Across the branch boundary the value is continuous to rounding.
    const below = transverseComovingDistance(1, 0.01 * (1 - 1e-12));
    const above = transverseComovingDistance(1, 0.01 * (1 + 1e-12));
    expect(Math.abs(above - below)).toBeLessThan(1e-14);
  });

  it('turns negative past the antipode of a closed universe (sqrt(-Ok) chi > pi) instead of failing', () => {
    expect(transverseComovingDistance(4, -1)).toBeCloseTo(Math.sin(4), 15);
    expect(transverseComovingDistance(4, -1)).toBeLessThan(0);
  });
});
