import { describe, expect, it } from 'vitest';
import { ensembleAutocorrelation, integratedAutocorrelationTime, SOKAL_WINDOW_FACTOR } from '../../src/diagnostics/index.js';
import { ar1Walkers } from './ar1Walkers.js';

describe('ensembleAutocorrelation', () => {
  it('follows rho(t) = phi^t for an AR(1) process (textbook result)', () => {
    const phi = 0.8;
    const { correlation, walkersUsed } = ensembleAutocorrelation(ar1Walkers(32, 4000, phi, 'acf-ar1'));
    expect(walkersUsed).toBe(32);
    expect(correlation[0]).toBeCloseTo(1, 12);
    // 32 x 4000 draws: the estimate of rho(t) scatters by about sqrt((1 + phi^2)/(1 - phi^2) / N) ~ 0.008
    // (Bartlett 1946 for an AR(1), from memory); 0.03 leaves room for the bias of the centred estimator.
    for (const lag of [1, 2, 5, 10]) expect(Math.abs(correlation[lag] - phi ** lag)).toBeLessThan(0.03);
  });

  it('sums to the integrated autocorrelation time over the Sokal window', () => {
    const walkers = ar1Walkers(16, 2000, 0.6, 'acf-sum');
    const { correlation } = ensembleAutocorrelation(walkers);
    const estimate = integratedAutocorrelationTime(walkers);
    let tau = 1;
    for (let lag = 1; lag <= estimate.windowSteps; lag++) tau += 2 * correlation[lag];
    expect(tau).toBe(estimate.tauSteps);
    expect(estimate.windowSteps).toBeGreaterThanOrEqual(SOKAL_WINDOW_FACTOR * tau);
  });

  it('leaves constant walkers out and lists them', () => {
    const walkers = ar1Walkers(4, 500, 0.5, 'acf-stuck');
    walkers[2] = new Float64Array(500).fill(0.3);
    const result = ensembleAutocorrelation(walkers);
    expect(result.constantWalkers).toEqual([2]);
    expect(result.walkersUsed).toBe(3);
  });
});
