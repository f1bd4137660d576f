import { parseParameterName } from '../parameters/index.js';
import type { CovarianceMatrix, SupernovaTable, SystematicModes } from '../data/index.js';
import { CandelaError } from '../errors.js';
import { createSupernovaTerm } from '../likelihood/index.js';
import type { Prior, SupernovaTermOptions } from '../likelihood/index.js';
import { CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES } from '../cosmology/index.js';
import type { DarkEnergyLaw } from '../cosmology/index.js';
import { covariancePart } from './forecastCovariancePart.js';
import { centralDifferenceHessian } from './forecastHessian.js';
import { chooseFisherSteps } from './fisherSteps.js';
import { marginalizeFisher } from './forecastMarginals.js';
import type { FisherMarginals } from './forecastMarginals.js';

/**
 * Final step of parameter i: this fraction of its conditional error
 * 1/sqrt(F_ii) from the pilot pass. The truncation error of central
 * differences is O(h^2) relative to the scale on which the model is
 * nonlinear, and degenerate directions (w0-wa-omega_m) amplify it in the
 * marginal errors: a tenth of sigma changed them by 1e-3 to 1e-1 on halving,
 * a thousandth by 2e-8 to 2e-5 (measured on 90- and 800-supernova surveys).
 * Rounding stays small because chi^2 itself is differenced (its relative
 * precision is ~1e-9 at these steps); a ten-thousandth starts to show it.
 */
export const STEP_FRACTION_OF_SIGMA = 1e-3;

/** One free parameter of a Fisher forecast: its value at the evaluation point and its prior, if it has one. */
export interface FisherParameter {
  name: string;
  /** The value the derivatives are taken at, in the parameter's units. */
  value: number;
  /** Its prior, or null (flat); a Gaussian adds 1/sd^2 to the diagonal, bounds only give notes. */
  prior: Prior | null;
}

/** The likelihood and parameter set of one forecast (one model); plain values, no configuration types. */
export interface FisherSetup {
  label: string;
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  /** Photons (T_CMB 2.7255 K) and massless neutrinos on. */
  radiation: boolean;
  standardization: SupernovaTermOptions['standardization'];
  free: readonly FisherParameter[];
  /** Values held fixed, by parameter name. */
  fixed: Record<string, number>;
  /** What the reader of the forecast should know; copied to the result. */
  notes: readonly string[];
}

/** The expected (noise-free) data a forecast is computed on: a mock survey's table and systematics. */
export interface FisherData {
  table: SupernovaTable;
  /** Dense systematic covariance on the magnitudes (N x N, mag^2), or null. */
  systematicCovariance: Float64Array | null;
  /** The systematics as modes U (N x K, mag), used when there is no dense matrix; or null. */
  systematicModes: SystematicModes | null;
}

/** The forecast of one model. */
export interface ModelForecast {
  label: string;
  darkEnergy: DarkEnergyLaw;
  flat: boolean;
  /** Free parameters, in matrix order. */
  parameters: string[];
  /** Their values at the truth. */
  truth: number[];
  fixed: Record<string, number>;
  /** Finite-difference steps of the mean part, per parameter (0 for parameters that shape only the covariance). */
  steps: number[];
  /** The step rule's fraction of the conditional errors. */
  stepFraction: number;
  /** Fisher matrix including the Gaussian priors, row major. */
  fisher: Float64Array;
  marginals: FisherMarginals;
  /** Gaussian priors added to the diagonal as 1/sd^2. */
  priors: Array<{ name: string; sd: number }>;
  /** Parameters whose effect on the covariance adds information (1/2 tr(C^-1 C_i C^-1 C_j)). */
  covarianceParameters: string[];
  /** chi^2 of the noise-free survey at the evaluation point (0 when the model reproduces the truth). */
  chiSquareAtTruth: number;
  /** Largest relative change of a marginal error (and of the figure of merit) when every step is halved. */
  halvedStepChange: number;
  notes: string[];
}

/**
 * The Fisher forecast of one setup on a noise-free survey (Tegmark, Taylor &
 * Heavens 1997, ApJ 480, 22): for Gaussian data with mean mu(theta) and
 * covariance C(theta),
 *
 *   F_ij = mu_,i^T C^-1 mu_,j + 1/2 tr(C^-1 C_,i C^-1 C_,j)      (TTH97 eq. 15, from memory)
 *
 * The first (mean) part is -d^2 ln L / d theta_i d theta_j of the same
 * supernova likelihood the fit uses, on the noise-free table, with C held at
 * its value at the truth: on expected data the residual vanishes at the truth,
 * so this curvature equals mu_,i^T C^-1 mu_,j exactly. It is computed by
 * central differences (centralDifferenceHessian) of chi^2/2 with step rule: a
 * pilot pass with h = PILOT_RELATIVE_STEP max(1, |theta_i|) (see chooseFisherSteps) gives F_ii, then
 * h_i = stepFraction / sqrt(F_ii); stability is checked by halving every
 * step. The second part is added for parameters that change the variances
 * (alpha and beta when the covariance follows them, sigma_int),
 * from the likelihood's own variances (covarianceInformation). (The curvature
 * of ln det C on noise-free data alone is not this expectation and can even be
 * negative for sigma_int.) Gaussian priors add 1/sd^2 to the diagonal.
 * The survey's systematics enter as they are given: a dense matrix (general
 * path) or, with the 'modes' form, modes U through the Woodbury identity
 * (low_rank path); both give the same forecast up to rounding.
 * Cost: dense systematics: one N x N factorization, ~2 P^2 likelihood
 * evaluations of O(N^2) per step set, and O(N^3) once when the covariance
 * part is needed; modes: O(N K^2) per evaluation and for the covariance
 * part, no N x N matrix; none: O(N) per evaluation.
 * @param setup the model, free parameters with their truths, fixed values, standardization.
 * @param mock the noise-free survey (a mock survey drawn with noiseless: its table and systematics).
 * @param stepFraction the final steps as a fraction of the conditional errors (default STEP_FRACTION_OF_SIGMA).
 * @throws CandelaError when the likelihood is not finite near the truth, a parameter carries no information, or F is degenerate.
 * @example fisherForecast(setup, generateMockSurvey({ ...options, noiseless: true })).marginals.figureOfMerit
 */
export function fisherForecast(setup: FisherSetup, mock: FisherData, stepFraction = STEP_FRACTION_OF_SIGMA): ModelForecast {
  const { table } = mock;
  const n = table.count;
  // The survey's systematics as the fit would read them: the dense matrix ('matrix' form) or the modes ('modes' form).
  const dense = mock.systematicCovariance;
  const modes = dense ? null : mock.systematicModes;
  const covariances: CovarianceMatrix[] = dense ? [{ target: 'magnitudes', size: n, values: dense, sourceFile: 'mock systematic covariance' }] : [];
  const names = setup.free.map((p) => p.name);
  const atTruth: Record<string, number> = { ...setup.fixed };
  for (const p of setup.free) atTruth[p.name] = p.value;
  const std = setup.standardization;
  const frozenAt = std.alphaBetaCovariance === 'frozen' && std.frozenAt ? std.frozenAt : { alpha: atTruth.alpha, beta: atTruth.beta };
  const base: Omit<SupernovaTermOptions, 'standardization' | 'fixed'> = {
    // Exact paths only (the compressed one trades 1e-7 in chi^2 for speed, which finite differences would amplify).
    name: 'forecast', table, covariances, ...(modes ? { systematicModes: modes } : {}), offset: 'sample',
    fastPath: dense ? 'general' : modes ? 'low_rank' : 'diagonal',
    cosmologyModel: { darkEnergy: setup.darkEnergy, flat: setup.flat, cmbTemperatureK: setup.radiation ? CMB_TEMPERATURE_K : 0, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES },
  };
  const shapesOnlyCovariance = (name: string): boolean => parseParameterName(name)?.base === 'sigma_int';
  const meanNames = names.filter((name) => !shapesOnlyCovariance(name));
  const pinned = Object.fromEntries(Object.entries(atTruth).filter(([name]) => !meanNames.includes(name)));
  const meanTerm = createSupernovaTerm({ ...base, standardization: { ...std, alphaBetaCovariance: 'frozen', frozenAt }, fixed: pinned });
  const point: Record<string, number> = { ...atTruth };
  const meanValues = (theta: Float64Array): Record<string, number> => {
    for (let i = 0; i < meanNames.length; i++) point[meanNames[i]] = theta[i];
    return point;
  };
  // -ln L = chi^2/2 + a constant (ln det C and N ln 2 pi do not change with C held fixed); differencing
  // chi^2 itself keeps the rounding relative to the (small) differences instead of to |ln L|.
  const minusLogLikelihood = (theta: Float64Array): number => 0.5 * (meanTerm.bestFitExtras?.(meanValues(theta)).chi_square ?? Number.NaN);
  const reason = (theta: Float64Array): string | null => meanTerm.rejectionReason(meanValues(theta));
  const center = Float64Array.from(meanNames, (name) => atTruth[name]);
  const steps = chooseFisherSteps(minusLogLikelihood, center, meanNames, reason, stepFraction);
  const halved = steps.map((h) => h / 2);
  const meanFisher = centralDifferenceHessian(minusLogLikelihood, center, steps, meanNames, reason);
  const meanFisherHalved = centralDifferenceHessian(minusLogLikelihood, center, halved, meanNames, reason);

  const fromCovariance = covariancePart(() => createSupernovaTerm({ ...base, standardization: std, fixed: setup.fixed }), atTruth, names, dense ?? modes, n);
  const priors = setup.free
    .filter((p) => p.prior && (p.prior.kind === 'gaussian' || p.prior.kind === 'truncated_gaussian'))
    .map((p) => ({ name: p.name, sd: (p.prior as { sd: number }).sd }));
  const size = names.length;
  const assemble = (mean: Float64Array): Float64Array => {
    const fisher = new Float64Array(size * size);
    const meanIndex = meanNames.map((name) => names.indexOf(name));
    meanIndex.forEach((i, a) => meanIndex.forEach((j, b) => { fisher[i * size + j] += mean[a * meanNames.length + b]; }));
    const covIndex = fromCovariance.names.map((name) => names.indexOf(name));
    covIndex.forEach((i, a) => covIndex.forEach((j, b) => { fisher[i * size + j] += fromCovariance.information[a * covIndex.length + b]; }));
    for (const prior of priors) fisher[names.indexOf(prior.name) * (size + 1)] += 1 / (prior.sd * prior.sd);
    return fisher;
  };
  const fisher = assemble(meanFisher);
  const marginals = marginalizeFisher(fisher, names);
  const check = marginalizeFisher(assemble(meanFisherHalved), names);
  let halvedStepChange = 0;
  for (let i = 0; i < size; i++) halvedStepChange = Math.max(halvedStepChange, Math.abs(check.sigma[i] / marginals.sigma[i] - 1));
  if (marginals.figureOfMerit !== null && check.figureOfMerit !== null) {
    halvedStepChange = Math.max(halvedStepChange, Math.abs(check.figureOfMerit / marginals.figureOfMerit - 1));
  }
  return {
    label: setup.label, darkEnergy: setup.darkEnergy, flat: setup.flat, parameters: names, truth: setup.free.map((p) => p.value),
    fixed: { ...setup.fixed }, stepFraction, steps: names.map((name) => (meanNames.includes(name) ? steps[meanNames.indexOf(name)] : 0)),
    fisher, marginals, priors, covarianceParameters: fromCovariance.names,
    chiSquareAtTruth: meanTerm.bestFitExtras?.(atTruth).chi_square ?? Number.NaN,
    halvedStepChange, notes: [...setup.notes, ...priorLimitNotes(setup, marginals)],
  };
}

/** Notes for bounded priors that a +-2 sigma interval would cross (the fit is then prior-limited there). */
function priorLimitNotes(setup: FisherSetup, marginals: FisherMarginals): string[] {
  const notes: string[] = [];
  setup.free.forEach((p, i) => {
    const prior = p.prior;
    if (!prior || !('min' in prior)) return;
    const sigma = marginals.sigma[i];
    if (p.value - 2 * sigma < prior.min || p.value + 2 * sigma > prior.max) {
      notes.push(`${p.name}: the 2-sigma interval ${(p.value - 2 * sigma).toPrecision(3)}..${(p.value + 2 * sigma).toPrecision(3)} crosses the prior bounds ${prior.min}..${prior.max}; the fit will be prior-limited there`);
    }
  });
  return notes;
}
