import { describe, expect, it } from 'vitest';
import { choleskyInPlace, choleskySolveInPlace, logDeterminantFromCholesky, compensatedSum, createRandomStream } from '../../src/math/index.js';

describe('choleskyInPlace', () => {
  it('factorizes the worked 3x3 example of Golub & Van Loan style (L computed by hand)', () => {
    // A = [[4,12,-16],[12,37,-43],[-16,-43,98]] has L = [[2,0,0],[6,1,0],[-8,5,3]] (common textbook example, checked by hand: L L^T = A).
    const a = Float64Array.of(4, 12, -16, 12, 37, -43, -16, -43, 98);
    const result = choleskyInPlace(a, 3);
    expect(result.ok).toBe(true);
    expect(Array.from(a)).toEqual([2, 0, 0, 6, 1, 0, -8, 5, 3]);
    expect(logDeterminantFromCholesky(a, 3)).toBeCloseTo(Math.log(36), 12); // det = (2*1*3)^2
    const b = Float64Array.of(1, 2, 3);
    choleskySolveInPlace(a, 3, b);
    // A x = b checked by multiplying back.
    const A = [[4, 12, -16], [12, 37, -43], [-16, -43, 98]];
    for (let i = 0; i < 3; i++) expect(A[i][0] * b[0] + A[i][1] * b[1] + A[i][2] * b[2]).toBeCloseTo(i + 1, 10);
  });
  it('reports the first non-positive pivot of an indefinite matrix', () => {
    const a = Float64Array.of(1, 2, 2, 1);
    const result = choleskyInPlace(a, 2);
    expect(result).toEqual({ ok: false, index: 1, pivot: -3 });
  });
});

describe('compensatedSum', () => {
  it('keeps the small terms that naive summation loses (Neumaier 1974 example)', () => {
    expect(compensatedSum(Float64Array.of(1, 1e100, 1, -1e100))).toBe(2);
  });
});

describe('createRandomStream', () => {
  it('is reproducible from a seed and resumable from a saved state', () => {
    const a = createRandomStream('seed-1');
    a.uniform();
    const saved = a.state();
    const next = [a.uniform(), a.normal(), a.integer(10)];
    const b = createRandomStream('ignored', saved);
    expect([b.uniform(), b.normal(), b.integer(10)]).toEqual(next);
    const c = createRandomStream('seed-1');
    c.uniform();
    expect(c.uniform()).toBe(next[0]);
  });
});
