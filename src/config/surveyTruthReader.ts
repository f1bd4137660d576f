/**
 * `truth` of a survey description: the cosmology and nuisance parameters the
 * mock is drawn from, under the parameter names of the run configuration.
 */
import type { SurveyTruth } from './surveyDescription.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_SURVEY_TRUTH } from './surveyDefaults.js';
import { surveyMissingKey } from './surveyMissingKey.js';

/** Keys of `truth`, in documentation order. */
export const SURVEY_TRUTH_KEYS = [
  'dark_energy', 'curvature', 'omega_m', 'omega_de', 'w0', 'wa', 'h0',
  'alpha', 'beta', 'abs_mag', 'mass_step', 'split_log_mass', 'sigma_int',
] as const;
const REQUIRED = ['dark_energy', 'omega_m', 'alpha', 'beta', 'abs_mag', 'sigma_int'] as const;

/**
 * Reads the truth. omega_de is required with `curvature: free` (and unused
 * when flat), w0 with `constant_w` and `cpl`, wa with `cpl`; entries a model
 * does not use are warnings. Problems go to the reader.
 * @param reader the document reader.
 * @param at the `truth` value.
 * @returns the truth, or undefined when something required is missing or invalid.
 * @example readSurveyTruth(reader, at)?.omegaMatter // 0.31
 */
export function readSurveyTruth(reader: ConfigReader, at: Located): SurveyTruth | undefined {
  const fields = reader.mapping(at, SURVEY_TRUTH_KEYS);
  surveyMissingKey(reader, at, fields, REQUIRED);
  if (!fields) return undefined;
  const errorsBefore = reader.issues.filter((issue) => issue.severity !== 'warning').length;
  const darkEnergy = reader.choice(fields.get('dark_energy'), ['lambda', 'constant_w', 'cpl'] as const);
  const curvature = reader.choice(fields.get('curvature'), ['flat', 'free'] as const) ?? DEFAULT_SURVEY_TRUTH.curvature;
  const number = (key: string, rule: Parameters<ConfigReader['number']>[1] = {}) => reader.number(fields.get(key), rule);
  const omegaMatter = number('omega_m', { min: 0 });
  const omegaDarkEnergy = number('omega_de');
  const w0 = number('w0');
  const wa = number('wa');
  const h0 = number('h0', { min: 0, exclusiveMin: true, fix: 'give H0 in km/s/Mpc, e.g. 70' });
  const alpha = number('alpha');
  const beta = number('beta');
  const absMag = number('abs_mag');
  const massStep = number('mass_step');
  // log10 host masses of galaxies lie between about 6 and 13 (common practice, as in the run configuration).
  const split = number('split_log_mass', { min: 6, max: 13 });
  const sigmaInt = number('sigma_int', { min: 0 });

  const need = (key: string, why: string): void => {
    if (fields.has(key)) return;
    reader.report({ node: null, path: `${at.path}.${key}`, anchor: at.node }, 'config.missing_key', `${why} needs ${key}`, {
      expected: `a value for ${at.path}.${key}`, found: 'nothing', fix: `add "${key}: ..." to the truth`,
    });
  };
  const unused = (key: string, why: string): void => {
    const value = fields.get(key);
    if (!value) return;
    reader.report(value, 'config.unused_setting', `${key} is not used ${why}`, { severity: 'warning', fix: `remove ${key}` });
  };
  if (curvature === 'free') need('omega_de', 'curvature: free');
  else unused('omega_de', 'with curvature: flat (Omega_DE = 1 - Omega_m)');
  if (darkEnergy === 'constant_w' || darkEnergy === 'cpl') need('w0', `dark_energy: ${darkEnergy}`);
  if (darkEnergy === 'cpl') need('wa', 'dark_energy: cpl');
  if (darkEnergy === 'lambda') unused('w0', 'with dark_energy: lambda (w = -1)');
  if (darkEnergy && darkEnergy !== 'cpl') unused('wa', `with dark_energy: ${darkEnergy} (wa = 0)`);

  const errorsAfter = reader.issues.filter((issue) => issue.severity !== 'warning').length;
  if (errorsAfter > errorsBefore || !darkEnergy || omegaMatter === undefined || alpha === undefined || beta === undefined ||
    absMag === undefined || sigmaInt === undefined) return undefined;
  return {
    darkEnergy,
    curvature,
    omegaMatter,
    omegaDarkEnergy: curvature === 'free' ? (omegaDarkEnergy ?? null) : null,
    w0: darkEnergy === 'lambda' ? -1 : (w0 as number),
    wa: darkEnergy === 'cpl' ? (wa as number) : 0,
    h0KmPerSPerMpc: h0 ?? DEFAULT_SURVEY_TRUTH.h0KmPerSPerMpc,
    alpha,
    beta,
    absMagMag: absMag,
    massStepMag: massStep ?? DEFAULT_SURVEY_TRUTH.massStepMag,
    splitLogMass: split ?? DEFAULT_SURVEY_TRUTH.splitLogMass,
    sigmaIntMag: sigmaInt,
  };
}
