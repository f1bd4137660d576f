import { CandelaError } from '../errors.js';
import { createCosmology, type Cosmology, type CosmologyOutcome, type CosmologyParameters, type DarkEnergyLaw } from '../cosmology/index.js';
import type { SupernovaTable } from '../data/index.js';
import { SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';
import type { ParameterValues } from './likelihoodTerm.js';

/**
 * H0 used for the model distance moduli when a supernova term does not read h0
 * (offset marginalized, no calibrators, no radiation): only M + 5 log10(c/H0)
 * is then constrained, and the reported absolute magnitude refers to this H0
 * (the common H0 = 70 km/s/Mpc convention of supernova compilations; common practice).
 */
export const NOMINAL_H0_KM_PER_S_PER_MPC = 70;

/** Relative headroom on the largest redshift, so that node redshifts rounded through ln(1+z) and back stay inside the cosmology's range. */
const REDSHIFT_HEADROOM = 1e-9;

/** Which cosmological parameters a supernova term reads (the rest keep the law's values). */
export interface HubbleFlowReads {
  omegaDarkEnergy: boolean;
  w0: boolean;
  wa: boolean;
  /** Reads h0; otherwise the nominal H0 is used. */
  h0: boolean;
}

/**
 * The one Hubble-flow distance-modulus model of the supernova terms
 * (conventional and hierarchical):
 *   mu_model = 5 log10[(1 + z_hel) D_M(z_HD) / 10 pc]
 *            = 5 log10[(1 + z_hel) D_M H0/c] + 5 log10(c/H0 / Mpc) + 25,
 * with calibrators (finite calibratorMu) taking mu_model = calibratorMu.
 * Hubble-flow rows are kept sorted by redshift so that one sorted distance
 * sweep serves every call; nothing is allocated per call.
 */
export interface HubbleFlowModuli {
  /** Hubble-flow rows (not calibrators), sorted by redshift. */
  readonly flowRows: Int32Array;
  /** 1 for calibrator rows, 0 otherwise. */
  readonly isCalibrator: Uint8Array;
  readonly minFlowRedshift: number;
  readonly maxFlowRedshift: number;
  /** H0 in use at p, km/s/Mpc. */
  h0At(p: ParameterValues): number;
  /** The cosmology at p (never throws). */
  cosmologyAt(p: ParameterValues): CosmologyOutcome;
  /** out[row] = 5 log10[(1+z_hel) D_M H0/c] for flow rows; a reason when D_M <= 0 (beyond a closed universe's antipode). */
  flowShape(cosmology: Cosmology, out: Float64Array): string | null;
  /** 5 log10(c/H0 / Mpc) + 25, with h0 from p or the nominal H0, mag. */
  hubbleTerm(p: ParameterValues): number;
  /** mu_model of every row at p into out (mag): calibrators their external modulus; a reason when p is unphysical, else null. */
  moduli(p: ParameterValues, out: Float64Array): string | null;
}

/**
 * Builds the Hubble-flow model of a table. Cost O(N log N).
 * @param table the supernovae (redshift, redshiftHelio, optional calibratorMu).
 * @param family the model's dark-energy law, curvature and radiation.
 * @param reads which parameters the term reads.
 * @throws CandelaError `likelihood.bad_redshift` for a Hubble-flow row with z <= 0 or z_hel <= -1, naming file and line.
 */
export function createHubbleFlowModuli(
  table: SupernovaTable,
  family: { darkEnergy: DarkEnergyLaw; flat: boolean; cmbTemperatureK: number; effectiveNeutrinoSpecies: number },
  reads: HubbleFlowReads,
): HubbleFlowModuli {
  const n = table.count;
  checkFlowRedshifts(table);
  const isCalibrator = new Uint8Array(n);
  const flow: number[] = [];
  for (let i = 0; i < n; i++) {
    if (table.calibratorMu && Number.isFinite(table.calibratorMu[i])) isCalibrator[i] = 1;
    else flow.push(i);
  }
  flow.sort((a, b) => table.redshift[a] - table.redshift[b]);
  const flowRows = Int32Array.from(flow);
  const sortedRedshifts = Float64Array.from(flow, (i) => table.redshift[i]);
  const distances = new Float64Array(flow.length);
  const helioTerm = Float64Array.from(flow, (i) => 5 * Math.log10(1 + table.redshiftHelio[i]));
  const maxFlowRedshift = flow.length ? sortedRedshifts[flow.length - 1] : 0;
  // One parameter record, refilled on each call (the hot path allocates nothing).
  const cosmologyParameters: CosmologyParameters = {
    darkEnergy: family.darkEnergy, flat: family.flat, omegaMatter: NaN, omegaDarkEnergy: undefined, w0: undefined, wa: undefined,
    h0KmPerSPerMpc: NOMINAL_H0_KM_PER_S_PER_MPC, cmbTemperatureK: family.cmbTemperatureK, effectiveNeutrinoSpecies: family.effectiveNeutrinoSpecies,
  };
  const cosmologyOptions = { maxRedshift: maxFlowRedshift * (1 + REDSHIFT_HEADROOM) };
  const h0At = (p: ParameterValues): number => (reads.h0 ? p.h0 : NOMINAL_H0_KM_PER_S_PER_MPC);
  const cosmologyAt = (p: ParameterValues): CosmologyOutcome => {
    cosmologyParameters.omegaMatter = p.omega_m;
    if (reads.omegaDarkEnergy) cosmologyParameters.omegaDarkEnergy = p.omega_de;
    if (reads.w0) cosmologyParameters.w0 = p.w0;
    if (reads.wa) cosmologyParameters.wa = p.wa;
    cosmologyParameters.h0KmPerSPerMpc = h0At(p);
    return createCosmology(cosmologyParameters, cosmologyOptions);
  };
  const flowShape = (cosmology: Cosmology, out: Float64Array): string | null => {
    cosmology.transverseComovingDistancesHubbleUnits(sortedRedshifts, distances);
    for (let k = 0; k < flowRows.length; k++) {
      const distance = distances[k];
      if (!(distance > 0)) {
        return `transverse comoving distance ${distance.toPrecision(4)} c/H0 at z = ${sortedRedshifts[k]} is not positive (beyond the antipode of a closed universe)`;
      }
      out[flowRows[k]] = helioTerm[k] + 5 * Math.log10(distance);
    }
    return null;
  };
  const hubbleTerm = (p: ParameterValues): number => 5 * Math.log10(SPEED_OF_LIGHT_KM_PER_S / h0At(p)) + 25;
  return {
    flowRows, isCalibrator, maxFlowRedshift, minFlowRedshift: flow.length ? sortedRedshifts[0] : 0,
    h0At, cosmologyAt, flowShape, hubbleTerm,
    moduli(p, out) {
      const h0 = h0At(p);
      if (!(h0 > 0 && h0 < Infinity)) return `parameter h0 = ${p.h0} must be a positive finite number`;
      if (flowRows.length) {
        const outcome = cosmologyAt(p);
        if (!outcome.ok) return outcome.reason;
        const failure = flowShape(outcome.cosmology, out);
        if (failure) return failure;
        const hubble = hubbleTerm(p);
        for (let k = 0; k < flowRows.length; k++) out[flowRows[k]] += hubble;
      }
      for (let i = 0; i < n; i++) if (isCalibrator[i]) out[i] = (table.calibratorMu as Float64Array)[i];
      return null;
    },
  };
}

/**
 * Checks that every Hubble-flow row (not a calibrator) has z > 0 and
 * z_hel > -1, so that the distance modulus exists. Cost O(N).
 * @throws CandelaError `likelihood.bad_redshift` naming the file and line of the first bad row.
 */
export function checkFlowRedshifts(table: SupernovaTable): void {
  for (let i = 0; i < table.count; i++) {
    if (table.calibratorMu && Number.isFinite(table.calibratorMu[i])) continue;
    if (!(table.redshift[i] > 0) || !(table.redshiftHelio[i] > -1)) {
      throw new CandelaError({ code: 'likelihood.bad_redshift', file: table.sourceFile, line: table.sourceLine[i], message: 'a Hubble-flow supernova needs z > 0', found: String(table.redshift[i]) });
    }
  }
}
