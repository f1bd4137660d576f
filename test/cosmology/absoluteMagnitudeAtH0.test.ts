import { describe, expect, it } from 'vitest';
import { absoluteMagnitudeAtH0, createCosmology } from '../../src/cosmology/index.js';
import type { Cosmology } from '../../src/cosmology/index.js';

function cosmology(h0KmPerSPerMpc: number): Cosmology {
  const outcome = createCosmology({ darkEnergy: 'cpl', flat: true, omegaMatter: 0.3, w0: -0.9, wa: 0.2, h0KmPerSPerMpc });
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

describe('absoluteMagnitudeAtH0', () => {
  it('keeps every magnitude mu(z; H0) + M when H0 changes (identity: D_L scales as 1/H0 at fixed densities)', () => {
    const [from, to] = [cosmology(70), cosmology(73.04)];
    const shifted = absoluteMagnitudeAtH0(-19.25, 70, 73.04);
    for (const z of [0.01, 0.3, 1.5]) {
      // 1e-12 mag: rounding of two distance moduli near 40 mag (common practice).
      expect(Math.abs(to.distanceModulusMag(z) + shifted - (from.distanceModulusMag(z) - 19.25))).toBeLessThan(1e-12);
    }
  });

  it('returns M unchanged when H0 does not change', () => {
    expect(absoluteMagnitudeAtH0(-19.3, 70, 70)).toBe(-19.3);
  });
});
