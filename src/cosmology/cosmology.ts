import type { DarkEnergyLaw } from './darkEnergyEvolution.js';

/**
 * The parameters of an FLRW cosmology, as numbers (the numerical core never
 * sees the configuration file).
 * Convention (the same as the reference tables): a curved model keeps the
 * given omegaDarkEnergy, so Omega_k = 1 - Omega_m - Omega_DE - Omega_r absorbs
 * the radiation; a flat model sets Omega_DE = 1 - Omega_m - Omega_r.
 */
export interface CosmologyParameters {
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  /** Omega_m, all non-relativistic matter today (>= 0). */
  omegaMatter: number;
  /** Omega_DE today; required when flat = false, ignored (derived) when flat. */
  omegaDarkEnergy?: number;
  /** w0, equation of state today; default -1 ('lambda' accepts only -1). */
  w0?: number;
  /** wa, CPL slope; default 0 ('lambda' and 'constant_w' accept only 0). */
  wa?: number;
  /** H0 in km/s/Mpc (> 0). */
  h0KmPerSPerMpc: number;
  /** CMB temperature today, K; default 0 = no radiation (no photons, no neutrinos). */
  cmbTemperatureK?: number;
  /** N_eff massless neutrino species; default 3.046; used only when cmbTemperatureK > 0. */
  effectiveNeutrinoSpecies?: number;
}

/** Result of createCosmology: the cosmology, or why the parameters are unphysical. */
export type CosmologyOutcome = { ok: true; cosmology: Cosmology } | { ok: false; reason: string };

/**
 * An FLRW cosmology. Redshifts are >= 0 and at most the maxRedshift the
 * cosmology was created with; a redshift outside throws CandelaError
 * (code cosmology.redshift_out_of_range). Distances in Mpc, times in Gyr.
 */
export interface Cosmology {
  /** The parameters with defaults filled in and Omega_DE resolved. */
  readonly parameters: Required<CosmologyParameters>;
  readonly omegaMatter: number;
  readonly omegaDarkEnergy: number;
  readonly omegaCurvature: number;
  readonly omegaRadiation: number;
  /** Largest redshift checked for E^2 > 0 (Infinity = the whole past). */
  readonly maxRedshift: number;
  /** Which formulas compute the distances and ages ('numerical', 'einstein_de_sitter', 'empty', 'mattig', 'flat_lambda_age'). */
  readonly method: string;
  /** c/H0, Mpc. */
  readonly hubbleDistanceMpc: number;
  /** 1/H0, Gyr. */
  readonly hubbleTimeGyr: number;
  /** True when E^2 > 0 at every redshift and the age integral converges (a hot Big Bang in the finite past). */
  readonly hasBigBang: boolean;
  /** E(z) = H(z)/H0. */
  expansionRate(z: number): number;
  /** w(z) of the dark-energy law. */
  equationOfState(z: number): number;
  /** D_C(z), Mpc. */
  comovingDistanceMpc(z: number): number;
  /** D_M(z), Mpc (negative beyond the antipode of a closed universe). */
  transverseComovingDistanceMpc(z: number): number;
  /** D_L = (1 + zHelio) D_M(z), Mpc; zHelio defaults to z. */
  luminosityDistanceMpc(z: number, zHelio?: number): number;
  /** D_A = D_M / (1 + z), Mpc. */
  angularDiameterDistanceMpc(z: number): number;
  /** mu = 5 log10(|D_L| / 10 pc), mag. */
  distanceModulusMag(z: number, zHelio?: number): number;
  /** Lookback time to z, Gyr. */
  lookbackTimeGyr(z: number): number;
  /** Age of the universe at z, Gyr (Infinity without a Big Bang). */
  ageGyr(z: number): number;
  /** Age today, Gyr. */
  readonly ageTodayGyr: number;
  /** Deceleration parameter q(z). */
  decelerationParameter(z: number): number;
  /** q at z = 0. */
  readonly q0: number;
  /** z where q = 0 (start of acceleration), null if none in (0, 1e3). */
  accelerationRedshift(): number | null;
  /** Hot path, no allocation: D_M H0 / c at redshifts sorted ascending, written into out (out may be the input). */
  transverseComovingDistancesHubbleUnits(sortedRedshifts: Float64Array, out: Float64Array): void;
  /** D_C at redshifts in any order (sorted once internally), Mpc. */
  comovingDistancesMpc(z: Float64Array, out?: Float64Array): Float64Array;
  /** D_M at redshifts in any order, Mpc. */
  transverseComovingDistancesMpc(z: Float64Array, out?: Float64Array): Float64Array;
  /** mu at redshifts in any order, with optional heliocentric redshifts, mag. */
  distanceModuliMag(z: Float64Array, zHelio?: Float64Array, out?: Float64Array): Float64Array;
}
