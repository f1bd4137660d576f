import { CandelaError } from '../errors.js';
import { checkPositiveDefinite } from './checkPositiveDefinite.js';
import { createIssueList } from './issueList.js';
import { parseMatrixText } from './parseMatrixText.js';
import { readTextLines } from './readTextLines.js';

/** Largest |C_ij - C_ji| / sqrt(C_ii C_jj) accepted as symmetric (rounding in a printed file; common practice). */
export const MEASUREMENT_SYMMETRY_TOLERANCE = 1e-6;

/**
 * Reads the covariance of a small vector of measurements (a BAO table, a
 * compressed CMB prior): a square matrix in any layout parseMatrixText
 * accepts, which must be `size` x `size`, symmetric and positive definite.
 * Cost: O(size^3) for the positive-definiteness check.
 * @param file path to read.
 * @param displayName the path as the user wrote it, for messages.
 * @param size number of measurements the matrix must cover.
 * @param what what the rows are, for messages ('BAO measurements').
 * @returns the row-major matrix.
 * @throws CandelaError naming the file, the row and the fix: unreadable, wrong size, asymmetric, not positive definite.
 * @example readMeasurementCovariance('../shared/data-real/desi-dr2-bao/covariance.txt', 'covariance.txt', 13, 'BAO measurements')[0] // 0.005625
 */
export function readMeasurementCovariance(file: string, displayName: string, size: number, what: string): Float64Array {
  const issues = createIssueList();
  const parsed = parseMatrixText(readTextLines(file, displayName), displayName, issues);
  if (!parsed || issues.hasErrors()) throw new CandelaError(issues.finish());
  if (parsed.size !== size) {
    throw new CandelaError({
      code: 'covariance.wrong_size', file: displayName,
      message: `the covariance is ${parsed.size} x ${parsed.size} but there are ${size} ${what}`,
      expected: `${size} x ${size}, rows in the order of the table`, found: `${parsed.size} x ${parsed.size}`,
      fix: 'give the covariance of exactly the rows of the table, in the same order',
    });
  }
  const values = parsed.values;
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < i; j++) {
      const scale = Math.sqrt(Math.abs(values[i * size + i] * values[j * size + j])) || 1;
      if (Math.abs(values[i * size + j] - values[j * size + i]) > MEASUREMENT_SYMMETRY_TOLERANCE * scale) {
        throw new CandelaError({
          code: 'covariance.not_symmetric', file: displayName, row: i + 1,
          message: `the covariance is not symmetric: entry (${i + 1}, ${j + 1}) = ${values[i * size + j]} but (${j + 1}, ${i + 1}) = ${values[j * size + i]}`,
          expected: 'C_ij = C_ji', found: `${values[i * size + j]} vs ${values[j * size + i]}`,
          fix: 'check the file for a transposed block or a typo in one of the two entries',
        });
      }
    }
  }
  const notDefinite = checkPositiveDefinite(values, size, null, displayName);
  if (notDefinite) throw new CandelaError({ ...notDefinite, fix: `check the variances on the diagonal and the correlations of the ${what} (|r| < 1)` });
  return values;
}
