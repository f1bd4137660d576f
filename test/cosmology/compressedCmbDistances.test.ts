import { describe, expect, it } from 'vitest';
import { acousticScale, cmbShiftParameter, comovingSoundHorizonMpc, compressedCmbDistances, createCosmology, dragRedshift, radiationDensity, CMB_TEMPERATURE_K } from '../../src/cosmology/index.js';
import type { Cosmology, CosmologyParameters } from '../../src/cosmology/index.js';
import { loadReferenceRows, parametersForRow, relativeDifference } from './referenceDistances.js';

// Constants for the independent evaluation, written out here (CODATA 2018 and IAU 2015, as astropy 5.2.1 uses them).
const C_KM_PER_S = 299792.458;
const C_M_PER_S = 299792458;
const STEFAN_BOLTZMANN = 5.670374419e-8;
const NEWTON_G = 6.6743e-11;
const MPC_M = (648000 / Math.PI) * 149597870700 * 1e6;

/** The brief's bar for R and l_A against an independent numerical evaluation. */
const INDEPENDENT_RELATIVE = 1e-6;

function build(p: CosmologyParameters): Cosmology {
  const outcome = createCosmology(p);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.cosmology;
}

/** Plain adaptive Simpson quadrature with Richardson correction (Lyness 1969), written here for independence. */
function adaptiveSimpson(f: (x: number) => number, a: number, b: number, tolerance: number): number {
  const m = 0.5 * (a + b);
  const fa = f(a); const fm = f(m); const fb = f(b);
  const whole = ((b - a) / 6) * (fa + 4 * fm + fb);
  function step(lo: number, hi: number, flo: number, fmid: number, fhi: number, estimate: number, tol: number, depth: number): number {
    const mid = 0.5 * (lo + hi);
    const left = 0.5 * (lo + mid); const right = 0.5 * (mid + hi);
    const fl = f(left); const fr = f(right);
    const leftArea = ((mid - lo) / 6) * (flo + 4 * fl + fmid);
    const rightArea = ((hi - mid) / 6) * (fmid + 4 * fr + fhi);
    const delta = leftArea + rightArea - estimate;
    if (depth <= 0 || Math.abs(delta) <= 15 * tol) return leftArea + rightArea + delta / 15;
    return step(lo, mid, flo, fl, fmid, leftArea, tol / 2, depth - 1) + step(mid, hi, fmid, fr, fhi, rightArea, tol / 2, depth - 1);
  }
  return step(a, b, fa, fm, fb, whole, tolerance, 50);
}

interface Case { name: string; omegaMatter: number; omegaDarkEnergy: number; w0: number; wa: number; h0: number; neff: number; omegaBaryonH2: number; flat: boolean }

/**
 * R and l_A from the textbook definitions, without the code under test:
 * a^2 E(a) = sqrt(Omega_r + Omega_m a + Omega_k a^2 + Omega_DE a^(1 - 3(w0 + wa)) exp(-3 wa (1 - a))) (Friedmann equation, CPL law),
 * D_M from D_C by Hogg (1999) eq. 16, r_s = (c/H0) int_0^a* da / (a^2 E sqrt(3 (1 + R_b))), R_b = 3 omega_b a / (4 omega_gamma).
 */
function independent(c: Case, zStar: number): { shift: number; acoustic: number; soundHorizonMpc: number } {
  const h = c.h0 / 100;
  const hubblePerSecond = (c.h0 * 1000) / MPC_M;
  const criticalDensity = (3 * hubblePerSecond ** 2) / (8 * Math.PI * NEWTON_G);
  const omegaPhotons = (4 * STEFAN_BOLTZMANN * CMB_TEMPERATURE_K ** 4) / C_M_PER_S ** 3 / criticalDensity;
  const omegaRadiation = omegaPhotons * (1 + (7 / 8) * (4 / 11) ** (4 / 3) * c.neff);
  const omegaDarkEnergy = c.flat ? 1 - c.omegaMatter - omegaRadiation : c.omegaDarkEnergy;
  const omegaCurvature = 1 - c.omegaMatter - omegaDarkEnergy - omegaRadiation;
  const scaledRate = (a: number): number => Math.sqrt(omegaRadiation + c.omegaMatter * a + omegaCurvature * a * a +
    omegaDarkEnergy * a ** (1 - 3 * (c.w0 + c.wa)) * Math.exp(-3 * c.wa * (1 - a)));
  const aStar = 1 / (1 + zStar);
  const hubbleMpc = C_KM_PER_S / c.h0;
  const comoving = adaptiveSimpson((a) => 1 / scaledRate(a), aStar, 1, 1e-13);
  const k = Math.sqrt(Math.abs(omegaCurvature));
  const transverse = omegaCurvature > 0 ? Math.sinh(k * comoving) / k : omegaCurvature < 0 ? Math.sin(k * comoving) / k : comoving;
  const baryonToPhoton = (3 * c.omegaBaryonH2) / (4 * omegaPhotons * h * h);
  const sound = adaptiveSimpson((a) => 1 / (scaledRate(a) * Math.sqrt(3 * (1 + baryonToPhoton * a))), 0, aStar, 1e-15);
  return { shift: Math.sqrt(c.omegaMatter) * transverse, acoustic: (Math.PI * transverse) / sound, soundHorizonMpc: hubbleMpc * sound };
}

const CASES: Case[] = [
  { name: 'flat LambdaCDM, Planck-like', omegaMatter: 0.3153, omegaDarkEnergy: 0, w0: -1, wa: 0, h0: 67.36, neff: 3.046, omegaBaryonH2: 0.02237, flat: true },
  { name: 'closed wCDM, N_eff = 2.5', omegaMatter: 0.33, omegaDarkEnergy: 0.74, w0: -0.9, wa: 0, h0: 64, neff: 2.5, omegaBaryonH2: 0.0215, flat: false },
  { name: 'open w0waCDM, N_eff = 3.8', omegaMatter: 0.27, omegaDarkEnergy: 0.69, w0: -0.8, wa: -0.6, h0: 72, neff: 3.8, omegaBaryonH2: 0.0235, flat: false },
];

function cosmologyOf(c: Case): Cosmology {
  return build({ darkEnergy: c.wa !== 0 ? 'cpl' : c.w0 !== -1 ? 'constant_w' : 'lambda', flat: c.flat, omegaMatter: c.omegaMatter,
    omegaDarkEnergy: c.flat ? undefined : c.omegaDarkEnergy, w0: c.w0, wa: c.wa, h0KmPerSPerMpc: c.h0,
    cmbTemperatureK: CMB_TEMPERATURE_K, effectiveNeutrinoSpecies: c.neff });
}

describe('compressedCmbDistances', () => {
  it.each(CASES)('gives R and l_A of an independent adaptive-Simpson evaluation to 1e-6 for $name', (c) => {
    const cosmology = cosmologyOf(c);
    const result = compressedCmbDistances(cosmology, c.omegaBaryonH2);
    const expected = independent(c, result.decouplingRedshift);
    expect(relativeDifference(result.shiftParameter, expected.shift)).toBeLessThan(INDEPENDENT_RELATIVE);
    expect(relativeDifference(result.acousticScale, expected.acoustic)).toBeLessThan(INDEPENDENT_RELATIVE);
    expect(relativeDifference(result.soundHorizonMpc, expected.soundHorizonMpc)).toBeLessThan(INDEPENDENT_RELATIVE);
    // The separate functions agree with the combined one.
    expect(cmbShiftParameter(cosmology, result.decouplingRedshift)).toBe(result.shiftParameter);
    expect(relativeDifference(acousticScale(cosmology, c.omegaBaryonH2, result.decouplingRedshift), result.acousticScale)).toBeLessThan(1e-15);
  });

  it('reproduces the Planck 2018 best fit: r_s(z* = 1089.92) = 144.43 Mpc and 100 theta* = 1.04110 to 2e-3, R = 1.7502 +- 0.0046 of Chen, Huang & Wang (2019) within 1 sigma (all from memory)', () => {
    // Planck 2018 VI, Table 2 (TT,TE,EE+lowE+lensing): omega_b = 0.02237, H0 = 67.36, Omega_m = 0.3153, z* = 1089.92,
    // r* = 144.43 Mpc, 100 theta* = 1.04110 (from memory). candela's radiation has 3.046 massless neutrinos and counts
    // the 0.06 eV neutrino as matter at all times, and has no recombination physics: 2e-3 covers both (measured 1.1e-3, 7e-4).
    const cosmology = cosmologyOf(CASES[0]);
    const soundHorizonMpc = comovingSoundHorizonMpc(cosmology, 0.02237, 1089.92);
    expect(relativeDifference(soundHorizonMpc, 144.43)).toBeLessThan(2e-3);
    expect(relativeDifference(100 * soundHorizonMpc / cosmology.transverseComovingDistanceMpc(1089.92), 1.04110)).toBeLessThan(2e-3);
    expect(Math.abs(compressedCmbDistances(cosmology, 0.02237).shiftParameter - 1.7502)).toBeLessThan(0.0046);
  });

  it('gives the WMAP 7-year r_s(z_d) = 153.2 +- 1.7 Mpc at z_d of Eisenstein & Hu (1998) within 1% (Komatsu et al. 2011, Table 1, WMAP+BAO+H0 means, from memory)', () => {
    // omega_b = 0.02255, omega_c = 0.1126, H0 = 70.4, T_CMB = 2.725 K (WMAP's value), N_eff = 3.04 (from memory); measured 3.6e-3.
    const h = 0.704;
    const cosmology = build({ darkEnergy: 'lambda', flat: true, omegaMatter: (0.02255 + 0.1126) / h / h, h0KmPerSPerMpc: 70.4, cmbTemperatureK: 2.725, effectiveNeutrinoSpecies: 3.04 });
    const rd = comovingSoundHorizonMpc(cosmology, 0.02255, dragRedshift(0.02255, 0.02255 + 0.1126));
    expect(relativeDifference(rd, 153.2)).toBeLessThan(1e-2);
  });
});

describe('cmbShiftParameter', () => {
  const rows = loadReferenceRows().filter((row) => row.z === 1089 && row.Tcmb0 > 0 && row.Om0 > 0);
  it.each(rows.map((row) => [row.case, row] as const))('is sqrt(Omega_m) H0 D_M(1089) / c with D_M of astropy 5.2.1 for %s (../shared/reference/distances.csv)', (_name, row) => {
    const cosmology = build(parametersForRow(row));
    const expected = Math.sqrt(row.Om0) * row.H0 * row.transverse_comoving_distance_Mpc / C_KM_PER_S;
    expect(relativeDifference(cmbShiftParameter(cosmology, 1089), expected)).toBeLessThan(1e-10);
  });

  it('is 2 (1 - (1+z)^-1/2) in Einstein-de Sitter without radiation (closed form, Hogg 1999)', () => {
    const cosmology = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 1, omegaDarkEnergy: 0, h0KmPerSPerMpc: 70 });
    expect(relativeDifference(cmbShiftParameter(cosmology, 1089), 2 * (1 - 1 / Math.sqrt(1090)))).toBeLessThan(1e-13);
  });
});

describe('comovingSoundHorizonMpc', () => {
  const cosmology = cosmologyOf(CASES[0]);

  it('approaches the pure-radiation limit (c/H0) a / sqrt(3 Omega_r) for a -> 0, where R_b -> 0 and a^2 E -> sqrt(Omega_r) (common practice)', () => {
    const z = 1e8;
    const limit = cosmology.hubbleDistanceMpc / (1 + z) / Math.sqrt(3 * cosmology.omegaRadiation);
    expect(relativeDifference(comovingSoundHorizonMpc(cosmology, 0.02237, z), limit)).toBeLessThan(1e-4);
  });

  it('equals the closed form of Eisenstein & Hu (1998, eq. 6) in a flat universe of matter and radiation alone', () => {
    // With a^2 E = sqrt(Omega_r + Omega_m a) and b = 3 omega_b / (4 omega_gamma), int da / sqrt((Omega_r + Omega_m a)(1 + b a))
    // = (2 / sqrt(Omega_m b)) ln(sqrt(b (Omega_r + Omega_m a)) + sqrt(Omega_m (1 + b a))) (a standard integral; common practice).
    const h = 0.7;
    const radiation = radiationDensity(CMB_TEMPERATURE_K, 100 * h, 3.046);
    const omegaMatter = 1 - radiation.total;
    const matterRadiation = build({ darkEnergy: 'lambda', flat: false, omegaMatter, omegaDarkEnergy: 0, h0KmPerSPerMpc: 100 * h, cmbTemperatureK: CMB_TEMPERATURE_K });
    const omegaBaryonH2 = 0.0224;
    const b = (3 * omegaBaryonH2) / (4 * radiation.photons * h * h);
    const primitive = (a: number): number => Math.log(Math.sqrt(b * (radiation.total + omegaMatter * a)) + Math.sqrt(omegaMatter * (1 + b * a)));
    for (const z of [3000, 1090, 1020, 10]) {
      const a = 1 / (1 + z);
      const closedForm = (C_KM_PER_S / (100 * h)) / Math.sqrt(3) * (2 / Math.sqrt(omegaMatter * b)) * (primitive(a) - primitive(0));
      expect(relativeDifference(comovingSoundHorizonMpc(matterRadiation, omegaBaryonH2, z), closedForm), `z = ${z}`).toBeLessThan(1e-11);
    }
  });

  it('falls with redshift and with the baryon density', () => {
    expect(comovingSoundHorizonMpc(cosmology, 0.02237, 1060)).toBeGreaterThan(comovingSoundHorizonMpc(cosmology, 0.02237, 1090));
    expect(comovingSoundHorizonMpc(cosmology, 0.03, 1090)).toBeLessThan(comovingSoundHorizonMpc(cosmology, 0.02, 1090));
  });

  it('reports a cosmology without radiation, one checked only to a finite redshift, and unusable inputs', () => {
    const cold = build({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70 });
    expect(() => comovingSoundHorizonMpc(cold, 0.0224, 1090)).toThrow(/no radiation/);
    expect(() => compressedCmbDistances(cold, 0.0224)).toThrow(/no radiation/);
    const outcome = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70, cmbTemperatureK: CMB_TEMPERATURE_K }, { maxRedshift: 3 });
    if (!outcome.ok) throw new Error(outcome.reason);
    expect(() => comovingSoundHorizonMpc(outcome.cosmology, 0.0224, 1090)).toThrow(/checked only to z = 3/);
    expect(() => comovingSoundHorizonMpc(cosmology, 0, 1090)).toThrow(/omegaBaryonH2 = 0/);
    expect(() => comovingSoundHorizonMpc(cosmology, 0.2, 1090)).toThrow(/Omega_m h\^2/);
    expect(() => comovingSoundHorizonMpc(cosmology, 0.0224, -1)).toThrow(/redshift -1/);
  });

  it('reports a last-scattering surface beyond the antipode of a closed universe', () => {
    const closed = build({ darkEnergy: 'lambda', flat: false, omegaMatter: 0.3, omegaDarkEnergy: 1.4, h0KmPerSPerMpc: 70, cmbTemperatureK: CMB_TEMPERATURE_K });
    expect(closed.transverseComovingDistanceMpc(1090)).toBeLessThanOrEqual(0);
    expect(() => compressedCmbDistances(closed, 0.0224)).toThrow(/antipode/);
  });
});
