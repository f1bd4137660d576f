import { CandelaError } from '../errors.js';
import type { Cosmology, CosmologyOutcome } from '../cosmology/index.js';
import { createHubbleFlowModuli } from './hubbleFlowModuli.js';
import { requireLightCurves, trippCorrectedMagnitudes, type TrippCoefficients } from '../standardize/index.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { createSupernovaCovarianceModel, type SupernovaCovarianceModel } from './supernovaCovarianceModel.js';
import { supernovaParameterNames, type SupernovaParameterNames } from './supernovaParameterNames.js';
import type { SupernovaTermOptions } from './supernovaTermOptions.js';

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
  const flowModel = createHubbleFlowModuli(table, options.cosmologyModel, {
    omegaDarkEnergy: names.readsOmegaDarkEnergy, w0: names.readsW0, wa: names.readsWa, h0: names.readsH0,
  });
  const { isCalibrator, flowRows, cosmologyAt, flowShape, hubbleTerm, h0At } = flowModel;
  const covariance = createSupernovaCovarianceModel(table, options.covariances, standardization.scatter, table.sampleIndex, sampleCount, isCalibrator, options.systematicModes);
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

  const coefficients: TrippCoefficients = { alpha: 0, beta: 0, massStepMag: 0 };
  const shape = new Float64Array(n);
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

  return {
    options, count: n, names, covariance, flowRows, isCalibrator, covarianceVaries, frozen,
    minFlowRedshift: flowModel.minFlowRedshift,
    maxFlowRedshift: flowModel.maxFlowRedshift,
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
