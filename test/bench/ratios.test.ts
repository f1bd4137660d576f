// Short in-process benchmark for CI: speed RATIOS measured in the same process, never absolute
// times, with bounds far below the targets of bench/README.md because CI machines are noisy
// and shared. The full measurements are `npm run bench` (bench/RESULTS.md).
import { describe, expect, it } from 'vitest';
import { timeCalls } from '../../bench/suite.js';
import { COUNT, naiveModuli, supernovaRedshifts, vectorizedModuli } from '../../bench/distances.js';
import { benchPoints, benchTerm } from '../../bench/support/benchTerm.js';
import { benchSurvey, denseModeCovariance, modeCountFor } from '../../bench/support/syntheticSurvey.js';

// Task contract: compressed >= 100x faster than general at N = 1,829 (README target); CI bound 20x.
const COMPRESSED_SPEEDUP_BOUND = 20;
// Task contract: vectorized distances >= 20x faster than a naive per-redshift integral.
const DISTANCE_SPEEDUP_BOUND = 20;
// Contract of the supernova term: every fast path agrees with the general path to |delta chi^2| <= 1e-6.
const CHI_SQUARE_AGREEMENT = 1e-6;
const COUNT_1829 = 1829;

describe('benchmark ratios', () => {
  it('the compressed path is at least 20x faster per call than the general dense path at N = 1,829, with |delta chi^2| <= 1e-6', () => {
    const survey = benchSurvey(COUNT_1829, modeCountFor(COUNT_1829), `bench-${COUNT_1829}`);
    const covariances = [denseModeCovariance(survey)];
    const general = benchTerm(survey, { path: 'general', covariances, alphaBeta: 'fixed' });
    const compressed = benchTerm(survey, { path: 'compressed', covariances, alphaBeta: 'fixed' });
    const points = benchPoints(16, 'fixed', 'ci');
    for (const p of points.slice(0, 4)) {
      const difference = Math.abs(general.bestFitExtras!(p).chi_square - compressed.bestFitExtras!(p).chi_square);
      expect(difference).toBeLessThanOrEqual(CHI_SQUARE_AGREEMENT);
    }
    let next = 0;
    const slow = timeCalls(() => general.logLikelihood(points[next++ % points.length]), 3, 15);
    const fast = timeCalls(() => compressed.logLikelihood(points[next++ % points.length]), 200, 2000);
    expect(slow.medianMs / fast.medianMs).toBeGreaterThanOrEqual(COMPRESSED_SPEEDUP_BOUND);
  });

  it('vectorized distance moduli at 2,000 redshifts are at least 20x faster than a naive per-redshift Simpson integral', () => {
    const z = supernovaRedshifts();
    const fastOut = new Float64Array(COUNT);
    const naiveOut = new Float64Array(COUNT);
    const fast = timeCalls(() => vectorizedModuli(z, fastOut), 20, 60);
    const naive = timeCalls(() => naiveModuli(z, naiveOut), 1, 3);
    // Both compute the same moduli (the naive one converged to 1e-12 relative): 1e-9 mag, common practice for a double-precision integral check.
    for (let i = 0; i < COUNT; i++) expect(Math.abs(fastOut[i] - naiveOut[i])).toBeLessThan(1e-9);
    expect(naive.medianMs / fast.medianMs).toBeGreaterThanOrEqual(DISTANCE_SPEEDUP_BOUND);
  });
});
