/**
 * `samples` of a survey description: one entry per programme, with its
 * redshift range, populations, error models and calibration offset.
 */
import type { SurveyErrorLine, SurveySample } from './surveyDescription.js';
import type { ConfigReader, Located } from './configReader.js';
import { LABEL_PATTERN } from './readLabel.js';
import { DEFAULT_SURVEY_SAMPLE } from './surveyDefaults.js';
import { surveyMissingKey } from './surveyMissingKey.js';

/** Keys of one sample, in documentation order. */
export const SURVEY_SAMPLE_KEYS = ['label', 'count', 'redshift', 'stretch', 'color', 'host_log_mass', 'errors', 'calibration_offset_mag'] as const;
const REQUIRED = ['label', 'count', 'redshift', 'stretch', 'color', 'host_log_mass', 'errors'] as const;
/** Redshift ceiling of a design: beyond it supernova light curves are out of reach and distances need care (common practice). */
export const SURVEY_MAX_REDSHIFT = 10;
/** A correlation coefficient strictly inside (-1, 1). */
const CORRELATION_RULE = { min: -1, max: 1, exclusiveMin: true, exclusiveMax: true, fix: 'give a correlation coefficient strictly between -1 and 1' };

/**
 * Reads every sample: labels unique and safe for file and parameter names,
 * count an integer >= 1, 0 < min < max <= SURVEY_MAX_REDSHIFT, population
 * widths and error slopes such that every sigma is positive over the
 * range, correlations in (-1, 1) that together form a positive-definite
 * matrix. Problems go to the reader.
 * @param reader the document reader.
 * @param at the `samples` value (a list).
 * @returns the samples that could be read in full.
 * @example readSurveySamples(reader, at).map((s) => s.label) // ['harbor', 'meridian', 'abyss']
 */
export function readSurveySamples(reader: ConfigReader, at: Located): SurveySample[] {
  const items = reader.list(at) ?? [];
  if (at.node !== null && items.length === 0 && !reader.failedAt(at.path)) {
    reader.report(at, 'config.empty_list', 'samples lists no sample', {
      expected: 'at least one sample', found: 'an empty list', fix: 'add a sample with label, count, redshift, populations and errors',
    });
  }
  const seen = new Set<string>();
  const samples: SurveySample[] = [];
  for (const item of items) {
    const sample = readSample(reader, item, seen);
    if (sample) samples.push(sample);
  }
  return samples;
}

function errorCount(reader: ConfigReader): number {
  return reader.issues.filter((issue) => issue.severity !== 'warning').length;
}

function readSample(reader: ConfigReader, item: Located, seen: Set<string>): SurveySample | undefined {
  const fields = reader.mapping(item, SURVEY_SAMPLE_KEYS);
  surveyMissingKey(reader, item, fields, REQUIRED);
  if (!fields) return undefined;
  const before = errorCount(reader);
  const label = reader.text(fields.get('label'), { numbersAsText: true });
  if (typeof label === 'string') {
    if (!LABEL_PATTERN.test(label)) {
      reader.report(fields.get('label')!, 'config.bad_label', `label "${label}" cannot name files and parameters`, {
        expected: 'letters, digits, "_", "." or "-", starting with a letter or digit', found: `"${label}"`,
        fix: `write e.g. "${label.replace(/[^A-Za-z0-9_.-]+/g, '_').replace(/^[_.-]+/, '') || 'sample'}"`,
      });
    } else if (seen.has(label)) {
      reader.report(fields.get('label')!, 'config.duplicate_label', `sample label "${label}" is used twice`, {
        expected: 'a label used once', found: `"${label}"`, fix: 'give each sample its own label',
      });
    }
    seen.add(label);
  }
  const count = reader.number(fields.get('count'), { integer: true, min: 1, fix: 'give the number of supernovae, an integer >= 1' });
  const redshift = readRedshift(reader, fields.get('redshift'));
  const stretch = readPopulation(reader, fields.get('stretch'), ['mean', 'sd']);
  const color = readPopulation(reader, fields.get('color'), ['mean', 'sd']);
  const mass = readPopulation(reader, fields.get('host_log_mass'), ['mean', 'sd', 'error']);
  const errors = readErrors(reader, fields.get('errors'), redshift);
  const calibration = reader.number(fields.get('calibration_offset_mag'), { min: 0 }) ?? DEFAULT_SURVEY_SAMPLE.calibrationOffsetMag;
  if (errorCount(reader) > before || typeof label !== 'string' || count === undefined || !redshift || !stretch || !color || !mass || !errors) {
    return undefined;
  }
  return {
    label, count, redshift,
    stretch: { mean: stretch.mean, sd: stretch.sd },
    color: { mean: color.mean, sd: color.sd },
    hostLogMass: { mean: mass.mean, sd: mass.sd, errorDex: mass.error ?? 0 },
    errors, calibrationOffsetMag: calibration,
  };
}

function readRedshift(reader: ConfigReader, at: Located | undefined): SurveySample['redshift'] | undefined {
  if (!at) return undefined;
  const fields = reader.mapping(at, ['min', 'max', 'shape']);
  surveyMissingKey(reader, at, fields, ['min', 'max']);
  if (!fields) return undefined;
  const min = reader.number(fields.get('min'), { min: 0, exclusiveMin: true, fix: 'give a redshift above 0, e.g. 0.01' });
  const max = reader.number(fields.get('max'), { min: 0, exclusiveMin: true, max: SURVEY_MAX_REDSHIFT });
  const shape = reader.choice(fields.get('shape'), ['volume', 'uniform'] as const) ?? DEFAULT_SURVEY_SAMPLE.shape;
  if (min === undefined || max === undefined) return undefined;
  if (!(min < max)) {
    reader.report(fields.get('min')!, 'survey.redshift_range', 'the redshift range is empty: min must be below max', {
      expected: 'min < max', found: `min: ${min}, max: ${max}`, fix: 'swap min and max, or widen the range',
    });
    return undefined;
  }
  return { min, max, shape };
}

function readPopulation(reader: ConfigReader, at: Located | undefined, keys: readonly string[]): Record<string, number> & { mean: number; sd: number; error?: number } | undefined {
  if (!at) return undefined;
  const fields = reader.mapping(at, keys);
  surveyMissingKey(reader, at, fields, ['mean', 'sd']);
  if (!fields) return undefined;
  const mean = reader.number(fields.get('mean'));
  const sd = reader.number(fields.get('sd'), { min: 0 });
  const error = reader.number(fields.get('error'), { min: 0 });
  if (mean === undefined || sd === undefined) return undefined;
  return error === undefined ? { mean, sd } : { mean, sd, error };
}

function readErrors(reader: ConfigReader, at: Located | undefined, redshift: SurveySample['redshift'] | undefined): SurveySample['errors'] | undefined {
  if (!at) return undefined;
  const fields = reader.mapping(at, ['m_b', 'x1', 'color', 'correlations']);
  surveyMissingKey(reader, at, fields, ['m_b', 'x1', 'color']);
  if (!fields) return undefined;
  const line = (key: string): SurveyErrorLine | undefined => {
    const entry = fields.get(key);
    if (!entry) return undefined;
    const parts = reader.mapping(entry, ['base', 'per_z']);
    surveyMissingKey(reader, entry, parts, ['base']);
    if (!parts) return undefined;
    const base = reader.number(parts.get('base'), { min: 0 });
    const perRedshift = reader.number(parts.get('per_z')) ?? 0;
    if (base === undefined) return undefined;
    const ends = redshift ? [redshift.min, redshift.max] : [];
    const worst = Math.min(...ends.map((z) => base + perRedshift * z));
    if (ends.length > 0 && !(worst > 0)) {
      reader.report(entry, 'survey.error_not_positive', `the ${key} error is not positive everywhere in the redshift range`, {
        expected: 'base + per_z z > 0 for min <= z <= max', found: `${worst} at one end`, fix: 'raise base, or use a per_z slope that keeps the error positive',
      });
      return undefined;
    }
    return { base, perRedshift };
  };
  const peakMag = line('m_b');
  const stretch = line('x1');
  const color = line('color');
  const correlations = readCorrelations(reader, fields.get('correlations'));
  if (!peakMag || !stretch || !color || !correlations) return undefined;
  return { peakMagMag: peakMag, stretch, colorMag: color, correlations };
}

function readCorrelations(reader: ConfigReader, at: Located | undefined): SurveySample['errors']['correlations'] | undefined {
  const zero = DEFAULT_SURVEY_SAMPLE.correlation;
  if (!at) return { peakMagStretch: zero, peakMagColor: zero, stretchColor: zero };
  const fields = reader.mapping(at, ['m_b_x1', 'm_b_color', 'x1_color']);
  if (!fields) return undefined;
  const read = (key: string): number | null => (fields.has(key) ? reader.number(fields.get(key), CORRELATION_RULE) ?? null : zero);
  const a = read('m_b_x1');
  const b = read('m_b_color');
  const c = read('x1_color');
  if (a === null || b === null || c === null) return undefined;
  // A 3 x 3 correlation matrix with unit diagonal is positive definite when its
  // leading minors are: 1 - a^2 > 0 (given) and det = 1 + 2abc - a^2 - b^2 - c^2 > 0.
  const determinant = 1 + 2 * a * b * c - a * a - b * b - c * c;
  if (!(determinant > 0)) {
    reader.report(at, 'survey.correlations_inconsistent', 'the three correlations cannot hold together: their matrix is not positive definite', {
      expected: '1 + 2 rho_mx rho_mc rho_xc - rho_mx^2 - rho_mc^2 - rho_xc^2 > 0', found: `${determinant.toPrecision(3)}`,
      fix: 'reduce the size of one of the correlations',
    });
    return undefined;
  }
  return { peakMagStretch: a, peakMagColor: b, stretchColor: c };
}
