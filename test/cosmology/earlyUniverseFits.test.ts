import { describe, expect, it } from 'vitest';
import { decouplingRedshift, dragRedshift, dragSoundHorizonFitMpc, physicalRadiationDensity, radiationDensity, CMB_TEMPERATURE_K } from '../../src/cosmology/index.js';
import { relativeDifference } from './referenceDistances.js';

// Planck 2018 VI (Planck Collaboration 2020, A&A 641, A6), Table 2, TT,TE,EE+lowE+lensing column, all from memory:
// omega_b = 0.02237, omega_c = 0.1200, omega_m = 0.1430 (with one 0.06 eV neutrino), z* = 1089.92 +- 0.25,
// z_drag = 1059.94 +- 0.30, r_drag = 147.09 +- 0.26 Mpc.
const PLANCK = { omegaBaryonH2: 0.02237, omegaColdH2: 0.1200, omegaMatterH2: 0.1430, zStar: 1089.92, zDrag: 1059.94, rDragMpc: 147.09 };
/** omega_nu h^2 = sum m_nu / 93.14 eV (common practice), one 0.06 eV species. */
const PLANCK_NEUTRINO_H2 = 0.06 / 93.14;
// WMAP 7-year (Komatsu et al. 2011, ApJS 192, 18), Table 1, WMAP+BAO+H0 means, from memory: omega_b = 0.02255,
// omega_c = 0.1126, z* = 1090.79 (Hu & Sugiyama fit), z_d = 1020.3 (Eisenstein & Hu fit). WMAP evaluates the same
// fitting formulas, so only the difference between the mean of a function and the function of the means remains.
const WMAP7 = { omegaBaryonH2: 0.02255, omegaMatterH2: 0.02255 + 0.1126, zStar: 1090.79, zDrag: 1020.3 };

describe('physicalRadiationDensity', () => {
  it('gives omega_gamma h^2 and omega_nu h^2 of astropy 5.2.1 (../shared/reference/distances.csv header: Ogamma0 = 5.0468884259471206e-05, Onu0 = 3.491280402313973e-05 at H0 = 70)', () => {
    const radiation = physicalRadiationDensity(CMB_TEMPERATURE_K, 3.046);
    // candela's rounded CODATA sigma_SB gives 3e-11 relative less (see radiationDensity).
    expect(relativeDifference(radiation.photons, 5.0468884259471206e-5 * 0.49)).toBeLessThan(1e-10);
    expect(relativeDifference(radiation.neutrinos, 3.491280402313973e-5 * 0.49)).toBeLessThan(1e-10);
    expect(radiation.total).toBe(radiation.photons + radiation.neutrinos);
  });

  it('is Omega_r h^2 of the distance engine at any H0, and scales as T^4 (2.47e-5 (T/2.7255)^4, common practice)', () => {
    const h = 0.6736;
    const engine = radiationDensity(CMB_TEMPERATURE_K, 100 * h, 3.046);
    expect(relativeDifference(engine.total * h * h, physicalRadiationDensity(CMB_TEMPERATURE_K, 3.046).total)).toBeLessThan(1e-14);
    expect(relativeDifference(physicalRadiationDensity(2 * CMB_TEMPERATURE_K, 0).photons, 16 * physicalRadiationDensity(CMB_TEMPERATURE_K, 0).photons)).toBeLessThan(1e-14);
    expect(physicalRadiationDensity(CMB_TEMPERATURE_K, 3.046).photons).toBeCloseTo(2.47e-5, 7);
    expect(CMB_TEMPERATURE_K).toBe(2.7255); // Fixsen (2009), ApJ 707, 916.
  });
});

describe('decouplingRedshift (Hu & Sugiyama 1996, eq. E1)', () => {
  it('is within 3e-3 of the Planck 2018 z* = 1089.92 (from memory; the fit is good to ~1%, measured 1.8e-3)', () => {
    expect(relativeDifference(decouplingRedshift(PLANCK.omegaBaryonH2, PLANCK.omegaMatterH2), PLANCK.zStar)).toBeLessThan(3e-3);
  });

  it('matches the WMAP 7-year z* = 1090.79 computed with the same fit to 5e-4 (from memory; measured 1.6e-4)', () => {
    expect(relativeDifference(decouplingRedshift(WMAP7.omegaBaryonH2, WMAP7.omegaMatterH2), WMAP7.zStar)).toBeLessThan(5e-4);
  });

  it('rises with the matter density and rejects unusable densities', () => {
    expect(decouplingRedshift(0.0224, 0.16)).toBeGreaterThan(decouplingRedshift(0.0224, 0.12));
    expect(() => decouplingRedshift(0, 0.14)).toThrow(/omegaBaryonH2 = 0/);
    expect(() => decouplingRedshift(0.03, 0.02)).toThrow(/omegaMatterH2 = 0.02/);
    expect(() => decouplingRedshift(0.022, Number.NaN)).toThrow(/omegaMatterH2 = NaN/);
  });
});

describe('dragRedshift (Eisenstein & Hu 1998, eq. 4)', () => {
  it('matches the WMAP 7-year z_d = 1020.3 computed with the same fit to 5e-4 (from memory; measured 1.1e-4)', () => {
    expect(relativeDifference(dragRedshift(WMAP7.omegaBaryonH2, WMAP7.omegaMatterH2), WMAP7.zDrag)).toBeLessThan(5e-4);
  });

  it('lies 3-4.5% below the Planck 2018 z_drag = 1059.94 of a Boltzmann code (from memory; the known offset of this fit, measured 3.7%)', () => {
    const offset = 1 - dragRedshift(PLANCK.omegaBaryonH2, PLANCK.omegaMatterH2) / PLANCK.zDrag;
    expect(offset).toBeGreaterThan(0.03);
    expect(offset).toBeLessThan(0.045);
  });

  it('rejects unusable densities', () => {
    expect(() => dragRedshift(-0.02, 0.14)).toThrow(/omegaBaryonH2 = -0.02/);
    expect(() => dragRedshift(0.02, Number.POSITIVE_INFINITY)).toThrow(/omegaMatterH2 = Infinity/);
  });
});

describe('dragSoundHorizonFitMpc (Aubourg et al. 2015, eq. 16)', () => {
  it('is within 1e-3 of the Planck 2018 r_drag = 147.09 Mpc (from memory; measured 1.8e-4)', () => {
    const rd = dragSoundHorizonFitMpc(PLANCK.omegaBaryonH2 + PLANCK.omegaColdH2, PLANCK.omegaBaryonH2, PLANCK_NEUTRINO_H2);
    expect(relativeDifference(rd, PLANCK.rDragMpc)).toBeLessThan(1e-3);
  });

  it('shrinks as omega_b, omega_cb or omega_nu grow, with the exponents of the fit', () => {
    const base = dragSoundHorizonFitMpc(0.14, 0.0224);
    expect(relativeDifference(dragSoundHorizonFitMpc(0.28, 0.0224) / base, Math.pow(2, -0.25351))).toBeLessThan(1e-14);
    expect(relativeDifference(dragSoundHorizonFitMpc(0.14, 0.0448) / base, Math.pow(2, -0.12807))).toBeLessThan(1e-14);
    expect(dragSoundHorizonFitMpc(0.14, 0.0224, 0.002)).toBeLessThan(base);
  });

  it('rejects unusable densities', () => {
    expect(() => dragSoundHorizonFitMpc(0.01, 0.0224)).toThrow(/omegaColdPlusBaryonH2 = 0.01/);
    expect(() => dragSoundHorizonFitMpc(0.14, 0.0224, -1e-3)).toThrow(/omegaNeutrinoH2 = -0.001/);
  });
});
