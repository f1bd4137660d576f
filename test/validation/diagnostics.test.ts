import { describe, expect, it } from 'vitest';
import { essBasic, integratedAutocorrelationTime } from '../../src/diagnostics/index.js';
import { ar1Tau, ar1TauEstimatorBias, ar1Walkers, sokalTauStandardError } from '../diagnostics/ar1Walkers.js';

// Statistical validation of the autocorrelation-time estimator and the ESS on AR(1) walkers
// (tau = (1 + phi)/(1 - phi), textbook result), over many seeds:
// - the mean estimate equals tau plus the leading bias of ar1TauEstimatorBias (Priestley 1981,
//   from memory) within 4 standard errors of the mean;
// - the spread across seeds is within a factor 3/2 of Sokal's (1997) asymptotic formula
//   sqrt(2 (2M + 1)/N) tau (measured: 0.86 and 0.84 of it for the slow cases);
// - the basic ESS of 4 chains averages to 4 n (1 - phi)/(1 + phi) within 5% (its own
//   finite-sample bias is of order tau/n; measured 0.6% and 1.3%).

interface Case { phi: number; walkers: number; steps: number; replicates: number }

function summarize(values: number[]): { mean: number; sd: number } {
  const mean = values.reduce((sum, value) => sum + value, 0) / values.length;
  const sd = Math.sqrt(values.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (values.length - 1));
  return { mean, sd };
}

function checkCase({ phi, walkers, steps, replicates }: Case, label: string): void {
  const taus: number[] = [];
  const essValues: number[] = [];
  let windowSum = 0;
  for (let replicate = 0; replicate < replicates; replicate++) {
    const series = ar1Walkers(walkers, steps, phi, `validation/${label}/${phi}/${replicate}`);
    const estimate = integratedAutocorrelationTime(series);
    taus.push(estimate.tauSteps);
    windowSum += estimate.windowSteps;
    essValues.push(essBasic(series.slice(0, 4)));
  }
  const window = windowSum / replicates;
  const tau = ar1Tau(phi);
  const { mean, sd } = summarize(taus);
  const expected = tau + ar1TauEstimatorBias(phi, window, steps);
  expect(Math.abs(mean - expected)).toBeLessThan((4 * sd) / Math.sqrt(replicates));
  const ratio = sd / sokalTauStandardError(tau, window, walkers * steps);
  expect(ratio).toBeGreaterThan(2 / 3);
  expect(ratio).toBeLessThan(3 / 2);
  const essTheory = (4 * steps) / tau;
  expect(Math.abs(summarize(essValues).mean - essTheory) / essTheory).toBeLessThan(0.05);
}

describe('autocorrelation time and ESS on AR(1) walkers (fast subset)', () => {
  it('agree with tau = (1 + phi)/(1 - phi), its bias and Sokal spread for phi = 0.5 (30 seeds)', () => {
    checkCase({ phi: 0.5, walkers: 8, steps: 2000, replicates: 30 }, 'fast');
  });
});

describe.skipIf(!process.env.CANDELA_VALIDATE)('autocorrelation time and ESS on AR(1) walkers (slow)', () => {
  for (const [phi, steps] of [[0.5, 2000], [0.9, 4000], [0.97, 12000]]) {
    it(`agree with tau = (1 + phi)/(1 - phi), its bias and Sokal spread for phi = ${phi} (200 seeds)`, () => {
      checkCase({ phi, walkers: 16, steps, replicates: 200 }, 'slow');
    });
  }
});
