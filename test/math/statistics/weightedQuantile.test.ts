import { quantileSorted } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { createRandomStream, weightedQuantiles } from '../../../src/math/index.js';
import { VALUES, WEIGHTS, normalSample } from './referenceSample.js';

describe('weightedQuantiles', () => {
  it('equals R quantile(type = 2) of the sample with each value repeated weight times', () => {
    // R 4.2.2: quantile(rep(values, weights), probs, type = 2) (make_summary_reference.R), exact.
    const probabilities = [0, 0.02275, 0.158655, 0.25, 0.5, 0.75, 0.841345, 0.97725, 1];
    const fromR = [-1.2, -1.2, -0.4, -0.4, 0.8, 2.8, 2.8, 2.8, 2.8];
    const ours = weightedQuantiles(VALUES, probabilities, WEIGHTS);
    ours.forEach((value, k) => expect(value).toBeCloseTo(fromR[k], 14));
  });

  it('does not depend on the scale of the weights and matches the expanded sample for integer weights', () => {
    // Definition check (Hyndman & Fan 1996, definition 2): integer weights = repeat counts; the rule uses weight ratios only.
    const stream = createRandomStream('quantile-expansion');
    const values = Float64Array.from({ length: 400 }, () => stream.normal());
    const weights = Float64Array.from({ length: 400 }, () => stream.integer(5));
    const expanded: number[] = [];
    values.forEach((value, i) => { for (let k = 0; k < weights[i]; k++) expanded.push(value); });
    const probabilities = [0, 0.01, 0.1, 0.158655, 0.25, 0.5, 0.6, 0.841345, 0.97725, 1];
    const fromExpanded = weightedQuantiles(expanded, probabilities);
    expect(weightedQuantiles(values, probabilities, weights)).toEqual(fromExpanded);
    const scaled = weights.map((w) => w / 7);
    expect(weightedQuantiles(values, probabilities, scaled)).toEqual(fromExpanded);
  });

  it('stays within one sample spacing of the interpolated quantiles of simple-statistics (definition 7)', () => {
    // simple-statistics quantileSorted (R type 7) is a general-purpose reference; the two definitions differ by at most one gap.
    const sorted = Float64Array.from(normalSample('quantile-cross', 1001)).sort();
    for (const p of [0.05, 0.158655, 0.5, 0.841345, 0.95]) {
      const ours = weightedQuantiles(sorted, [p])[0];
      const reference = quantileSorted(Array.from(sorted), p);
      const index = Math.floor(p * 1000);
      expect(Math.abs(ours - reference)).toBeLessThanOrEqual(sorted[index + 1] - sorted[index - 1]);
    }
  });
});
