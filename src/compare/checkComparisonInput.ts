import type { Issue } from '../errors.js';
import type { ComparisonOptions, ModelFitRecord } from './modelComparison.js';

function finite(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/**
 * Every problem of a comparison's input, as issues (private helper of
 * compareModels): non-finite or missing numbers, duplicate labels, an unknown
 * base or pair label, models fitted to different data counts, pairs that are
 * not nested by parameter count. Paths look like `models[2].chiSquareMinimum`.
 */
export function checkComparisonInput(records: readonly ModelFitRecord[], options: ComparisonOptions): Issue[] {
  const issues: Issue[] = [];
  const bad = (path: string, expected: string, found: unknown, code = 'compare.invalid_record'): void => {
    issues.push({ code, path, message: `${path} cannot be used in a model comparison`, expected, found: String(found) });
  };
  if (records.length === 0) bad('models', 'at least one model', 0);
  const labels = new Set<string>();
  records.forEach((record, i) => {
    const at = `models[${i}]`;
    if (typeof record.label !== 'string' || record.label.length === 0) bad(`${at}.label`, 'a non-empty name', record.label);
    else if (labels.has(record.label)) bad(`${at}.label`, 'a name used once', record.label, 'compare.duplicate_label');
    else labels.add(record.label);
    if (!finite(record.chiSquareMinimum)) bad(`${at}.chiSquareMinimum`, 'a finite number', record.chiSquareMinimum);
    if (!finite(record.logLikelihoodMaximum)) bad(`${at}.logLikelihoodMaximum`, 'a finite number', record.logLikelihoodMaximum);
    if (!Number.isInteger(record.dataCount) || record.dataCount < 1) bad(`${at}.dataCount`, 'an integer >= 1', record.dataCount);
    if (!Number.isInteger(record.freeParameterCount) || record.freeParameterCount < 0) bad(`${at}.freeParameterCount`, 'an integer >= 0', record.freeParameterCount);
    if (record.devianceSamples !== undefined && !finite(record.devianceAtPosteriorMean)) {
      bad(`${at}.devianceAtPosteriorMean`, 'a finite number when devianceSamples are given', record.devianceAtPosteriorMean);
    }
    if (record.logZ !== undefined && (!finite(record.logZ) || !finite(record.logZError) || record.logZError < 0)) {
      bad(`${at}.logZ`, 'a finite ln Z with a finite error >= 0', `${record.logZ} +- ${record.logZError}`);
    }
  });
  const counts = new Set(records.map((record) => record.dataCount));
  if (counts.size > 1) {
    issues.push({
      code: 'compare.different_data',
      path: 'models',
      message: 'the models were fitted to different numbers of data points, so their criteria cannot be compared',
      expected: 'one data count',
      found: [...counts].join(', '),
    });
  }
  const known = [...labels].join(', ');
  if (!labels.has(options.baseLabel)) bad('baseLabel', `one of: ${known}`, options.baseLabel, 'compare.unknown_model');
  (options.nestedPairs ?? []).forEach((pair, i) => {
    const at = `nestedPairs[${i}]`;
    const base = records.find((record) => record.label === pair.base);
    const extended = records.find((record) => record.label === pair.extended);
    if (!base) bad(`${at}.base`, `one of: ${known}`, pair.base, 'compare.unknown_model');
    if (!extended) bad(`${at}.extended`, `one of: ${known}`, pair.extended, 'compare.unknown_model');
    if (base && extended && !(extended.freeParameterCount > base.freeParameterCount)) {
      bad(at, 'an extended model with more free parameters than its base', `${extended.freeParameterCount} vs ${base.freeParameterCount}`, 'compare.not_nested');
    }
    const sd = pair.savageDickey;
    if (sd && (!finite(sd.logBayesFactor) || !finite(sd.logBayesFactorError) || sd.logBayesFactorError < 0)) {
      bad(`${at}.savageDickey`, 'a finite ln B_01 with a finite error >= 0', `${sd.logBayesFactor} +- ${sd.logBayesFactorError}`);
    }
  });
  return issues;
}
