import { describe, expect, it } from 'vitest';
import { createCosmology } from '../../src/cosmology/index.js';
import type { Cosmology, CosmologyParameters } from '../../src/cosmology/index.js';
import { adaptiveGaussKronrod } from '../../src/math/index.js';

function build(p: CosmologyParameters, options = {}): Cosmology {
  const outcome = createCosmology(p, options);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

const REDSHIFTS = [0.001, 0.1, 0.5, 1, 2, 5, 10, 1089];
/** Same integrals through different law objects: only rounding differs. */
const SAME_MODEL_RELATIVE = 1e-13;

function expectSameCosmology(a: Cosmology, b: Cosmology): void {
  for (const z of REDSHIFTS) {
    expect(Math.abs(a.expansionRate(z) / b.expansionRate(z) - 1)).toBeLessThan(SAME_MODEL_RELATIVE);
    expect(Math.abs(a.transverseComovingDistanceMpc(z) / b.transverseComovingDistanceMpc(z) - 1)).toBeLessThan(SAME_MODEL_RELATIVE);
    expect(Math.abs(a.lookbackTimeGyr(z) / b.lookbackTimeGyr(z) - 1)).toBeLessThan(SAME_MODEL_RELATIVE);
    expect(Math.abs(a.ageGyr(z) / b.ageGyr(z) - 1)).toBeLessThan(1e-11);
  }
}

describe('identities between dark-energy laws (common practice: nested models)', () => {
  for (const shape of [{ flat: true }, { flat: false, omegaDarkEnergy: 0.8 }, { flat: false, omegaDarkEnergy: 0.5, cmbTemperatureK: 2.7255 }]) {
    const base = { omegaMatter: 0.3, h0KmPerSPerMpc: 70, ...shape };
    it(`w0 = -1, wa = 0 (CPL) and w = -1 (constant w) equal LambdaCDM (${JSON.stringify(shape)})`, () => {
      const lambda = build({ ...base, darkEnergy: 'lambda' }, { useClosedForms: false });
      expectSameCosmology(build({ ...base, darkEnergy: 'cpl', w0: -1, wa: 0 }), lambda);
      expectSameCosmology(build({ ...base, darkEnergy: 'constant_w', w0: -1 }), lambda);
    });
    it(`wa = 0 (CPL) equals constant w = -0.85 (${JSON.stringify(shape)})`, () => {
      expectSameCosmology(build({ ...base, darkEnergy: 'cpl', w0: -0.85, wa: 0 }), build({ ...base, darkEnergy: 'constant_w', w0: -0.85 }));
    });
  }
});

describe('transverseComovingDistancesHubbleUnits', () => {
  it('accepts its input array as output and allocates nothing for 2000 supernova-like redshifts', () => {
    const cosmology = build({ darkEnergy: 'cpl', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 0.65, w0: -0.9, wa: 0.2, h0KmPerSPerMpc: 70 }, { maxRedshift: 2.5 });
    const z = Float64Array.from({ length: 2000 }, (_, i) => 0.01 + (2.29 * i) / 1999);
    const expected = Float64Array.from(z, (value) => cosmology.transverseComovingDistanceMpc(value) / cosmology.hubbleDistanceMpc);
    cosmology.transverseComovingDistancesHubbleUnits(z, z);
    let worst = 0;
    z.forEach((value, i) => { worst = Math.max(worst, Math.abs(value / expected[i] - 1)); });
    // Cumulative sweep vs independent scalar integrals: rounding only (measured ~3e-16).
    expect(worst).toBeLessThan(1e-13);
  });

  it('refuses unsorted or out-of-range redshifts with a CandelaError naming the problem', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 }, { maxRedshift: 2 });
    const out = new Float64Array(3);
    expect(() => cosmology.transverseComovingDistancesHubbleUnits(Float64Array.of(0.1, 0.05, 0.3), out)).toThrow(/smaller than the one before/);
    expect(() => cosmology.transverseComovingDistancesHubbleUnits(Float64Array.of(0.1, 0.5, 3), out)).toThrow(/outside the range/);
    expect(() => cosmology.transverseComovingDistancesHubbleUnits(Float64Array.of(-0.1, 0.5, 1), out)).toThrow(/outside the range/);
    expect(() => cosmology.comovingDistanceMpc(Number.NaN)).toThrow(/outside the range/);
  });
});

describe('quadrature accuracy on hard models (self-convergence against adaptive Gauss-Kronrod at 1e-14)', () => {
  // Models chosen to stress the a-priori Gauss-Legendre plan: a nearly bouncing closed universe, strong CPL evolution,
  // phantom w, radiation. The independent reference is adaptive G7-K15 in z itself with a 1e-14 relative target.
  const HARD: CosmologyParameters[] = [
    { darkEnergy: 'lambda', flat: false, omegaMatter: 0.1, omegaDarkEnergy: 1.345, h0KmPerSPerMpc: 70 }, // min E^2 = 0.001 at z = 2 (bounce at 1.35)
    { darkEnergy: 'cpl', flat: true, omegaMatter: 0.2, w0: -0.4, wa: -3, h0KmPerSPerMpc: 70 },
    { darkEnergy: 'cpl', flat: true, omegaMatter: 0.3, w0: -1.5, wa: 1.2, h0KmPerSPerMpc: 70, cmbTemperatureK: 2.7255 },
    { darkEnergy: 'constant_w', flat: false, omegaMatter: 0.05, omegaDarkEnergy: 0.3, w0: -2, h0KmPerSPerMpc: 70 },
    { darkEnergy: 'lambda', flat: false, omegaMatter: 2, omegaDarkEnergy: 0.5, h0KmPerSPerMpc: 70 },
  ];
  it.each(HARD)('comoving distance and lookback time agree to 1e-12 for %o', (p) => {
    const cosmology = build(p, { maxRedshift: 20 });
    const inverseE = (z: number): number => 1 / cosmology.expansionRate(z);
    for (const z of [0.02, 0.4, 1.3, 3, 20]) {
      const comoving = adaptiveGaussKronrod(inverseE, 0, z, { relativeTolerance: 1e-14 }).value;
      const lookback = adaptiveGaussKronrod((y) => inverseE(y) / (1 + y), 0, z, { relativeTolerance: 1e-14 }).value;
      expect(Math.abs(cosmology.comovingDistanceMpc(z) / (cosmology.hubbleDistanceMpc * comoving) - 1), `D_C z=${z}`).toBeLessThan(1e-12);
      expect(Math.abs(cosmology.lookbackTimeGyr(z) / (cosmology.hubbleTimeGyr * lookback) - 1), `lookback z=${z}`).toBeLessThan(1e-12);
    }
  });
});

describe('transverse comoving distance across Omega_k = 0', () => {
  it('is continuous through flatness (series branch for tiny |Omega_k|)', () => {
    const at = (omegaDarkEnergy: number): number =>
      build({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy, h0KmPerSPerMpc: 70 }).transverseComovingDistanceMpc(1.5);
    const flat = at(0.7);
    // D_M changes smoothly: d D_M / d Omega_k is finite, so a 1e-12 step in Omega_DE moves D_M by ~1e-12 relative.
    for (const delta of [1e-12, -1e-12, 1e-8, -1e-8]) expect(Math.abs(at(0.7 + delta) / flat - 1)).toBeLessThan(Math.abs(delta) * 10);
  });
});
