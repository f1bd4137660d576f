import { parse } from 'yaml';
import { CandelaError } from '../../errors.js';
import { checkPositiveDefinite, readTextLines } from '../../data/index.js';
import { closestWord } from '../../math/index.js';

/** The quantities a compressed CMB prior may constrain. */
export const CMB_QUANTITIES = ['shift_parameter', 'acoustic_scale', 'omega_b_h2'] as const;
export type CmbQuantity = typeof CMB_QUANTITIES[number];

/** A Gaussian prior on compressed CMB quantities. */
export interface CmbPrior {
  quantities: CmbQuantity[];
  mean: Float64Array;
  /** Row-major covariance, quantities order. */
  covariance: Float64Array;
}

/**
 * Reads a compressed CMB prior: a YAML file with `quantities` (a list of
 * shift_parameter, acoustic_scale, omega_b_h2), `mean` (one number each) and
 * `covariance` (a square list of rows), symmetric and positive definite.
 * Cost: O(1).
 * @param file path; displayName as the user wrote it.
 * @throws CandelaError naming the file, the key and the fix.
 * @example readCmbPrior('data-external/planck2018-cmb-distance-prior.yaml', '...').quantities // ['shift_parameter', 'acoustic_scale', 'omega_b_h2']
 */
export function readCmbPrior(file: string, displayName: string): CmbPrior {
  const fail = (path: string, message: string, found: string, fix: string): never => {
    throw new CandelaError({ code: 'cmb.bad_prior', file: displayName, path, message, found, fix });
  };
  let document: unknown;
  try {
    document = parse(readTextLines(file, displayName).join('\n'));
  } catch (error) {
    if (error instanceof CandelaError) throw error;
    return fail('', `the file is not valid YAML: ${(error as Error).message.split('\n')[0]}`, 'unreadable YAML', 'write quantities, mean and covariance as YAML lists');
  }
  const record = (document ?? {}) as Record<string, unknown>;
  const quantities = record.quantities;
  if (!Array.isArray(quantities) || quantities.length === 0) fail('quantities', 'quantities must be a non-empty list', String(quantities), `list some of ${CMB_QUANTITIES.join(', ')}`);
  const names = (quantities as unknown[]).map((name, i) => {
    if (typeof name !== 'string' || !(CMB_QUANTITIES as readonly string[]).includes(name)) {
      const suggestion = typeof name === 'string' ? closestWord(name, CMB_QUANTITIES) : null;
      fail(`quantities[${i}]`, `unknown CMB quantity "${String(name)}"`, String(name), suggestion ? `did you mean "${suggestion}"?` : `use one of ${CMB_QUANTITIES.join(', ')}`);
    }
    return name as CmbQuantity;
  });
  if (new Set(names).size !== names.length) fail('quantities', 'a quantity is listed twice', names.join(', '), 'list each quantity once');
  const size = names.length;
  const mean = record.mean;
  if (!Array.isArray(mean) || mean.length !== size || !mean.every((v) => typeof v === 'number' && Number.isFinite(v))) {
    fail('mean', `mean must be a list of ${size} finite numbers, one per quantity`, JSON.stringify(mean), 'give one mean per quantity, in the same order');
  }
  const rows = record.covariance;
  if (!Array.isArray(rows) || rows.length !== size || !rows.every((row) => Array.isArray(row) && row.length === size && row.every((v) => typeof v === 'number' && Number.isFinite(v)))) {
    fail('covariance', `covariance must be ${size} rows of ${size} finite numbers`, JSON.stringify(rows), 'give the square covariance of the quantities, in their order');
  }
  const covariance = Float64Array.from((rows as number[][]).flat());
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < i; j++) {
      const a = covariance[i * size + j];
      const b = covariance[j * size + i];
      if (Math.abs(a - b) > 1e-9 * Math.sqrt(Math.abs(covariance[i * size + i] * covariance[j * size + j]))) {
        fail(`covariance[${i}][${j}]`, 'the covariance is not symmetric', `${a} vs ${b}`, 'make entry (i, j) equal to entry (j, i)');
      }
    }
  }
  const notDefinite = checkPositiveDefinite(covariance, size, null, displayName);
  if (notDefinite) throw new CandelaError({ ...notDefinite, fix: 'check the variances and that every correlation lies strictly between -1 and 1' });
  return { quantities: names, mean: Float64Array.from(mean as number[]), covariance };
}
