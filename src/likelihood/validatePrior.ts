import type { Issue } from '../errors.js';
import { PRIOR_KINDS, type Prior } from './prior.js';
import { truncatedNormalMass } from './truncatedNormal.js';

/** Smallest probability a truncated Gaussian's interval may hold (below it the density is numerically meaningless). */
const MIN_TRUNCATED_MASS = 1e-300;

/**
 * Checks a prior and returns the problems found (empty list = valid):
 * known kind; finite numbers; min < max; sd > 0; 0 < min for log-uniform;
 * a truncated Gaussian whose interval holds non-negligible probability.
 *
 * Cost: O(1). Never throws; problems are returned as issues with code
 * `prior.*` and `path` (`path.min`, `path.sd`, ...).
 * @param prior the prior to check (possibly from untrusted input)
 * @param path key path used in the issues, e.g. `parameters.omega_m.prior`
 * @example validatePrior({ kind: 'uniform', min: 1, max: 0 }, 'p') // one issue, code prior.empty_interval
 */
export function validatePrior(prior: Prior, path: string): Issue[] {
  const issues: Issue[] = [];
  const kind = (prior as { kind?: unknown }).kind;
  if (!PRIOR_KINDS.includes(kind as Prior['kind'])) {
    return [{ code: 'prior.unknown_kind', message: 'unknown prior kind', path: `${path}.kind`, expected: PRIOR_KINDS.join(', '), found: String(kind) }];
  }
  const record = prior as unknown as Record<string, unknown>;
  const fields = prior.kind === 'uniform' || prior.kind === 'log_uniform' ? ['min', 'max']
    : prior.kind === 'gaussian' ? ['mean', 'sd'] : ['mean', 'sd', 'min', 'max'];
  for (const field of fields) {
    const value = record[field];
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      issues.push({ code: 'prior.not_finite', message: `prior ${field} must be a finite number`, path: `${path}.${field}`, expected: 'a finite number', found: String(value) });
    }
  }
  if (issues.length) return issues;
  if ('sd' in prior && !(prior.sd > 0)) {
    issues.push({ code: 'prior.nonpositive_sd', message: 'prior standard deviation must be positive', path: `${path}.sd`, expected: '> 0', found: String(prior.sd) });
  }
  if ('min' in prior && !(prior.min < prior.max)) {
    issues.push({ code: 'prior.empty_interval', message: 'prior min must be below max', path: `${path}.min`, expected: `< ${prior.max}`, found: String(prior.min) });
  }
  if (prior.kind === 'log_uniform' && !(prior.min > 0)) {
    issues.push({ code: 'prior.log_uniform_nonpositive', message: 'a log-uniform prior needs min > 0', path: `${path}.min`, expected: '> 0', found: String(prior.min), fix: 'use a uniform prior, or a positive lower bound' });
  }
  if (prior.kind === 'truncated_gaussian' && issues.length === 0) {
    const mass = truncatedNormalMass((prior.min - prior.mean) / prior.sd, (prior.max - prior.mean) / prior.sd);
    if (!(mass > MIN_TRUNCATED_MASS)) {
      issues.push({ code: 'prior.negligible_mass', message: 'the truncation interval holds almost none of the Gaussian', path, expected: `probability > ${MIN_TRUNCATED_MASS}`, found: String(mass), fix: 'move the interval towards the mean or widen sd' });
    }
  }
  return issues;
}
