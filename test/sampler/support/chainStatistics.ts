import type { ChainView } from '../../../src/sampler/index.js';

/**
 * Test-only estimators of Monte Carlo standard errors for ensemble chains.
 * They are written here, independently of src/diagnostics, so that the
 * sampler tests do not depend on another layer.
 */

/**
 * Series over steps (from `burnIn` on) of the walker average of each f(position):
 * result[f][step - burnIn]. One pass over the chain for all functions.
 */
export function walkerAverageSeries(chain: ChainView, burnIn: number, functions: Array<(position: Float64Array) => number>): Float64Array[] {
  const { walkers, dimension, steps } = chain;
  const series = functions.map(() => new Float64Array(steps - burnIn));
  const position = new Float64Array(dimension);
  const sums = new Float64Array(functions.length);
  for (let step = burnIn; step < steps; step++) {
    sums.fill(0);
    for (let w = 0; w < walkers; w++) {
      const offset = (step * walkers + w) * dimension;
      for (let k = 0; k < dimension; k++) position[k] = chain.positions[offset + k];
      for (let f = 0; f < functions.length; f++) sums[f] += functions[f](position);
    }
    for (let f = 0; f < functions.length; f++) series[f][step - burnIn] = sums[f] / walkers;
  }
  return series;
}

/**
 * Integrated autocorrelation time of a series, in steps, with Sokal's
 * adaptive window (Sokal 1997, "Monte Carlo methods in statistical
 * mechanics: foundations and new algorithms", in Functional Integration,
 * Plenum, section 3: smallest window M with M >= c tau(M), c = 5).
 * With `stride` > 1 the series is first thinned to every stride-th value and
 * the result scaled back by stride (cheaper for long, slowly mixing series;
 * adequate when tau >> stride). Cost O(n/stride x window) by direct sums.
 */
export function integratedAutocorrelationTime(series: Float64Array, stride = 1, windowFactor = 5): number {
  const n = Math.floor(series.length / stride);
  const values = Float64Array.from({ length: n }, (_, t) => series[t * stride]);
  let mean = 0;
  for (const value of values) mean += value / n;
  let variance = 0;
  for (const value of values) variance += (value - mean) ** 2 / n;
  let tau = 1;
  for (let lag = 1; lag < n; lag++) {
    let sum = 0;
    for (let t = 0; t + lag < n; t++) sum += (values[t] - mean) * (values[t + lag] - mean);
    tau += (2 * sum) / n / variance;
    if (lag >= windowFactor * tau) break;
  }
  return Math.max(tau, 1) * stride;
}

/** Estimate and Monte Carlo standard error of a mean from several chains' series. */
export interface BatchMeansEstimate {
  mean: number;
  standardError: number;
  batches: number;
  batchLength: number;
}

/**
 * Batch-means estimate of E[series] pooled over independent chains
 * (Flegal, Haran & Jones 2008, Statistical Science 23, 250, section 3.1):
 * each chain's series is cut into `batchesPerChain` equal batches; the
 * standard error is the standard deviation of all batch means over the square
 * root of their number. Valid when the batch length is many autocorrelation
 * times (the tests assert batch length >= 10 tau).
 */
export function batchMeans(seriesPerChain: Float64Array[], batchesPerChain: number): BatchMeansEstimate {
  const batchLength = Math.floor(seriesPerChain[0].length / batchesPerChain);
  const means: number[] = [];
  for (const series of seriesPerChain) {
    for (let b = 0; b < batchesPerChain; b++) {
      let sum = 0;
      for (let t = b * batchLength; t < (b + 1) * batchLength; t++) sum += series[t];
      means.push(sum / batchLength);
    }
  }
  const mean = means.reduce((a, b) => a + b, 0) / means.length;
  const variance = means.reduce((a, b) => a + (b - mean) ** 2, 0) / (means.length - 1);
  return { mean, standardError: Math.sqrt(variance / means.length), batches: means.length, batchLength };
}

/** One checked expectation: estimate, truth, standard error and the worst autocorrelation time over chains. */
export interface ExpectationCheck {
  label: string;
  truth: number;
  estimate: BatchMeansEstimate;
  tauSteps: number;
}

/**
 * Batch-means estimates of E[f] for each labelled function, pooled over
 * every ensemble of the run (chains after `burnIn`), with the largest
 * per-ensemble autocorrelation time of the walker-averaged series.
 */
export function checkExpectations(
  chains: ChainView[], burnIn: number, batchesPerChain: number, stride: number,
  expectations: Array<{ label: string; truth: number; f: (position: Float64Array) => number }>,
): ExpectationCheck[] {
  const perChain = chains.map((chain) => walkerAverageSeries(chain, burnIn, expectations.map((e) => e.f)));
  return expectations.map(({ label, truth }, index) => {
    const series = perChain.map((chainSeries) => chainSeries[index]);
    const tauSteps = Math.max(...series.map((s) => integratedAutocorrelationTime(s, stride)));
    return { label, truth, estimate: batchMeans(series, batchesPerChain), tauSteps };
  });
}

/** Human-readable line for a failed check. */
export function describeCheck(check: ExpectationCheck): string {
  const { label, truth, estimate, tauSteps } = check;
  const z = (estimate.mean - truth) / estimate.standardError;
  return `${label}: estimate ${estimate.mean.toPrecision(6)} truth ${truth.toPrecision(6)} se ${estimate.standardError.toPrecision(3)} (z = ${z.toFixed(2)}), batch length ${estimate.batchLength}, tau ${tauSteps.toFixed(1)}`;
}

/** True when two typed arrays hold exactly the same bytes (bit-for-bit equal numbers, signs of zero included). */
export function sameBytes(a: Float64Array, b: Float64Array): boolean {
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength).equals(Buffer.from(b.buffer, b.byteOffset, b.byteLength));
}
