import { describe, expect, it } from 'vitest';
import { choleskyInPlace, choleskySolveInPlace, createRandomStream } from '../../src/math/index.js';
import { createLowRankWhitener, gaussianLogLikelihood } from '../../src/likelihood/index.js';

// Contract of the Woodbury path: equal to the dense computation within 1e-8 relative.
const RELATIVE_AGREEMENT = 1e-8;

/** Seeded D (0.01..0.04 mag^2), U (K modes, 0.01..0.1 mag) and the dense D + U U^T. */
function problem(size: number, modeCount: number, seed: string) {
  const rng = createRandomStream(seed);
  const diagonalVariance = Float64Array.from({ length: size }, () => (0.1 + 0.1 * rng.uniform()) ** 2);
  const modes = Float64Array.from({ length: size * modeCount }, () => 0.05 * rng.normal());
  const dense = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      let sum = i === j ? diagonalVariance[i] : 0;
      for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] * modes[j * modeCount + k];
      dense[i * size + j] = sum;
    }
  }
  return { diagonalVariance, modes, dense, rng };
}

/** C^-1 by Cholesky solves of the unit vectors (the dense reference; Golub & Van Loan algorithm 4.2.1). */
function denseInverse(dense: Float64Array, size: number): Float64Array {
  const factor = Float64Array.from(dense);
  expect(choleskyInPlace(factor, size).ok).toBe(true);
  const inverse = new Float64Array(size * size);
  const unit = new Float64Array(size);
  for (let j = 0; j < size; j++) {
    unit.fill(0);
    unit[j] = 1;
    choleskySolveInPlace(factor, size, unit);
    for (let i = 0; i < size; i++) inverse[i * size + j] = unit[i];
  }
  return inverse;
}

/** Largest |(W^T W - C^-1)_ij| relative to the largest |C^-1_ij|, W from whitening the unit vectors. */
function worstGramError(whiten: (v: Float64Array) => void, inverse: Float64Array, size: number): number {
  const columns = Array.from({ length: size }, (_, j) => {
    const unit = new Float64Array(size);
    unit[j] = 1;
    whiten(unit);
    return unit;
  });
  let scale = 0;
  let worst = 0;
  for (let i = 0; i < size; i++) {
    for (let j = 0; j < size; j++) {
      let gram = 0;
      for (let k = 0; k < size; k++) gram += columns[i][k] * columns[j][k];
      scale = Math.max(scale, Math.abs(inverse[i * size + j]));
      worst = Math.max(worst, Math.abs(gram - inverse[i * size + j]));
    }
  }
  return worst / scale;
}

describe('createLowRankWhitener', () => {
  it('whitens the 2 x 2 example worked by hand: |W r|^2 = r^T C^-1 r = 0.5', () => {
    // D = diag(1, 4), U = (1, 2)^T: C = [[2, 2], [2, 8]], C^-1 = [[8, -2], [-2, 2]] / 12 (2 x 2 inverse formula, by hand).
    const whitener = createLowRankWhitener({ diagonalVariance: Float64Array.of(1, 4), modes: Float64Array.of(1, 2) });
    const r = Float64Array.of(1, 1);
    whitener.whitenInPlace(r);
    expect(r[0] * r[0] + r[1] * r[1]).toBeCloseTo(0.5, 14);
    expect(whitener.logDeterminant).toBeCloseTo(Math.log(12), 14);
  });

  it('has W^T W = C^-1 on N = 60, K = 5 within 1e-8 relative to the dense Cholesky inverse', () => {
    const { diagonalVariance, modes, dense } = problem(60, 5, 'whitener-gram');
    const whitener = createLowRankWhitener({ diagonalVariance, modes });
    expect(worstGramError((v) => whitener.whitenInPlace(v), denseInverse(dense, 60), 60)).toBeLessThanOrEqual(RELATIVE_AGREEMENT);
  });

  it('gives the dense chi^2 and ln det C on N = 300, K = 10 within 1e-8 relative', () => {
    // Reference: the general dense path (gaussianLogLikelihood on the explicitly formed D + U U^T).
    const { diagonalVariance, modes, dense, rng } = problem(300, 10, 'whitener-chi2');
    const residual = Float64Array.from({ length: 300 }, () => 0.2 * rng.normal());
    const reference = gaussianLogLikelihood(residual, dense);
    const whitener = createLowRankWhitener({ diagonalVariance, modes });
    const whitened = Float64Array.from(residual);
    whitener.whitenInPlace(whitened);
    const chiSquare = whitened.reduce((sum, value) => sum + value * value, 0);
    expect(Math.abs(chiSquare - reference.chiSquare)).toBeLessThanOrEqual(RELATIVE_AGREEMENT * reference.chiSquare);
    expect(Math.abs(whitener.logDeterminant - reference.logDeterminant)).toBeLessThanOrEqual(RELATIVE_AGREEMENT * Math.abs(reference.logDeterminant));
  });

  it('handles linearly dependent modes (a repeated mode and more modes than points)', () => {
    // C = D + U U^T is unchanged by splitting a mode u into two copies u / sqrt(2): same dense reference.
    const { diagonalVariance, modes, dense } = problem(8, 3, 'whitener-dependent');
    const split = new Float64Array(8 * 12);
    for (let i = 0; i < 8; i++) {
      for (let k = 0; k < 3; k++) for (let copy = 0; copy < 4; copy++) split[i * 12 + 4 * k + copy] = modes[i * 3 + k] / 2;
    }
    const whitener = createLowRankWhitener({ diagonalVariance, modes: split });
    expect(whitener.modeCount).toBe(12);
    expect(worstGramError((v) => whitener.whitenInPlace(v), denseInverse(dense, 8), 8)).toBeLessThanOrEqual(RELATIVE_AGREEMENT);
  });
});
