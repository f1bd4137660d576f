import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../src/math/index.js';
import { PRIOR_SPREAD_DRAWS, SMALLEST_SEARCH_STEP, priorSearchStep, samplePrior } from '../../src/likelihood/index.js';

describe('priorSearchStep', () => {
  it('is a tenth of the spread of a uniform prior, 1/sqrt(12) of its width, within the Monte Carlo error of 50 draws', () => {
    // sd of U(0, 1) = 1/sqrt(12) (handbook value). The relative standard error of a standard deviation from
    // n = 50 uniform draws is about sqrt((mu4/sigma^4 - 1) / (4 n)) = sqrt((9/5 - 1) / 200) = 0.063; 4 of them allowed.
    const step = priorSearchStep({ kind: 'uniform', min: 0, max: 1 }, createRandomStream('search-step'));
    expect(Math.abs(step / (0.1 / Math.sqrt(12)) - 1)).toBeLessThan(4 * 0.063);
  });

  it('is never below the smallest step, and takes exactly PRIOR_SPREAD_DRAWS draws from the stream', () => {
    const prior = { kind: 'gaussian' as const, mean: 70, sd: 1e-6 };
    const random = createRandomStream('narrow');
    expect(priorSearchStep(prior, random)).toBe(SMALLEST_SEARCH_STEP);
    const replay = createRandomStream('narrow');
    for (let i = 0; i < PRIOR_SPREAD_DRAWS; i++) samplePrior(prior, replay);
    expect(samplePrior(prior, random)).toBe(samplePrior(prior, replay));
  });
});
