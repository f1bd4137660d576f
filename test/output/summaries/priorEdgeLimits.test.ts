// detectPriorEdges on draws of known distributions; the quantiles quoted are the
// closed-form quantile functions of the uniform, exponential and triangular
// distributions (common practice: F^-1(p) = a + p (b - a); -ln(1 - p) / lambda; b - (b - a) sqrt(1 - p)).
import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { sampleStatistics, type ParameterSummary } from '../../../src/output/index.js';
import { detectPriorEdges } from '../../../src/output/summaries/priorEdgeLimits.js';

const COUNT = 200_000;

function summaryOf(name: string, draws: Float64Array): ParameterSummary {
  return { name, stats: sampleStatistics(draws, { label: name }) };
}

function draws(seed: string, inverseCdf: (u: number) => number): Float64Array {
  const random = createRandomStream(seed);
  return Float64Array.from({ length: COUNT }, () => inverseCdf(random.uniform()));
}

describe('detectPriorEdges', () => {
  it('quotes an exponential piled against an upper edge as a 95% lower limit at the 5% quantile', () => {
    // x = 1 - E with E exponential of rate 10 on the prior [0, 1]: the 5% quantile of x is 1 minus the 95% quantile of E, 1 + ln(0.05) / 10 = 0.700427.
    const values = draws('exponential', (u) => 1 + Math.log(1 - u) / 10);
    const summary = summaryOf('w0', values);
    const warning = detectPriorEdges({ summary, bounds: { lower: 0, upper: 1 }, bestFit: 0.9999, draws: values, weights: null });
    expect(warning?.code).toBe('prior_edge');
    expect(summary.oneSidedLimit?.side).toBe('lower');
    expect(summary.oneSidedLimit!.value).toBeCloseTo(1 + Math.log(0.05) / 10, 2);
    expect(warning?.message).toContain('best fit');
  });

  it('calls a flat posterior across the whole prior prior-dominated and sets no limit', () => {
    const values = draws('flat', (u) => -5 + 8 * u);
    const summary = summaryOf('wa', values);
    const warning = detectPriorEdges({ summary, bounds: { lower: -5, upper: 3 }, bestFit: undefined, draws: values, weights: null });
    expect(warning?.code).toBe('prior_dominated');
    expect(summary.oneSidedLimit).toBeUndefined();
  });

  it('leaves a density that falls to zero at the edge alone', () => {
    // Triangular on [0, 1] with its mode at 1: F(x) = x^2, so the 2.275% quantile sqrt(0.02275) = 0.151 is far from the edge 0.
    const values = draws('triangle', (u) => Math.sqrt(u));
    const summary = summaryOf('omega_m', values);
    expect(detectPriorEdges({ summary, bounds: { lower: 0, upper: 2 }, bestFit: 0.99, draws: values, weights: null })).toBeNull();
    expect(summary.oneSidedLimit).toBeUndefined();
  });

  it('uses the weights of weighted draws', () => {
    // Flat draws on [0, 1] weighted by 2 (1 - x) are a triangular density falling from the edge 0: its 95% quantile is 1 - sqrt(0.05) = 0.776393.
    const values = draws('weighted', (u) => u);
    const weights = Float64Array.from(values, (x) => 2 * (1 - x));
    const summary: ParameterSummary = { name: 'sigma_int', stats: sampleStatistics(values, { label: 'sigma_int', weights }) };
    const warning = detectPriorEdges({ summary, bounds: { lower: 0, upper: 1 }, bestFit: 0.001, draws: values, weights });
    expect(warning?.code).toBe('prior_edge');
    expect(summary.oneSidedLimit!.value).toBeCloseTo(1 - Math.sqrt(0.05), 2);
  });
});
