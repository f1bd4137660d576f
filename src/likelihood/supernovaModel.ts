import { CandelaError } from '../errors.js';
import { createCosmology, type Cosmology, type CosmologyOutcome, type CosmologyParameters } from '../cosmology/index.js';
import { SPEED_OF_LIGHT_KM_PER_S } from '../math/index.js';
import { requireLightCurves, trippCorrectedMagnitudes, type TrippCoefficients } from '../standardize/index.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { createSupernovaCovarianceModel, type SupernovaCovarianceModel } from './supernovaCovarianceModel.js';
import { supernovaParameterNames, type SupernovaParameterNames } from './supernovaParameterNames.js';
import type { SupernovaTermOptions } from './supernovaTermOptions.js';

/**
 * H0 used for the model distance moduli when the term does not read h0 (offset
 * marginalized, no calibrators, no radiation): only M + 5 log10(c/H0) is then
 * constrained, and the reported absolute magnitude refers to this H0
 * (the common H0 = 70 km/s/Mpc convention of supernova compilations; common practice).
 */
export const NOMINAL_H0_KM_PER_S_PER_MPC = 70;

/** Relative headroom on the largest redshift, so that node redshifts rounded through ln(1+z) and back stay inside the cosmology's range. */
const REDSHIFT_HEADROOM = 1e-9;

/**
 * Everything the evaluation paths share (private helper of the supernova term):
 * parameter names, the covariance model, the standardized magnitudes, the
 * cosmology at a parameter point and the model distance moduli.
 *
 *   mu_model = 5 log10[(1 + z_hel) D_M(z_HD) / 10 pc]
 *            = 5 log10[(1 + z_hel) D_M H0/c] + 5 log10(c/H0 / Mpc) + 25,
 *
 * with calibrators (finite calibratorMu) taking mu_model = calibratorMu instead.
 */
export interface SupernovaModel {
  readonly options: SupernovaTermOptions;
  readonly count: number;
  readonly names: SupernovaParameterNames;
  readonly covariance: SupernovaCovarianceModel;
  /** Hubble-flow rows (not calibrators), sorted by redshift. */
  readonly flowRows: Int32Array;
  /** 1 for calibrator rows, 0 otherwise. */
  readonly isCalibrator: Uint8Array;
  readonly minFlowRedshift: number;
  readonly maxFlowRedshift: number;
  /** True when the covariance inputs (alpha, beta when exact, sigma_int) may change during the run. */
  readonly covarianceVaries: boolean;
  /** True when alpha and beta enter the covariance at frozen values. */
  readonly frozen: boolean;
  /** Fills [alpha, beta, sigma_int...] for the covariance at p (frozen values substituted). */
  readCovarianceInputs(p: ParameterValues, out: Float64Array): void;
  /** Builds the cosmology at p (never throws). */
  cosmologyAt(p: ParameterValues): CosmologyOutcome;
  /** Standardized magnitudes y at p into out (Tripp relation for light curves, the magnitudes otherwise), mag. */
  standardize(p: ParameterValues, out: Float64Array): void;
  /** out[row] = 5 log10[(1+z_hel) D_M H0/c] for flow rows; a reason when D_M <= 0 (beyond a closed universe's antipode). */
  flowShape(cosmology: Cosmology, out: Float64Array): string | null;
  /** 5 log10(c/H0 / Mpc) + 25, with h0 from p or the nominal H0, mag. */
  hubbleTerm(p: ParameterValues): number;
  /** H0 in use at p, km/s/Mpc. */
  h0At(p: ParameterValues): number;
  /**
   * d = y - mu_model without the absolute magnitude, at p, into out (mag):
   * y - calibratorMu for calibrators, y - hubbleTerm - flowShape otherwise.
   * Returns why the point is unphysical, or null. O(N) plus N distances.
   */
  offsetFreeResidual(p: ParameterValues, out: Float64Array): string | null;
}

/**
 * Builds the shared model. Cost O(N log N) plus the covariance scans.
 * @param options the term's options
 * @throws CandelaError for an empty sample, a Hubble-flow row with z <= 0, missing light-curve columns,
 *   a frozen covariance without values, and (from the covariance model) mismatched matrices
 */
export function createSupernovaModel(options: SupernovaTermOptions): SupernovaModel {
  const { table, standardization } = options;
  const n = table.count;
  if (n < 1) throw new CandelaError({ code: 'likelihood.empty_sample', message: `likelihood term ${options.name} has no supernovae`, path: options.name });
  const names = supernovaParameterNames(options);
  if (names.readsAlphaBeta) requireLightCurves(table); // throws CandelaError now rather than in the hot path
  const sampleCount = names.intrinsicNames.length;
  const isCalibrator = new Uint8Array(n);
  const flow: number[] = [];
  for (let i = 0; i < n; i++) {
    if (table.calibratorMu && Number.isFinite(table.calibratorMu[i])) isCalibrator[i] = 1;
    else {
      if (!(table.redshift[i] > 0) || !(table.redshiftHelio[i] > -1)) {
        throw new CandelaError({ code: 'likelihood.bad_redshift', file: table.sourceFile, line: table.sourceLine[i], message: 'a Hubble-flow supernova needs z > 0', found: String(table.redshift[i]) });
      }
      flow.push(i);
    }
  }
  flow.sort((a, b) => table.redshift[a] - table.redshift[b]);
  const covariance = createSupernovaCovarianceModel(table, options.covariances, standardization.scatter, table.sampleIndex, sampleCount, isCalibrator, options.systematicModes);
  const flowRows = Int32Array.from(flow);
  const sortedRedshifts = Float64Array.from(flow, (i) => table.redshift[i]);
  const distances = new Float64Array(flow.length);
  const helioTerm = Float64Array.from(flow, (i) => 5 * Math.log10(1 + table.redshiftHelio[i]));
  const maxFlowRedshift = flow.length ? sortedRedshifts[flow.length - 1] : 0;

  const fixed = options.fixed ?? {};
  const frozen = names.readsAlphaBeta && standardization.alphaBetaCovariance === 'frozen';
  let frozenAt = standardization.frozenAt;
  if (frozen && !frozenAt) {
    if (!('alpha' in fixed && 'beta' in fixed)) {
      throw new CandelaError({ code: 'likelihood.frozen_without_values', path: `${options.name}.frozenAt`, message: 'a frozen alpha/beta covariance needs the values to freeze at', fix: 'give frozenAt {alpha, beta}, or fix alpha and beta' });
    }
    frozenAt = { alpha: fixed.alpha, beta: fixed.beta };
  }
  const alphaBetaVary = names.readsAlphaBeta && !frozen && !('alpha' in fixed && 'beta' in fixed);
  const covarianceVaries = alphaBetaVary || names.intrinsicNames.some((name) => !(name in fixed));

  const cosmologyParameters: CosmologyParameters = {
    darkEnergy: options.cosmologyModel.darkEnergy, flat: options.cosmologyModel.flat, omegaMatter: NaN,
    omegaDarkEnergy: undefined, w0: undefined, wa: undefined, h0KmPerSPerMpc: NOMINAL_H0_KM_PER_S_PER_MPC,
    cmbTemperatureK: options.cosmologyModel.cmbTemperatureK, effectiveNeutrinoSpecies: options.cosmologyModel.effectiveNeutrinoSpecies,
  };
  const cosmologyOptions = { maxRedshift: maxFlowRedshift * (1 + REDSHIFT_HEADROOM) };
  const coefficients: TrippCoefficients = { alpha: 0, beta: 0, massStepMag: 0 };
  const shape = new Float64Array(n);
  const h0At = (p: ParameterValues): number => (names.readsH0 ? p.h0 : NOMINAL_H0_KM_PER_S_PER_MPC);

  const cosmologyAt = (p: ParameterValues): CosmologyOutcome => {
    cosmologyParameters.omegaMatter = p.omega_m;
    if (names.readsOmegaDarkEnergy) cosmologyParameters.omegaDarkEnergy = p.omega_de;
    if (names.readsW0) cosmologyParameters.w0 = p.w0;
    if (names.readsWa) cosmologyParameters.wa = p.wa;
    cosmologyParameters.h0KmPerSPerMpc = h0At(p);
    return createCosmology(cosmologyParameters, cosmologyOptions);
  };
  const standardize = (p: ParameterValues, out: Float64Array): void => {
    if (!names.readsAlphaBeta) {
      out.set(table.magnitude as Float64Array);
      return;
    }
    coefficients.alpha = p.alpha;
    coefficients.beta = p.beta;
    coefficients.massStepMag = names.readsMassStep ? p.mass_step : 0;
    trippCorrectedMagnitudes(table, coefficients, standardization.massStep, out);
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
    options, count: n, names, covariance, flowRows, isCalibrator, covarianceVaries, frozen,
    minFlowRedshift: flow.length ? sortedRedshifts[0] : 0,
    maxFlowRedshift,
    readCovarianceInputs(p, out) {
      out[0] = frozen ? (frozenAt as { alpha: number }).alpha : names.readsAlphaBeta ? p.alpha : 0;
      out[1] = frozen ? (frozenAt as { beta: number }).beta : names.readsAlphaBeta ? p.beta : 0;
      for (let k = 0; k < sampleCount; k++) out[2 + k] = p[names.intrinsicNames[k]];
    },
    cosmologyAt,
    standardize,
    flowShape,
    hubbleTerm,
    h0At,
    offsetFreeResidual(p, out) {
      const outcome = cosmologyAt(p);
      if (!outcome.ok) return outcome.reason;
      const failure = flowShape(outcome.cosmology, shape);
      if (failure) return failure;
      standardize(p, out);
      const hubble = hubbleTerm(p);
      const calibratorMu = table.calibratorMu;
      for (let i = 0; i < n; i++) out[i] -= isCalibrator[i] ? (calibratorMu as Float64Array)[i] : hubble + shape[i];
      return null;
    },
  };
}
