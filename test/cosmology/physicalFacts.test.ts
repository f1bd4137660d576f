import { describe, expect, it } from 'vitest';
import { createCosmology, derivedCosmologyQuantities, radiationDensity } from '../../src/cosmology/index.js';
import type { Cosmology, CosmologyParameters } from '../../src/cosmology/index.js';

function build(p: CosmologyParameters): Cosmology {
  const outcome = createCosmology(p);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

describe('facts of the trade', () => {
  it('has a Hubble time of about 13.6 Gyr for H0 = 72 km/s/Mpc (common practice)', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 72 });
    // 977.8 / 72 Gyr = 13.58 Gyr (1/H0 = 977.8 Gyr / (H0 in km/s/Mpc), common practice).
    expect(cosmology.hubbleTimeGyr).toBeCloseTo(13.58, 2);
    expect(cosmology.hubbleDistanceMpc).toBeCloseTo(299792.458 / 72, 9);
  });

  it('gives a flat Omega_m ~ 0.3 universe an age close to 0.96/H0 (common practice)', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 72 });
    // Exact: H0 t0 = 2/(3 sqrt(0.7)) asinh(sqrt(0.7/0.3)) = 0.9641 (flat LambdaCDM age formula).
    expect(cosmology.ageTodayGyr / cosmology.hubbleTimeGyr).toBeCloseTo(0.9641, 3);
  });

  it('has q0 = Omega_m/2 - Omega_L and the onset of acceleration at (2 Omega_L/Omega_m)^(1/3) - 1 for flat LambdaCDM', () => {
    // From q(z) = (Omega_m (1+z)^3 / 2 - Omega_L) / E^2 (deceleration parameter of matter + Lambda; common practice).
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 });
    expect(cosmology.q0).toBeCloseTo(0.15 - 0.7, 14);
    expect(cosmology.accelerationRedshift()).toBeCloseTo(Math.cbrt((2 * 0.7) / 0.3) - 1, 12);
    expect(derivedCosmologyQuantities(cosmology)).toMatchObject({ omegaCurvature: 0, omegaDarkEnergy: 0.7, q0: cosmology.q0 });
  });

  it('has no onset of acceleration in a decelerating universe (Einstein-de Sitter: q = 1/2)', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 1, omegaDarkEnergy: 0, h0KmPerSPerMpc: 70 });
    expect(cosmology.q0).toBe(0.5);
    expect(cosmology.accelerationRedshift()).toBeNull();
  });

  it('computes Omega_gamma = 5.0469e-5 and Omega_nu = 3.4913e-5 for T_CMB = 2.7255 K, N_eff = 3.046, H0 = 70', () => {
    // Source: ../shared/reference/distances.csv header (astropy 5.2.1): Ogamma0 = 5.0468884259471206e-05, Onu0 = 3.491280402313973e-05.
    // candela's rounded CODATA sigma_SB gives 3e-11 relative less (see radiationDensity).
    const radiation = radiationDensity(2.7255, 70, 3.046);
    expect(Math.abs(radiation.photons / 5.0468884259471206e-5 - 1)).toBeLessThan(1e-10);
    expect(Math.abs(radiation.neutrinos / 3.491280402313973e-5 - 1)).toBeLessThan(1e-10);
    expect(radiationDensity(0, 70, 3.046).total).toBe(0);
  });
});

describe('unphysical parameter sets', () => {
  it('reports a bouncing closed universe (Omega_m = 0.1, Omega_DE = 2.5) with the redshift of the bounce', () => {
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.1, omegaDarkEnergy: 2.5, h0KmPerSPerMpc: 70 });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    // E^2 = 0.1 u^3 - 1.6 u^2 + 2.5 vanishes first at u = 1.3086... (root of the cubic, checked by substitution below).
    const z = Number(/at z = ([0-9.]+)/.exec(outcome.reason)?.[1]);
    const u = 1 + z;
    expect(Math.abs(0.1 * u ** 3 - 1.6 * u ** 2 + 2.5)).toBeLessThan(1e-3);
    expect(outcome.reason).toMatch(/no Big Bang.*Omega_m = 0\.1, Omega_DE = 2\.5/);
  });

  it('reports a bounce only where it is asked to look (maxRedshift)', () => {
    const p: CosmologyParameters = { darkEnergy: 'lambda', flat: false, omegaMatter: 0.1, omegaDarkEnergy: 2.5, h0KmPerSPerMpc: 70 };
    const nearby = createCosmology(p, { maxRedshift: 0.2 });
    expect(nearby.ok).toBe(true);
    if (!nearby.ok) return;
    expect(Number.isFinite(nearby.cosmology.distanceModulusMag(0.15))).toBe(true);
    expect(nearby.cosmology.hasBigBang).toBe(false);
    expect(nearby.cosmology.ageGyr(0.1)).toBe(Infinity);
    expect(() => nearby.cosmology.comovingDistanceMpc(0.5)).toThrow(/larger maxRedshift/);
  });

  it.each([
    [{ omegaMatter: -0.1 }, /Omega_m = -0.1 is negative/],
    [{ h0KmPerSPerMpc: 0 }, /H0 = 0/],
    [{ omegaMatter: Number.NaN }, /Omega_m = NaN is not a finite number/],
    [{ flat: false }, /Omega_DE is required/],
    [{ w0: -0.9 }, /lambda law has w0 = -1/],
    [{ darkEnergy: 'constant_w', wa: 0.2 }, /constant_w law has wa = 0/],
    [{ cmbTemperatureK: -1 }, /T_CMB = -1 K/],
  ] as [Partial<CosmologyParameters>, RegExp][])('refuses %o with a reason', (change, reason) => {
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70, ...change });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.reason).toMatch(reason);
  });

  it('detects a bounce that only the high-redshift limit shows (closed, no matter, Lambda)', () => {
    // E^2 = Omega_k u^2 + Omega_L with Omega_k = -0.2: negative for u > sqrt(6); the grid finds it at z = 1.449.
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: false, omegaMatter: 0, omegaDarkEnergy: 1.2, h0KmPerSPerMpc: 70 });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(Number(/at z = ([0-9.]+)/.exec(outcome.reason)?.[1])).toBeCloseTo(Math.sqrt(6) - 1, 3);
  });

  it('gives de Sitter space (Omega_L = 1, nothing else) an infinite age but finite distances, never NaN', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 0, omegaDarkEnergy: 1, h0KmPerSPerMpc: 70 });
    expect(cosmology.hasBigBang).toBe(false);
    expect(cosmology.ageTodayGyr).toBe(Infinity);
    // de Sitter: D_C = D_H z exactly (E = 1).
    expect(cosmology.comovingDistanceMpc(2) / (2 * cosmology.hubbleDistanceMpc)).toBeCloseTo(1, 13);
    expect(cosmology.lookbackTimeGyr(2) / (cosmology.hubbleTimeGyr * Math.log(3))).toBeCloseTo(1, 13);
  });

  it('never returns NaN for the distance modulus of a closed universe beyond its antipode', () => {
    // Omega_m = 0.3, Omega_L = 1.7 (Omega_k = -1, close to loitering): sqrt(|Omega_k|) chi passes pi near z = 1.38
    // (midpoint-rule estimate made for this test), so D_M = sin(...) turns negative there.
    const cosmology = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 1.7, h0KmPerSPerMpc: 70 });
    const z = Float64Array.from({ length: 60 }, (_, i) => Math.expm1(i * 0.12));
    const mu = cosmology.distanceModuliMag(z);
    expect(mu.every((value) => !Number.isNaN(value))).toBe(true);
    expect(Array.from(z).some((value) => cosmology.transverseComovingDistanceMpc(value) < 0)).toBe(true);
  });
});
