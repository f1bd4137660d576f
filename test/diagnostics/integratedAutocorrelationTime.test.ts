import { describe, expect, it } from 'vitest';
import { integratedAutocorrelationTime, RELIABLE_MAXIMUM_WINDOW_SHARE, RELIABLE_STEPS_PER_TAU, SOKAL_WINDOW_FACTOR } from '../../src/diagnostics/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { ar1Tau, ar1TauEstimatorBias, ar1Walkers, sokalTauStandardError } from './ar1Walkers.js';

// Tolerance for the AR(1) checks: 4 standard errors of Sokal's (1997) variance formula for
// the windowed estimator (see ar1Walkers.ts); the walkers are independent, so N = steps x walkers.
// The expected value includes the estimator's leading bias -(2 M tau + 2 phi/(1 - phi)^2)/n
// (ar1TauEstimatorBias; about 0.55 standard errors here); the window truncation bias
// 2 phi^(M+1)/(1 - phi) is below 1e-3 and ignored. test/validation/diagnostics.test.ts checks
// over many seeds that the mean and spread of the estimator follow these formulas.
const STANDARD_ERRORS = 4;

describe('integratedAutocorrelationTime', () => {
  for (const phi of [0.5, 0.9]) {
    it(`recovers tau = (1 + phi)/(1 - phi) = ${ar1Tau(phi)} of AR(1) walkers with phi = ${phi} (textbook result)`, () => {
      const walkers = 32;
      const steps = 10000;
      const estimate = integratedAutocorrelationTime(ar1Walkers(walkers, steps, phi, `tau/ar1/${phi}`));
      const tolerance = STANDARD_ERRORS * sokalTauStandardError(ar1Tau(phi), estimate.windowSteps, walkers * steps);
      const expected = ar1Tau(phi) + ar1TauEstimatorBias(phi, estimate.windowSteps, steps);
      expect(Math.abs(estimate.tauSteps - expected)).toBeLessThan(tolerance);
      expect(estimate.windowSteps).toBeGreaterThanOrEqual(SOKAL_WINDOW_FACTOR * estimate.tauSteps);
      expect(estimate.reliable).toBe(true);
      expect(estimate.effectiveSampleSize).toBeCloseTo((walkers * steps) / estimate.tauSteps, 6);
      expect(estimate.walkersUsed).toBe(walkers);
    });
  }

  it('gives tau near 1 for independent draws, with a window of 5 or 6 steps', () => {
    const stream = createRandomStream('tau/iid');
    const series = Array.from({ length: 16 }, () => Float64Array.from({ length: 5000 }, () => stream.normal()));
    const estimate = integratedAutocorrelationTime(series);
    // rho(t) = 0 for t > 0, so tau = 1 (definition); tolerance 4 sqrt(2 (2M + 1)/N), M = 5, N = 80000.
    expect(Math.abs(estimate.tauSteps - 1)).toBeLessThan(4 * Math.sqrt((2 * 11) / 80000));
    // M = 5 when tau(5) <= 1, else 6 (tau(6) stays far below 1.2 at this noise level).
    expect([5, 6]).toContain(estimate.windowSteps);
  });

  it('chooses the smallest window M with M >= 5 tau(M) (Sokal 1997) on a hand-made correlation', () => {
    // Walker series +1, +1, -1, -1 repeated (period 4): rho = 1, 1/2, -1, -1/2, 1, ... (approx.),
    // tau(1) = 2 (1 < 10), tau(2) = 0 (2 >= 0): the window is 2 and tau is floored.
    const pattern = Float64Array.from({ length: 400 }, (_, index) => ((index >> 1) % 2 === 0 ? 1 : -1));
    const estimate = integratedAutocorrelationTime([pattern]);
    expect(estimate.windowSteps).toBe(2);
    expect(estimate.tauSteps).toBeCloseTo(1 / Math.log10(400), 12);
  });

  it('flags a chain shorter than 50 tau as unreliable', () => {
    const estimate = integratedAutocorrelationTime(ar1Walkers(8, 300, 0.97, 'tau/short'));
    expect(estimate.steps).toBeLessThan(RELIABLE_STEPS_PER_TAU * estimate.tauSteps);
    expect(estimate.reliable).toBe(false);
  });

  it('flags a window longer than a tenth of the chain as unreliable: a ramp of 20 steps', () => {
    // Biased autocorrelation of the centred ramp 0..19 (by hand / numpy): tau(M) = 1 + 2 sum rho
    // rises to 6.98 at M = 7 and falls back; the first M >= 5 tau(M) is M = 15 (tau(15) = 2.16).
    const ramp = Float64Array.from({ length: 20 }, (_, index) => index);
    const estimate = integratedAutocorrelationTime([ramp]);
    expect(estimate.windowSteps).toBe(15);
    expect(estimate.tauSteps).toBeCloseTo(2.16, 2);
    expect(estimate.windowSteps).toBeGreaterThan(RELIABLE_MAXIMUM_WINDOW_SHARE * 20);
    expect(estimate.reliable).toBe(false);
  });

  it('leaves constant walkers out of the average and lists them', () => {
    const walkers = ar1Walkers(4, 2000, 0.5, 'tau/stuck');
    const withStuck = [walkers[0], new Float64Array(2000).fill(0.7), walkers[1], walkers[2], walkers[3]];
    const estimate = integratedAutocorrelationTime(withStuck);
    expect(estimate.constantWalkers).toEqual([1]);
    expect(estimate.walkersUsed).toBe(4);
    expect(estimate.tauSteps).toBe(integratedAutocorrelationTime(walkers).tauSteps);
  });

  it('throws diagnostics.constant_draws when no walker moved, and shape errors for bad input', () => {
    const codeOf = (run: () => unknown): string | undefined => {
      try {
        run();
      } catch (error) {
        return (error as { issues: Array<{ code: string }> }).issues[0].code;
      }
      return undefined;
    };
    expect(codeOf(() => integratedAutocorrelationTime([new Float64Array(50).fill(1), new Float64Array(50).fill(2)]))).toBe('diagnostics.constant_draws');
    expect(codeOf(() => integratedAutocorrelationTime([]))).toBe('diagnostics.no_chains');
    expect(codeOf(() => integratedAutocorrelationTime([new Float64Array(10), new Float64Array(9)]))).toBe('diagnostics.unequal_chains');
    expect(codeOf(() => integratedAutocorrelationTime([Float64Array.of(1)]))).toBe('diagnostics.too_few_draws');
    expect(codeOf(() => integratedAutocorrelationTime([Float64Array.of(1, Number.NaN, 2)]))).toBe('diagnostics.non_finite_draw');
  });
});
