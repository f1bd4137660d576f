import { compensatedSum, createFftPlan, nextPowerOfTwo } from '../math/index.js';
import type { FftPlan } from '../math/index.js';

/**
 * Computes biased autocovariances of series of one fixed length, reusing one
 * FFT plan and its scratch arrays (no allocation per series).
 */
export interface AutocovarianceWorkspace {
  /** Length n of the series this workspace accepts. */
  readonly seriesLength: number;
  /**
   * Writes gamma(t) = (1/n) sum_{j=0}^{n-1-t} (x_j - mean)(x_{j+t} - mean) for
   * t = 0..n-1 into `out` (length n), in the squared units of the series.
   * Lag 0 is the directly summed (compensated) biased variance; the other
   * lags come from the FFT, scaled to it. A constant series gives all zeros.
   * @returns `out`.
   */
  autocovarianceInto(series: Float64Array, out: Float64Array): Float64Array;
}

/**
 * Creates a workspace for the biased ("divide by n") autocovariance, the
 * estimator Geyer (1992, "Practical Markov chain Monte Carlo", Statistical
 * Science 7(4), 473) recommends, computed by the Wiener-Khinchin route: zero-pad
 * the centred series to a power of two >= 2n (so the correlation is linear,
 * not circular), transform, take |X|^2, transform back.
 *
 * Cost: two FFTs of length nextPowerOfTwo(2n) per series, O(n log n).
 * @param seriesLength n >= 1, number of draws per series.
 * @example
 * const workspace = createAutocovarianceWorkspace(4);
 * workspace.autocovarianceInto(Float64Array.of(1, 2, 3, 4), new Float64Array(4));
 * // => [1.25, 0.3125, -0.375, -0.5625]
 */
export function createAutocovarianceWorkspace(seriesLength: number): AutocovarianceWorkspace {
  const plan: FftPlan = createFftPlan(nextPowerOfTwo(2 * seriesLength));
  const real = new Float64Array(plan.size);
  const imag = new Float64Array(plan.size);
  const squares = new Float64Array(seriesLength);

  function autocovarianceInto(series: Float64Array, out: Float64Array): Float64Array {
    const mean = compensatedSum(series) / seriesLength;
    real.fill(0);
    imag.fill(0);
    for (let index = 0; index < seriesLength; index++) {
      const deviation = series[index] - mean;
      real[index] = deviation;
      squares[index] = deviation * deviation;
    }
    const biasedVariance = compensatedSum(squares) / seriesLength;
    if (biasedVariance === 0) return out.fill(0);
    plan.transformInPlace(real, imag, 'forward');
    for (let index = 0; index < plan.size; index++) {
      real[index] = real[index] * real[index] + imag[index] * imag[index];
      imag[index] = 0;
    }
    plan.transformInPlace(real, imag, 'inverse');
    const scale = biasedVariance / real[0];
    for (let lag = 0; lag < seriesLength; lag++) out[lag] = real[lag] * scale;
    out[0] = biasedVariance;
    return out;
  }

  return { seriesLength, autocovarianceInto };
}
