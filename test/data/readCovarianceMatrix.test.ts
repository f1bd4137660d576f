import { describe, expect, it } from 'vitest';
import { checkPositiveDefinite, readCovarianceMatrix, readSupernovaTable, subsetCovariance, type CovarianceReadOptions } from '../../src/data/index.js';
import { isCandelaError, type Issue } from '../../src/errors.js';

const FIXTURES = 'test/fixtures/data';
const REAL = '../shared/data-real';

function problems(read: CovarianceReadOptions): Issue[] {
  try {
    readCovarianceMatrix(read);
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

const fixture = (file: string, expectedSupernovae: number, extra: Partial<CovarianceReadOptions> = {}): CovarianceReadOptions => ({
  file: `${FIXTURES}/${file}`, displayName: file, target: 'magnitudes', expectedSupernovae, scale: 1, ...extra,
});

describe('readCovarianceMatrix on the Pantheon binned systematic matrix (Scolnic et al. 2018)', () => {
  const read = () => readCovarianceMatrix({ file: `${REAL}/pantheon2018/Binned_data/sys_DS17f.txt`, target: 'magnitudes', expectedSupernovae: 40, scale: 1 });

  it('reads the dimension line and 1600 values row by row, symmetric', () => {
    const cov = read();
    expect(cov.size).toBe(40); // SOURCE.md: first line N = 40, then 1600 values
    expect(cov.values[0]).toBe(0.000455); // second line of the file
    expect(cov.values[1]).toBe(0.000260445); // third line of the file
    for (let i = 0; i < 40; i++) for (let j = 0; j < 40; j++) expect(cov.values[i * 40 + j]).toBe(cov.values[j * 40 + i]); // SOURCE.md: exactly symmetric
    const diagonal = Array.from({ length: 40 }, (_, i) => cov.values[i * 41]);
    // SOURCE.md: diagonal 3.6e-5 ... 3.6e-3 mag^2 (two significant digits)
    expect(Math.min(...diagonal)).toBeGreaterThan(3.5e-5);
    expect(Math.max(...diagonal)).toBeLessThan(3.7e-3);
  });

  it('is positive definite alone and after adding diag(dmb^2) of the binned table', () => {
    const cov = read();
    const { table } = readSupernovaTable({
      file: `${REAL}/pantheon2018/Binned_data/lcparam_DS17f.txt`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' },
    });
    const err = table.magnitudeErr as Float64Array;
    // SOURCE.md: smallest eigenvalue 4.3e-7 > 0, total covariance = diag(dmb^2) + sys
    expect(checkPositiveDefinite(cov.values, 40, null, 'sys_DS17f.txt')).toBeNull();
    expect(checkPositiveDefinite(cov.values, 40, err.map((e) => e * e), 'sys_DS17f.txt', table.ids)).toBeNull();
  });

  it('multiplies by the scale factor', () => {
    const cov = readCovarianceMatrix({ file: `${REAL}/pantheon2018/Binned_data/sys_DS17f.txt`, target: 'magnitudes', expectedSupernovae: 40, scale: 2 });
    expect(cov.values[0]).toBe(0.00091);
  });
});

describe('readCovarianceMatrix light-curve layouts', () => {
  // canonical order (m_B1, x1_1, c_1, m_B2, x1_2, c_2); the fixture stores K[i][j] = 10 (min(i,j)+1) + (max(i,j)+1)
  // of canonical indices, written in grouped layout with block order (color, m_b, x1): file rows c1, c2, mB1, mB2, x1_1, x1_2.
  it('reorders a grouped 3N x 3N file with another block order to canonical interleaved order', () => {
    const cov = readCovarianceMatrix(fixture('cov-grouped-3n.txt', 2, { target: 'light_curves', layout: 'grouped', blockOrder: ['color', 'm_b', 'x1'] }));
    expect(cov.size).toBe(6);
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) expect(cov.values[i * 6 + j]).toBe(10 * (Math.min(i, j) + 1) + Math.max(i, j) + 1);
    expect(cov.values[0]).toBe(11); // hand check: canonical (mB1, mB1) is the file's row 3, column 3 (= 11)
    expect(cov.values[5]).toBe(16); // (mB1, c2) is file row 3, column 2 (= 16)
  });

  it('reorders interleaved blocks stored as (color, x1, m_b)', () => {
    // one supernova, file order (c, x1, mB) with var(c) = 1, var(x1) = 4, var(mB) = 9, cov(c, mB) = 0.5
    const path = `${FIXTURES}/cov-interleaved-cxm.txt`;
    const cov = readCovarianceMatrix({ file: path, target: 'light_curves', expectedSupernovae: 1, scale: 1, blockOrder: ['color', 'x1', 'm_b'] });
    expect(Array.from(cov.values)).toEqual([9, 0, 0.5, 0, 4, 0, 0.5, 0, 1]);
  });

  it('extracts the rows of kept supernovae, three per supernova for light curves', () => {
    const cov = readCovarianceMatrix(fixture('cov-grouped-3n.txt', 2, { target: 'light_curves', layout: 'grouped', blockOrder: ['color', 'm_b', 'x1'] }));
    const second = subsetCovariance(cov, Int32Array.of(1));
    expect(second.size).toBe(3);
    expect(Array.from(second.values)).toEqual([44, 45, 46, 45, 55, 56, 46, 56, 66]);
  });
});

describe('readCovarianceMatrix reports bad input', () => {
  it('a value count that is not a square number', () => {
    const [issue] = problems(fixture('cov-not-square.txt', 2));
    expect(issue).toMatchObject({ code: 'covariance.not_square', file: 'cov-not-square.txt', found: '5' });
    expect(issue.fix).toBeTruthy();
  });

  it('rows of unequal length', () => {
    const [issue] = problems(fixture('cov-unequal-rows.txt', 2));
    expect(issue).toMatchObject({ code: 'covariance.not_square', file: 'cov-unequal-rows.txt', line: 2, found: '3 values' });
  });

  it('a size that does not fit the table, naming expected N and found', () => {
    const [issue] = problems(fixture('cov-wrong-size.txt', 2));
    expect(issue).toMatchObject({ code: 'covariance.wrong_size', file: 'cov-wrong-size.txt', expected: '2 x 2 (N for target magnitudes)', found: '3 x 3' });
    const [light] = problems(fixture('cov-wrong-size.txt', 2, { target: 'light_curves' }));
    expect(light.expected).toBe('6 x 6 (3N for target light_curves)');
  });

  it('an asymmetric matrix, naming the worst pair, both values and the tolerance', () => {
    const [issue] = problems(fixture('cov-not-symmetric.txt', 3));
    expect(issue).toMatchObject({
      code: 'covariance.not_symmetric', file: 'cov-not-symmetric.txt', row: 2, column: 3,
      expected: 'relative difference <= 1e-8', found: 'C[2,3] = 0.004, C[3,2] = 0.001',
    });
    expect(issue.message).toContain('by 0.300 of sqrt(C_ii C_jj)'); // |0.004 - 0.001| / sqrt(0.01 * 0.01)
  });

  it('a non-numeric entry with its line and column', () => {
    const [issue] = problems(fixture('cov-non-numeric.txt', 2));
    expect(issue).toMatchObject({ code: 'covariance.non_numeric', file: 'cov-non-numeric.txt', line: 4, column: 1, found: 'abc' });
  });

  it('a matrix that is not positive definite, naming the row, supernova and pivot', () => {
    const cov = readCovarianceMatrix(fixture('cov-not-positive-definite.txt', 2));
    const issue = checkPositiveDefinite(cov.values, 2, null, 'cov-not-positive-definite.txt', ['sn-a', 'sn-b']);
    // [[1, 2], [2, 1]]: second pivot 1 - 2^2 = -3 (by hand)
    expect(issue).toMatchObject({ code: 'covariance.not_positive_definite', file: 'cov-not-positive-definite.txt', row: 2, found: 'pivot -3.000' });
    expect(issue?.message).toContain('(supernova sn-b)');
    expect(issue?.fix).toBeTruthy();
    // adding 4 to the diagonal makes it [[5, 2], [2, 5]], positive definite
    expect(checkPositiveDefinite(cov.values, 2, Float64Array.of(4, 4), 'x')).toBeNull();
  });

  it('a non-positive scale', () => {
    expect(problems(fixture('cov-not-positive-definite.txt', 2, { scale: 0 }))[0]).toMatchObject({ code: 'covariance.bad_option', path: 'scale' });
  });
});
