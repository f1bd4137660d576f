import { CandelaError } from '../errors.js';

/**
 * Radix-2 fast Fourier transform on split real/imaginary Float64Arrays
 * (Cooley, J. W. & Tukey, J. W. 1965, "An algorithm for the machine
 * calculation of complex Fourier series", Math. Comp. 19, 297), in the
 * iterative form: bit-reversal permutation, then log2(n) passes of butterflies.
 *
 * Hand-written rather than taken from a package because it is small, it works
 * in place on typed arrays, and a plan keeps its twiddle factors and bit-reversal
 * table, so the autocorrelation of thousands of walker series allocates nothing
 * per transform.
 *
 * Conventions: forward X[k] = sum_j x[j] exp(-2 pi i j k / n);
 * inverse x[j] = (1/n) sum_k X[k] exp(+2 pi i j k / n), so inverse(forward(x)) = x.
 */

/** Direction of a transform: `forward` (minus sign in the exponent) or `inverse` (plus sign, scaled by 1/n). */
export type FftDirection = 'forward' | 'inverse';

/** A reusable transform of one power-of-two length, with its twiddle factors precomputed. */
export interface FftPlan {
  /** Transform length (a power of two, >= 1). */
  readonly size: number;
  /**
   * Transforms the complex sequence (real[j] + i imag[j]) in place.
   * Cost: (n/2) log2(n) butterflies, no allocation.
   * @throws CandelaError `math.fft_length` when an array is not `size` long.
   */
  transformInPlace(real: Float64Array, imag: Float64Array, direction?: FftDirection): void;
}

/**
 * The smallest power of two that is >= `count` (1 for count <= 1).
 * @param count a non-negative length.
 * @throws CandelaError `math.fft_length` when count is not a finite number or exceeds 2^30.
 * @example nextPowerOfTwo(1000) // => 1024
 */
export function nextPowerOfTwo(count: number): number {
  if (!Number.isFinite(count) || count > 2 ** 30) {
    throw new CandelaError({ code: 'math.fft_length', message: 'FFT length out of range', expected: 'a finite length <= 2^30', found: String(count) });
  }
  let size = 1;
  while (size < count) size *= 2;
  return size;
}

/**
 * Builds a plan for transforms of length `size`.
 * Cost: `size` cos/sin evaluations and two arrays of `size` numbers, once.
 * @param size transform length, a power of two >= 1.
 * @throws CandelaError `math.fft_length` when size is not a power of two.
 * @example
 * const plan = createFftPlan(4);
 * const re = Float64Array.of(1, 0, 0, 0), im = new Float64Array(4);
 * plan.transformInPlace(re, im); // re = [1, 1, 1, 1], im = [0, 0, 0, 0]
 */
export function createFftPlan(size: number): FftPlan {
  if (!Number.isInteger(size) || size < 1 || (size & (size - 1)) !== 0 || size > 2 ** 30) {
    throw new CandelaError({ code: 'math.fft_length', message: 'FFT plan length must be a power of two', expected: 'a power of two between 1 and 2^30', found: String(size) });
  }
  const half = size >>> 1;
  // Twiddles exp(-2 pi i k / n) for k < n/2, each from its own cos/sin call (no
  // recurrence), so their error is one rounding, not one per step.
  const cosTable = new Float64Array(half);
  const sinTable = new Float64Array(half);
  for (let k = 0; k < half; k++) {
    const angle = (2 * Math.PI * k) / size;
    cosTable[k] = Math.cos(angle);
    sinTable[k] = -Math.sin(angle);
  }
  const reversed = new Uint32Array(size);
  let bits = 0;
  while (1 << bits < size) bits++;
  for (let index = 0; index < size; index++) {
    let value = index;
    let result = 0;
    for (let bit = 0; bit < bits; bit++) {
      result = (result << 1) | (value & 1);
      value >>>= 1;
    }
    reversed[index] = result;
  }

  function transformInPlace(real: Float64Array, imag: Float64Array, direction: FftDirection = 'forward'): void {
    if (real.length !== size || imag.length !== size) {
      throw new CandelaError({
        code: 'math.fft_length',
        message: 'FFT input arrays do not match the plan length',
        expected: `two arrays of length ${size}`,
        found: `lengths ${real.length} and ${imag.length}`,
      });
    }
    for (let index = 0; index < size; index++) {
      const partner = reversed[index];
      if (partner > index) {
        const swapReal = real[index];
        real[index] = real[partner];
        real[partner] = swapReal;
        const swapImag = imag[index];
        imag[index] = imag[partner];
        imag[partner] = swapImag;
      }
    }
    const sign = direction === 'inverse' ? -1 : 1;
    for (let span = 2; span <= size; span *= 2) {
      const halfSpan = span >>> 1;
      const tableStride = (size / span) | 0;
      for (let start = 0; start < size; start += span) {
        for (let offset = 0; offset < halfSpan; offset++) {
          const twiddleReal = cosTable[offset * tableStride];
          const twiddleImag = sign * sinTable[offset * tableStride];
          const upper = start + offset;
          const lower = upper + halfSpan;
          const productReal = real[lower] * twiddleReal - imag[lower] * twiddleImag;
          const productImag = real[lower] * twiddleImag + imag[lower] * twiddleReal;
          real[lower] = real[upper] - productReal;
          imag[lower] = imag[upper] - productImag;
          real[upper] += productReal;
          imag[upper] += productImag;
        }
      }
    }
    if (direction === 'inverse') {
      const scale = 1 / size;
      for (let index = 0; index < size; index++) {
        real[index] *= scale;
        imag[index] *= scale;
      }
    }
  }

  return { size, transformInPlace };
}

/**
 * Forward transform of a real series, zero-padded to the next power of two
 * that is at least `minimumSize` (and at least the series length).
 * Cost: one plan plus one transform; allocates two arrays of the padded length.
 * @param values the real series (any units; the transform keeps them).
 * @param minimumSize smallest acceptable padded length (e.g. 2n for a linear, not circular, correlation).
 * @returns the padded spectrum as split real and imaginary parts.
 * @throws CandelaError `math.fft_length` when the padded length would exceed 2^30.
 * @example fftOfRealSeries([1, 1, 1]) // => real [3, 0, 1, 0], imag [0, -1, 0, 1] (padded to 4)
 */
export function fftOfRealSeries(values: ArrayLike<number>, minimumSize = values.length): { real: Float64Array; imag: Float64Array } {
  const size = nextPowerOfTwo(Math.max(values.length, minimumSize, 1));
  const real = new Float64Array(size);
  for (let index = 0; index < values.length; index++) real[index] = values[index];
  const imag = new Float64Array(size);
  createFftPlan(size).transformInPlace(real, imag, 'forward');
  return { real, imag };
}
