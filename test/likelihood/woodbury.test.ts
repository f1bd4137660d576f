import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { createLowRankEvaluation, createLowRankGaussian, gaussianLogLikelihood } from '../../src/likelihood/index.js';

// Contract of the Woodbury path: equal to the dense computation within 1e-8 relative.
const RELATIVE_AGREEMENT = 1e-8;

/** Seeded D (variances 0.01..0.04 mag^2) and U (K modes of 0.01..0.1 mag: smooth ones and random ones). */
function lowRankProblem(size: number, modeCount: number, seed: string) {
  const rng = createRandomStream(seed);
  const diagonalVariance = Float64Array.from({ length: size }, () => (0.1 + 0.1 * rng.uniform()) ** 2);
  const modes = new Float64Array(size * modeCount);
  for (let k = 0; k < modeCount; k++) {
    const amplitude = 0.01 + 0.09 * rng.uniform();
    for (let i = 0; i < size; i++) {
      modes[i * modeCount + k] = k % 2 === 0 ? amplitude * Math.cos(((k + 1) * Math.PI * i) / size) : amplitude * rng.normal();
    }
  }
  const dense = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    dense[i * size + i] = diagonalVariance[i];
    for (let j = 0; j < size; j++) {
      let sum = 0;
      for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] * modes[j * modeCount + k];
      dense[i * size + j] += sum;
    }
  }
  const residual = Float64Array.from({ length: size }, () => 0.15 * rng.normal());
  return { diagonalVariance, modes, dense, residual };
}

function expectRelative(actual: number, expected: number, tolerance = RELATIVE_AGREEMENT): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tolerance * Math.abs(expected));
}

describe('createLowRankGaussian', () => {
  it('gives r^T C^-1 r and ln det C of a 2 x 2 example worked by hand', () => {
    // D = diag(1, 4), U = (1, 2)^T: C = [[2, 2], [2, 8]], det C = 12, C^-1 = [[8, -2], [-2, 2]] / 12,
    // so r = (1, 1) gives (8 - 2 - 2 + 2)/12 = 0.5 (2 x 2 inverse formula, worked by hand; exact up to rounding).
    const gaussian = createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 4), modes: Float64Array.of(1, 2) });
    expect(gaussian.chiSquare(Float64Array.of(1, 1))).toBeCloseTo(0.5, 14);
    expect(gaussian.logDeterminant).toBeCloseTo(Math.log(12), 14);
    // E = 1^T C^-1 1 = (8 - 2 - 2 + 2)/12 = 0.5 as well (same r).
    expect(gaussian.templatePrecision).toBeCloseTo(0.5, 14);
  });

  it('equals the dense Cholesky computation on N = 300, K = 10 within 1e-8 relative', () => {
    // Reference: the general dense path (Cholesky of the explicitly formed D + U U^T, gaussianLogLikelihood).
    const { diagonalVariance, modes, dense, residual } = lowRankProblem(300, 10, 'woodbury-300');
    const gaussian = createLowRankGaussian({ diagonalVariance, modes });
    const reference = gaussianLogLikelihood(residual, dense);
    expect(reference.reason).toBeNull();
    expectRelative(gaussian.chiSquare(residual), reference.chiSquare);
    expectRelative(gaussian.logDeterminant, reference.logDeterminant);
    const sampled = gaussian.evaluate(residual, 0, createLowRankEvaluation());
    expectRelative(sampled.chiSquare, reference.chiSquare);
    expectRelative(sampled.logLikelihood, reference.logLikelihood);
    expect(sampled.marginalizationTerm).toBe(0);
  });

  it('marginalizes the offset like the dense computation (Conley et al. 2011, appendix C) within 1e-8 relative', () => {
    const { diagonalVariance, modes, dense, residual } = lowRankProblem(300, 10, 'woodbury-offset');
    // A common offset near a supernova absolute magnitude: the marginalized result must not depend on it.
    const shifted = Float64Array.from(residual, (value) => value - 19.3);
    const gaussian = createLowRankGaussian({ diagonalVariance, modes });
    const reference = gaussianLogLikelihood(shifted, dense, { marginalizeOffset: true });
    const result = gaussian.evaluate(shifted, 'marginalize', createLowRankEvaluation());
    expectRelative(result.chiSquare, reference.chiSquare);
    expectRelative(result.bestOffset, reference.bestOffset);
    expectRelative(result.marginalizationTerm, reference.marginalizationTerm);
    expectRelative(result.logLikelihood, reference.logLikelihood);
    const unshifted = gaussian.evaluate(residual, 'marginalize', createLowRankEvaluation());
    expectRelative(result.chiSquare, unshifted.chiSquare);
    expect(result.bestOffset - unshifted.bestOffset).toBeCloseTo(-19.3, 10);
  });

  it('has chi^2(M) = chi^2_min + E (M - M*)^2 for a sampled offset (the quadratic of the marginalization formula)', () => {
    // Goliath et al. 2001: chi^2(M) = A - 2 B M + E M^2 is exactly quadratic with minimum at M* = B/E.
    const { diagonalVariance, modes, residual } = lowRankProblem(120, 6, 'woodbury-quadratic');
    const gaussian = createLowRankGaussian({ diagonalVariance, modes });
    const best = gaussian.evaluate(residual, 'marginalize', createLowRankEvaluation());
    for (const step of [-0.3, 0.05, 1.2]) {
      const at = gaussian.evaluate(residual, best.bestOffset + step, createLowRankEvaluation());
      expectRelative(at.chiSquare, best.chiSquare + gaussian.templatePrecision * step * step);
      const direct = gaussian.chiSquare(Float64Array.from(residual, (value) => value - (best.bestOffset + step)));
      expectRelative(at.chiSquare, direct);
    }
  });

  it('reduces to the diagonal sum when there are no modes (K = 0)', () => {
    const { diagonalVariance, residual } = lowRankProblem(50, 0, 'woodbury-diagonal');
    const gaussian = createLowRankGaussian({ diagonalVariance, modes: new Float64Array(0) });
    let expected = 0;
    let logDeterminant = 0;
    for (let i = 0; i < 50; i++) {
      expected += (residual[i] * residual[i]) / diagonalVariance[i];
      logDeterminant += Math.log(diagonalVariance[i]);
    }
    expect(gaussian.modeCount).toBe(0);
    expectRelative(gaussian.chiSquare(residual), expected, 1e-13);
    expectRelative(gaussian.logDeterminant, logDeterminant, 1e-13);
  });

  it('throws CandelaError for modes of the wrong length, a non-positive variance and a non-finite mode', () => {
    const codeOf = (action: () => unknown): string | undefined => {
      try {
        action();
      } catch (error) {
        return isCandelaError(error) ? error.issues[0].code : 'not a CandelaError';
      }
      return undefined;
    };
    expect(codeOf(() => createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 1), modes: Float64Array.of(1, 2, 3) }))).toBe('likelihood.low_rank_shape');
    expect(codeOf(() => createLowRankGaussian({ diagonalVariance: new Float64Array(0), modes: new Float64Array(0) }))).toBe('likelihood.low_rank_shape');
    expect(codeOf(() => createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 0), modes: Float64Array.of(1, 2) }))).toBe('likelihood.low_rank_variance');
    expect(codeOf(() => createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 1), modes: Float64Array.of(1, NaN) }))).toBe('likelihood.low_rank_mode');
  });

  it('rejects a non-finite residual with -Infinity and a reason, never NaN', () => {
    const gaussian = createLowRankGaussian({ diagonalVariance: Float64Array.of(1, 4), modes: Float64Array.of(1, 2) });
    const result = gaussian.evaluate(Float64Array.of(1, NaN), 'marginalize', createLowRankEvaluation());
    expect(result.logLikelihood).toBe(-Infinity);
    expect(result.reason).toMatch(/not finite/);
  });
});
