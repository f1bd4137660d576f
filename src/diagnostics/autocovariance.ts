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
  /**
   * The same for two series at once, at the cost of one: both go through one
   * complex FFT (the first as the real part, the second as the imaginary
   * part), their spectra are separated by the symmetry of real transforms,
   * X1[k] = (Z[k] + conj Z[n-k])/2, X2[k] = (Z[k] - conj Z[n-k])/2i, and
   * both power spectra, real and even, return through one inverse FFT as its
   * real and imaginary parts (Press et al., Numerical Recipes, 3rd ed. 2007,
   * section 12.3, "two real FFTs for the price of one"). Series whose
   * variances differ by more than PAIR_VARIANCE_RATIO are done one by one, so
   * the smaller never carries the larger's rounding.
   */
  autocovariancePairInto(first: Float64Array, second: Float64Array, outFirst: Float64Array, outSecond: Float64Array): void;
}

/**
 * Largest ratio of the two variances transformed together: the smaller
 * series' lags then carry at most sqrt(1e4) = 100 times the FFT's relative
 * rounding of the larger (about 1e-14), far below what tau needs.
 */
const PAIR_VARIANCE_RATIO = 1e4;

/**
 * Creates a workspace for the biased ("divide by n") autocovariance, the
 * estimator Geyer (1992, "Practical Markov chain Monte Carlo", Statistical
 * Science 7(4), 473) recommends, computed by the Wiener-Khinchin route: zero-pad
 * the centred series to a power of two >= 2n (so the correlation is linear,
 * not circular), transform, take |X|^2, transform back.
 *
 * Cost: two FFTs of length nextPowerOfTwo(2n) per series (per pair of series
 * with autocovariancePairInto), O(n log n).
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

  const squaresSecond = new Float64Array(seriesLength);

  /** Centres `series` into `target` (first n entries) and returns its compensated biased variance. */
  function centre(series: Float64Array, target: Float64Array, scratch: Float64Array): number {
    const mean = compensatedSum(series) / seriesLength;
    for (let index = 0; index < seriesLength; index++) {
      const deviation = series[index] - mean;
      target[index] = deviation;
      scratch[index] = deviation * deviation;
    }
    return compensatedSum(scratch) / seriesLength;
  }

  function autocovarianceInto(series: Float64Array, out: Float64Array): Float64Array {
    real.fill(0);
    imag.fill(0);
    const biasedVariance = centre(series, real, squares);
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

  function autocovariancePairInto(first: Float64Array, second: Float64Array, outFirst: Float64Array, outSecond: Float64Array): void {
    real.fill(0);
    imag.fill(0);
    const varianceFirst = centre(first, real, squares);
    const varianceSecond = centre(second, imag, squaresSecond);
    const larger = Math.max(varianceFirst, varianceSecond);
    const smaller = Math.min(varianceFirst, varianceSecond);
    if (!(smaller > 0) || larger > PAIR_VARIANCE_RATIO * smaller) {
      autocovarianceInto(first, outFirst);
      autocovarianceInto(second, outSecond);
      return;
    }
    plan.transformInPlace(real, imag, 'forward');
    const size = plan.size;
    for (let k = 0; k <= size >>> 1; k++) {
      const partner = (size - k) & (size - 1);
      const a = real[k];
      const b = imag[k];
      const c = real[partner];
      const d = imag[partner];
      const powerFirst = ((a + c) * (a + c) + (b - d) * (b - d)) / 4;
      const powerSecond = ((b + d) * (b + d) + (a - c) * (a - c)) / 4;
      real[k] = powerFirst;
      imag[k] = powerSecond;
      real[partner] = powerFirst;
      imag[partner] = powerSecond;
    }
    plan.transformInPlace(real, imag, 'inverse');
    const scaleFirst = varianceFirst / real[0];
    const scaleSecond = varianceSecond / imag[0];
    for (let lag = 0; lag < seriesLength; lag++) {
      outFirst[lag] = real[lag] * scaleFirst;
      outSecond[lag] = imag[lag] * scaleSecond;
    }
    outFirst[0] = varianceFirst;
    outSecond[0] = varianceSecond;
  }

  return { seriesLength, autocovarianceInto, autocovariancePairInto };
}
