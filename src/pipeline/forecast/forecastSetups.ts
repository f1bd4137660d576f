import type { CandelaConfig, PriorSpec, SurveyDescription, SurveyTruth } from '../../config/index.js';
import type { FisherParameter, FisherSetup } from '../../forecast/index.js';
import { parametersForModel } from '../../config/index.js';
import { parameterRank, parseParameterName } from '../../parameters/index.js';
import { absoluteMagnitudeAtH0 } from '../../cosmology/index.js';
import { CandelaError } from '../../errors.js';
import { termStandardization } from '../run/termStandardization.js';

/** Relative difference below which a fixed value counts as equal to the truth (rounding of a value typed in two files). */
const SAME_VALUE_TOLERANCE = 1e-9;

/**
 * The likelihood and parameter set of one forecast (one model) as the Fisher
 * numerics take it (FisherSetup: free parameters at the truth, abs_mag
 * shifted to the fixed h0, their priors from the fit configuration or none),
 * plus the fiducial the model is forecast on.
 */
export interface ForecastSetup extends FisherSetup {
  /**
   * The model's fiducial: the survey truth with the model's dark-energy law,
   * curvature and fixed values substituted. Its noise-free survey is what the
   * model is forecast on (the survey truth itself whenever the model contains it).
   */
  fiducial: SurveyTruth;
}

/**
 * The forecast setups: without a fit configuration, one model, w0waCDM (flat,
 * or with free curvature when the truth is curved) with omega_m, w0, wa,
 * abs_mag, alpha, beta and mass_step free (no priors), h0 and sigma_int
 * fixed at the truth, and the survey's own scatter terms; with a fit
 * configuration, one setup per model, with its free parameters, priors,
 * fixed values and standardization. The mock has no calibrators, so a free
 * h0 is fixed at the truth; the offset is always a parameter (a
 * marginalized offset becomes abs_mag with a flat prior, which gives the
 * same marginal errors for the others in the Fisher approximation). abs_mag
 * is evaluated at M + 5 log10(h0_fixed / h0_true), the value that gives the
 * same magnitudes when h0 is fixed elsewhere than the truth. A model that
 * cannot reproduce the truth (a fixed w0 = -1 against a truth with w0 =
 * -0.9, a fixed alpha off the truth, no host-mass step) is forecast at its
 * own fiducial (ForecastSetup.fiducial), said in a note: the Fisher matrix is
 * the curvature at a point where the model fits the expected data.
 * Cost O(models x parameters).
 * @param survey the survey description (the truth).
 * @param config the fit configuration, or null for the default setup.
 * @param sampleLabels the mock's sample labels (for per-sample parameters).
 * @throws CandelaError `forecast.unsupported` for the hierarchical method, magnitude data or a parameter without a truth.
 * @example forecastSetups(survey, null, ['harbor'])[0].free.map((p) => p.name) // ['omega_m', 'w0', 'wa', 'abs_mag', 'alpha', 'beta', 'mass_step']
 */
export function forecastSetups(survey: SurveyDescription, config: CandelaConfig | null, sampleLabels: readonly string[]): ForecastSetup[] {
  const truth = survey.truth;
  if (!config) {
    const curved = truth.curvature === 'free';
    const names = ['omega_m', ...(curved ? ['omega_de'] : []), 'w0', 'wa', 'abs_mag', 'alpha', 'beta', 'mass_step'];
    const fixed = { h0: truth.h0KmPerSPerMpc, sigma_int: truth.sigmaIntMag };
    return [{
      label: `${curved ? 'curved' : 'flat'}_w0wa`, darkEnergy: 'cpl', flat: !curved, radiation: false,
      standardization: {
        massStep: { enabled: true, splitLogMass: truth.splitLogMass, shape: 'sharp', widthDex: 0.1 },
        scatter: { lensingPerRedshift: survey.lensingPerRedshift, peculiarVelocityKmPerS: survey.peculiarVelocityKmPerS, includeRedshiftErrors: false },
        intrinsicScatter: 'global', alphaBetaCovariance: 'exact',
      },
      free: names.map((name) => ({ name, value: truthValue(survey, name, fixed.h0) as number, prior: null })),
      fixed,
      fiducial: { ...truth, darkEnergy: 'cpl' },
      notes: ['no fit configuration given: default parameter set (h0 and sigma_int fixed at the truth, no priors)'],
    }];
  }
  const unsupported = (path: string, message: string, fix: string): CandelaError =>
    new CandelaError({ code: 'forecast.unsupported', file: config.source.file.written, path, message, fix });
  if (config.standardization.method === 'hierarchical') {
    throw unsupported('standardization.method', 'the forecast supports the conventional Tripp standardization only', 'use a configuration with method: conventional for the forecast');
  }
  if (!config.supernovae.some((set) => set.kind === 'light_curves')) {
    throw unsupported('supernovae', 'the fit configuration reads standardized magnitudes, but the mock survey holds light-curve parameters', 'give a fit configuration with kind: light_curves');
  }
  return config.models.map((model, index) => {
    const { free, fixed } = parametersForModel(config, index, sampleLabels);
    const notes: string[] = [];
    const standardization = config.standardization;
    let entries = free.map((entry) => ({ name: entry.name, prior: entry.prior as PriorSpec | null }));
    if (entries.some((entry) => entry.name === 'h0')) {
      entries = entries.filter((entry) => entry.name !== 'h0');
      fixed.h0 = truth.h0KmPerSPerMpc;
      notes.push('h0 is held at the truth: the mock has no calibrators, so h0 and abs_mag are degenerate');
    }
    if (standardization.offset === 'marginalize') {
      entries.push({ name: 'abs_mag', prior: null });
      notes.push('abs_mag is marginalized in the fit; here it is a free parameter with a flat prior, which gives the same marginal errors for the others');
    }
    entries.sort((a, b) => parameterRank(a.name) - parameterRank(b.name));
    const h0 = fixed.h0 ?? truth.h0KmPerSPerMpc;
    const parameters = entries.map((entry) => {
      const value = truthValue(survey, entry.name, h0);
      if (value === null) throw unsupported(`parameters.${entry.name}`, `the survey truth has no value for ${entry.name}`, `fix ${entry.name} in the fit configuration`);
      return { name: entry.name, value, prior: entry.prior };
    });
    for (const [name, value] of Object.entries(fixed)) {
      const expected = name === 'h0' ? truth.h0KmPerSPerMpc : truthValue(survey, name, h0);
      if (expected === null || Math.abs(value - expected) <= SAME_VALUE_TOLERANCE * Math.max(1, Math.abs(expected))) continue;
      notes.push(name === 'h0'
        ? `h0 is fixed at ${value} (survey truth ${expected}): abs_mag is evaluated at M + 5 log10(${value}/${expected}), which gives the same magnitudes`
        : `${name} is fixed at ${value} (survey truth ${expected}): this model is forecast on the survey drawn with ${name} = ${value}; a fit to the survey itself would be biased`);
    }
    if (!standardization.hostMassStep.enabled && truth.massStepMag !== 0) {
      notes.push(`the fit has no host-mass step (survey truth mass_step = ${truth.massStepMag}): this model is forecast on the survey drawn without one`);
    }
    if (standardization.hostMassStep.enabled && standardization.hostMassStep.shape === 'logistic') {
      notes.push('the fit uses a logistic host-mass step, the mock a sharp one: the noise-free survey is not exactly reproduced at the truth');
    }
    if (model.radiation) notes.push('the model includes radiation, the mock truth does not (a difference of order 1e-4 in distances)');
    return {
      label: model.label, darkEnergy: model.darkEnergy, flat: model.curvature === 'flat', radiation: model.radiation,
      standardization: termStandardization(standardization),
      free: parameters, fixed, notes,
      fiducial: fiducialTruth(survey, model, standardization.hostMassStep, parameters, fixed),
    };
  });
}

/** The survey truth with a model's law, curvature, free-parameter truths and fixed values. */
function fiducialTruth(
  survey: SurveyDescription, model: CandelaConfig['models'][number], step: CandelaConfig['standardization']['hostMassStep'],
  free: readonly FisherParameter[], fixed: Record<string, number>,
): SurveyTruth {
  const truth = survey.truth;
  const point: Record<string, number> = { ...fixed };
  for (const parameter of free) point[parameter.name] = parameter.value;
  const flat = model.curvature === 'flat';
  return {
    darkEnergy: model.darkEnergy,
    curvature: model.curvature,
    omegaMatter: point.omega_m ?? truth.omegaMatter,
    omegaDarkEnergy: flat ? null : (point.omega_de ?? truth.omegaDarkEnergy ?? 1 - truth.omegaMatter),
    w0: model.darkEnergy === 'lambda' ? -1 : (point.w0 ?? truth.w0),
    wa: model.darkEnergy === 'cpl' ? (point.wa ?? truth.wa) : 0,
    h0KmPerSPerMpc: point.h0 ?? truth.h0KmPerSPerMpc,
    alpha: point.alpha ?? truth.alpha,
    beta: point.beta ?? truth.beta,
    absMagMag: point.abs_mag ?? truth.absMagMag,
    massStepMag: step.enabled ? (point.mass_step ?? truth.massStepMag) : 0,
    splitLogMass: step.splitLogMass,
    sigmaIntMag: point.sigma_int ?? truth.sigmaIntMag,
  };
}

/**
 * The truth of a parameter, by name, or null when the survey has none.
 * abs_mag refers to H0 = `h0` (absoluteMagnitudeAtH0 of the truth).
 */
function truthValue(survey: SurveyDescription, name: string, h0: number): number | null {
  const t = survey.truth;
  const base = parseParameterName(name)?.base;
  switch (base) {
    case 'omega_m': return t.omegaMatter;
    case 'omega_de': return t.omegaDarkEnergy ?? 1 - t.omegaMatter;
    case 'w0': return t.w0;
    case 'wa': return t.wa;
    case 'h0': return t.h0KmPerSPerMpc;
    case 'alpha': return t.alpha;
    case 'beta': return t.beta;
    case 'abs_mag': return absoluteMagnitudeAtH0(t.absMagMag, t.h0KmPerSPerMpc, h0);
    case 'mass_step': return t.massStepMag;
    case 'sigma_int': return t.sigmaIntMag;
    default: return null;
  }
}
