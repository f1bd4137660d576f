import { describe, expect, it } from 'vitest';
import { createFftPlan, createRandomStream, fftOfRealSeries, nextPowerOfTwo } from '../../src/math/index.js';

/** The discrete Fourier transform straight from its definition, O(n^2): X[k] = sum_j x[j] exp(-2 pi i j k / n). */
function directDft(real: Float64Array, imag: Float64Array): { real: Float64Array; imag: Float64Array } {
  const n = real.length;
  const outReal = new Float64Array(n);
  const outImag = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    for (let j = 0; j < n; j++) {
      const angle = (-2 * Math.PI * ((j * k) % n)) / n;
      outReal[k] += real[j] * Math.cos(angle) - imag[j] * Math.sin(angle);
      outImag[k] += real[j] * Math.sin(angle) + imag[j] * Math.cos(angle);
    }
  }
  return { real: outReal, imag: outImag };
}

function randomComplex(size: number, seed: string): { real: Float64Array; imag: Float64Array } {
  const stream = createRandomStream(seed);
  return { real: Float64Array.from({ length: size }, () => stream.normal()), imag: Float64Array.from({ length: size }, () => stream.normal()) };
}

function maxAbsDifference(a: Float64Array, b: Float64Array): number {
  return a.reduce((worst, value, index) => Math.max(worst, Math.abs(value - b[index])), 0);
}

describe('nextPowerOfTwo', () => {
  it('rounds a length up to a power of two', () => {
    expect([0, 1, 2, 3, 4, 5, 1000, 1024, 1025].map(nextPowerOfTwo)).toEqual([1, 1, 2, 4, 4, 8, 1024, 1024, 2048]);
  });
  it('rejects a length that is not finite', () => {
    expect(() => nextPowerOfTwo(Number.NaN)).toThrow(/FFT length/);
  });
});

describe('createFftPlan', () => {
  it('rejects a length that is not a power of two', () => {
    expect(() => createFftPlan(12)).toThrow(/power of two/);
    expect(() => createFftPlan(0)).toThrow(/power of two/);
  });

  it('rejects arrays of the wrong length', () => {
    expect(() => createFftPlan(8).transformInPlace(new Float64Array(8), new Float64Array(4))).toThrow(/plan length/);
  });

  for (const size of [1, 2, 4, 8, 64, 512]) {
    it(`matches the direct DFT (definition) for n = ${size}`, () => {
      // Tolerance: 1e-11 absolute on O(sqrt(n)) magnitudes; the direct sum itself carries
      // about n * 1e-16 rounding, the FFT about log2(n) * 1e-16 (common practice).
      const { real, imag } = randomComplex(size, `fft/${size}`);
      const expected = directDft(real, imag);
      createFftPlan(size).transformInPlace(real, imag, 'forward');
      expect(maxAbsDifference(real, expected.real)).toBeLessThan(1e-11);
      expect(maxAbsDifference(imag, expected.imag)).toBeLessThan(1e-11);
    });
  }

  it('inverts itself: inverse(forward(x)) = x to rounding', () => {
    const original = randomComplex(1024, 'fft/roundtrip');
    const real = Float64Array.from(original.real);
    const imag = Float64Array.from(original.imag);
    const plan = createFftPlan(1024);
    plan.transformInPlace(real, imag, 'forward');
    plan.transformInPlace(real, imag, 'inverse');
    // Tolerance 1e-13: 2 log2(n) = 20 rounding steps on unit-size values (common practice).
    expect(maxAbsDifference(real, original.real)).toBeLessThan(1e-13);
    expect(maxAbsDifference(imag, original.imag)).toBeLessThan(1e-13);
  });

  it("keeps Parseval's identity sum |x|^2 = (1/n) sum |X|^2", () => {
    const { real, imag } = randomComplex(256, 'fft/parseval');
    const energy = real.reduce((sum, value, index) => sum + value * value + imag[index] * imag[index], 0);
    createFftPlan(256).transformInPlace(real, imag);
    const spectral = real.reduce((sum, value, index) => sum + value * value + imag[index] * imag[index], 0) / 256;
    expect(Math.abs(spectral - energy) / energy).toBeLessThan(1e-13);
  });

  it('transforms a unit impulse into all ones (definition of the DFT)', () => {
    const real = Float64Array.of(1, 0, 0, 0, 0, 0, 0, 0);
    const imag = new Float64Array(8);
    createFftPlan(8).transformInPlace(real, imag);
    expect(Array.from(real)).toEqual([1, 1, 1, 1, 1, 1, 1, 1]);
    expect(Array.from(imag)).toEqual([0, 0, 0, 0, 0, 0, 0, 0]);
  });
});

describe('fftOfRealSeries', () => {
  it('transforms the ramp 1..8 to 36 and -4 + 4i cot(pi k / 8) (closed form; numpy.fft.fft gives the same)', () => {
    // Closed form of the DFT of x_j = j + 1: X_0 = n(n+1)/2, X_k = -n/2 + i (n/2) cot(pi k / n).
    const { real, imag } = fftOfRealSeries([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(real[0]).toBeCloseTo(36, 12);
    expect(imag[0]).toBeCloseTo(0, 12);
    for (let k = 1; k < 8; k++) {
      expect(real[k]).toBeCloseTo(-4, 12);
      expect(imag[k]).toBeCloseTo(4 / Math.tan((Math.PI * k) / 8), 12);
    }
  });

  it('zero-pads to the next power of two of the requested length', () => {
    // [1, 1, 1, 0] by hand: X = [3, -i, 1, i].
    const padded = fftOfRealSeries([1, 1, 1]);
    expect(padded.real.length).toBe(4);
    expect(Array.from(padded.real).map((value) => Number(value.toFixed(14)) + 0)).toEqual([3, 0, 1, 0]);
    expect(Array.from(padded.imag).map((value) => Number(value.toFixed(14)) + 0)).toEqual([0, -1, 0, 1]);
    expect(fftOfRealSeries([1, 2, 3], 6).real.length).toBe(8);
  });
});
