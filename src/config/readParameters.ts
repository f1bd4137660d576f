/**
 * `parameters` (and `models[].parameters`): a prior or a fixed value per
 * parameter name. Impossible priors are errors here, before any sampling.
 */
import { isScalar } from 'yaml';
import type { ParameterSpec, PriorSpec } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { closestWord } from '../math/index.js';
import { PARAMETERS, isPhysicalValue, parseParameterName, physicalRangeText } from '../parameters/index.js';

const ENTRY_KEYS = ['prior', 'min', 'max', 'mean', 'sd', 'fixed'] as const;
const PRIOR_KINDS = ['uniform', 'gaussian', 'truncated_gaussian', 'log_uniform'] as const;
const PRIOR_KEYS: Readonly<Record<PriorSpec['kind'], readonly string[]>> = {
  uniform: ['min', 'max'],
  gaussian: ['mean', 'sd'],
  truncated_gaussian: ['mean', 'sd', 'min', 'max'],
  log_uniform: ['min', 'max'],
};

/**
 * A truncated Gaussian whose interval lies farther than this many standard
 * deviations from its mean keeps less than 1e-23 of its mass: almost surely a
 * typo (e.g. mean and bounds in different units), and its normalization
 * loses all precision.
 */
export const TRUNCATION_MAX_DISTANCE_SD = 10;

/**
 * Reads a block of parameter entries. Unknown names get "did you mean";
 * omega_k is rejected (it is derived from omega_m and omega_de).
 * @param reader the document reader.
 * @param at the block (absent: empty).
 * @returns name -> spec for every entry that is valid.
 * @example readParameters(reader, at) // { h0: { mode: 'fixed', value: 70 } }
 */
export function readParameters(reader: ConfigReader, at: Located | undefined): Record<string, ParameterSpec> {
  const block: Record<string, ParameterSpec> = {};
  for (const [name, value] of reader.mapping(at, null) ?? []) {
    const parsed = parseParameterName(name);
    if (!parsed) {
      reader.unknownKey({ ...value, node: value.anchor }, name, Object.keys(PARAMETERS).filter((key) => !PARAMETERS[key].derivedOnly), 'parameter');
      continue;
    }
    if (PARAMETERS[parsed.base].derivedOnly) {
      reader.report({ ...value, node: value.anchor }, 'config.derived_parameter', `${name} is derived, never sampled or fixed`, {
        expected: 'a parameter that can be sampled', found: `"${name}"`,
        fix: 'to fit curvature set curvature: free in the model and give omega_de a prior; list omega_k under derived to report it',
      });
      continue;
    }
    const spec = readParameterSpec(reader, value, parsed.base);
    if (spec) block[name] = spec;
  }
  return block;
}

/**
 * Reads one entry `{ prior: kind, ... }` or `{ fixed: value }` and checks it
 * is possible: min < max, sd > 0, log_uniform above 0, a truncated Gaussian
 * with mass in its interval, bounds and fixed values inside the physical range.
 * @param base the base parameter name (for the physical range).
 * @returns the spec, or undefined after reporting why it is invalid.
 */
export function readParameterSpec(reader: ConfigReader, at: Located, base: string): ParameterSpec | undefined {
  if (at.node && isScalar(at.node) && typeof at.node.value === 'number') {
    reader.report(at, 'config.wrong_type', 'must say whether the value is fixed or has a prior', {
      expected: '{ fixed: value } or { prior: kind, ... }', found: reader.describe(at.node),
      fix: `write { fixed: ${reader.describe(at.node)} }`,
    });
    return undefined;
  }
  const fields = reader.mapping(at, ENTRY_KEYS);
  if (!fields) {
    if (at.node === null || reader.describe(at.node) === 'an empty value') {
      reader.missing({ node: null, path: `${at.path}.prior`, anchor: at.anchor }, 'prior');
    }
    return undefined;
  }
  const errorsBefore = reader.issues.length;
  if (fields.has('fixed')) {
    if (fields.has('prior')) {
      reader.report(fields.get('fixed')!, 'config.fixed_and_prior', 'both fixed and given a prior', {
        expected: 'either fixed: value or prior: ...', found: 'both', fix: 'remove fixed to sample it, or remove prior and its settings to hold it fixed',
      });
      return undefined;
    }
    for (const key of ['min', 'max', 'mean', 'sd']) rejectKey(reader, fields.get(key), key, 'a fixed value');
    const value = reader.number(fields.get('fixed'));
    if (value === undefined) return undefined;
    if (!isPhysicalValue(base, value)) {
      reader.report(fields.get('fixed')!, 'config.unphysical_value', `${base} is fixed outside its physical range`, {
        expected: physicalRangeText(base), found: String(value), fix: `fix ${base} at a value ${physicalRangeText(base)}`,
      });
      return undefined;
    }
    return reader.issues.length === errorsBefore ? { mode: 'fixed', value } : undefined;
  }
  if (!fields.has('prior')) {
    reader.missing({ node: null, path: `${at.path}.prior`, anchor: at.node }, 'prior');
    return undefined;
  }
  const kind = reader.choice(fields.get('prior'), PRIOR_KINDS);
  if (!kind) return undefined;
  for (const key of ['min', 'max', 'mean', 'sd']) {
    if (!PRIOR_KEYS[kind].includes(key)) rejectKey(reader, fields.get(key), key, `a ${kind} prior`);
  }
  for (const key of PRIOR_KEYS[kind]) if (!fields.has(key)) reader.missing({ node: null, path: `${at.path}.${key}`, anchor: at.node }, key);
  const number = (key: string): number => reader.number(fields.get(key)) ?? Number.NaN;
  const prior = buildPrior(kind, number);
  if (reader.issues.length !== errorsBefore || !prior) return undefined;
  return checkPrior(reader, at, base, prior) ? { mode: 'prior', prior } : undefined;
}

function buildPrior(kind: PriorSpec['kind'], number: (key: string) => number): PriorSpec | undefined {
  const prior: PriorSpec = kind === 'gaussian' ? { kind, mean: number('mean'), sd: number('sd') }
    : kind === 'truncated_gaussian' ? { kind, mean: number('mean'), sd: number('sd'), min: number('min'), max: number('max') }
      : { kind, min: number('min'), max: number('max') };
  return Object.values(prior).every((v) => typeof v === 'string' || Number.isFinite(v)) ? prior : undefined;
}

function checkPrior(reader: ConfigReader, at: Located, base: string, prior: PriorSpec): boolean {
  const fail = (message: string, expected: string, found: string, fix: string): false => {
    reader.report(at, 'config.bad_prior', message, { expected, found, fix });
    return false;
  };
  if ('sd' in prior && prior.sd <= 0) {
    return fail('the standard deviation must be positive', 'sd > 0', `sd: ${prior.sd}`, 'give sd a positive value');
  }
  if ('min' in prior && prior.min >= prior.max) {
    return fail('the lower bound must be below the upper bound', 'min < max', `min: ${prior.min}, max: ${prior.max}`,
      'swap min and max, or widen the interval');
  }
  if (prior.kind === 'log_uniform' && prior.min <= 0) {
    return fail('a log-uniform prior needs min > 0', 'min > 0', `min: ${prior.min}`,
      'raise min above 0 (e.g. 0.001), or use prior: uniform to include 0');
  }
  if (prior.kind === 'truncated_gaussian') {
    const distance = Math.max(prior.min - prior.mean, prior.mean - prior.max, 0) / prior.sd;
    if (distance > TRUNCATION_MAX_DISTANCE_SD) {
      return fail(`the interval [${prior.min}, ${prior.max}] lies ${distance.toFixed(0)} standard deviations from the mean`,
        `an interval within ${TRUNCATION_MAX_DISTANCE_SD} sd of the mean`, `mean: ${prior.mean}, sd: ${prior.sd}`,
        'check that mean, sd and the bounds use the same units');
    }
  }
  if ('min' in prior && (!isPhysicalValue(base, prior.min) || !isPhysicalValue(base, prior.max))) {
    return fail(`the prior reaches values where ${base} is unphysical`, `bounds ${physicalRangeText(base)}`,
      `min: ${prior.min}, max: ${prior.max}`, `keep both bounds ${physicalRangeText(base)}`);
  }
  return true;
}

function rejectKey(reader: ConfigReader, at: Located | undefined, key: string, what: string): void {
  if (!at) return;
  reader.report({ ...at, node: at.anchor }, 'config.key_not_for_prior', `${key} does not apply to ${what}`, {
    expected: 'only the settings of this kind of entry', found: `"${key}"`, fix: `remove ${key}`,
  });
}
