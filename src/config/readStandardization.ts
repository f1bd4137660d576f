/**
 * `standardization`: the Tripp (1998) relation, host-mass step, scatter terms
 * and how the magnitude offset is handled.
 */
import type { StandardizationOptions } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_STANDARDIZATION } from './defaults.js';

const KEYS = ['method', 'host_mass_step', 'scatter', 'alpha_beta_covariance', 'frozen_at', 'offset'] as const;
const STEP_KEYS = ['enabled', 'split_log_mass', 'shape', 'width_dex'] as const;
const SCATTER_KEYS = ['intrinsic', 'lensing_per_redshift', 'peculiar_velocity_km_s', 'redshift_errors'] as const;

/**
 * Reads the standardization block, filling defaults. `frozen_at` (alpha and
 * beta) is required when `alpha_beta_covariance: frozen`.
 * @param reader the document reader.
 * @param at the `standardization` value (absent: all defaults).
 * @example readStandardization(reader, at).scatter.lensingPerRedshift // 0.055
 */
export function readStandardization(reader: ConfigReader, at: Located): StandardizationOptions {
  const options = structuredClone(DEFAULT_STANDARDIZATION);
  const fields = reader.mapping(at, KEYS);
  if (!fields) return options;
  options.method = reader.choice(fields.get('method'), ['conventional', 'hierarchical'] as const) ?? options.method;

  const step = reader.mapping(fields.get('host_mass_step'), STEP_KEYS);
  if (step) {
    const hostStep = options.hostMassStep;
    hostStep.enabled = reader.boolean(step.get('enabled')) ?? hostStep.enabled;
    // log10 host masses of galaxies lie between about 6 and 13 (common practice).
    hostStep.splitLogMass = reader.number(step.get('split_log_mass'), { min: 6, max: 13 }) ?? hostStep.splitLogMass;
    hostStep.shape = reader.choice(step.get('shape'), ['sharp', 'logistic'] as const) ?? hostStep.shape;
    hostStep.widthDex = reader.number(step.get('width_dex'), { min: 0, exclusiveMin: true }) ?? hostStep.widthDex;
    if (step.has('width_dex') && hostStep.shape === 'sharp') {
      reader.report(step.get('width_dex')!, 'config.unused_setting', 'width_dex is used only with shape: logistic', {
        severity: 'warning', fix: 'set shape: logistic, or remove width_dex',
      });
    }
  }

  const scatter = reader.mapping(fields.get('scatter'), SCATTER_KEYS);
  if (scatter) {
    const terms = options.scatter;
    terms.intrinsic = reader.choice(scatter.get('intrinsic'), ['global', 'per_sample', 'off'] as const) ?? terms.intrinsic;
    terms.lensingPerRedshift = reader.number(scatter.get('lensing_per_redshift'), { min: 0, max: 1 }) ?? terms.lensingPerRedshift;
    // Bulk flows reach ~1000 km/s; larger values point at a unit mistake (m/s).
    terms.peculiarVelocityKmPerS = reader.number(scatter.get('peculiar_velocity_km_s'), {
      min: 0, max: 3000, fix: 'give the velocity dispersion in km/s, e.g. 250',
    }) ?? terms.peculiarVelocityKmPerS;
    terms.redshiftErrors = reader.boolean(scatter.get('redshift_errors')) ?? terms.redshiftErrors;
  }

  options.alphaBetaCovariance = reader.choice(fields.get('alpha_beta_covariance'), ['exact', 'frozen'] as const)
    ?? options.alphaBetaCovariance;
  const frozenAt = fields.get('frozen_at');
  const frozen = reader.mapping(frozenAt, ['alpha', 'beta'], ['alpha', 'beta']);
  if (frozen) {
    const alpha = reader.number(frozen.get('alpha'));
    const beta = reader.number(frozen.get('beta'));
    if (alpha !== undefined && beta !== undefined) options.frozenAt = { alpha, beta };
  }
  if (options.alphaBetaCovariance === 'frozen' && !frozenAt && !reader.failedAt(`${at.path}.alpha_beta_covariance`)) {
    reader.report({ node: null, path: `${at.path}.frozen_at`, anchor: fields.get('alpha_beta_covariance')!.node }, 'config.missing_key',
      'alpha_beta_covariance: frozen needs the alpha and beta at which the covariance is computed', {
        expected: 'frozen_at: { alpha: ..., beta: ... }', found: 'nothing',
        fix: 'add frozen_at: { alpha: 0.14, beta: 3.1 } (values near the expected best fit), or set alpha_beta_covariance: exact',
      });
  }
  if (frozenAt && options.alphaBetaCovariance === 'exact') {
    reader.report(frozenAt, 'config.unused_setting', 'frozen_at is used only with alpha_beta_covariance: frozen', {
      severity: 'warning', fix: 'remove frozen_at, or set alpha_beta_covariance: frozen',
    });
  }
  options.offset = reader.choice(fields.get('offset'), ['marginalize', 'sample'] as const) ?? options.offset;
  return options;
}
