import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { drawBlindingOffsets, MINIMUM_OFFSET_FRACTION } from '../../../src/output/index.js';

describe('drawBlindingOffsets', () => {
  it('keeps every |offset| within [MINIMUM_OFFSET_FRACTION x width, width], in the order of the widths', () => {
    const stream = createRandomStream('blinding-test/bounds');
    for (let trial = 0; trial < 500; trial++) {
      const offsets = drawBlindingOffsets({ w0: 0.3, omega_m: 0.1, h0: 5 }, stream);
      expect(Object.keys(offsets)).toEqual(['w0', 'omega_m', 'h0']);
      for (const [name, width] of [['w0', 0.3], ['omega_m', 0.1], ['h0', 5]] as const) {
        expect(Math.abs(offsets[name])).toBeGreaterThanOrEqual(MINIMUM_OFFSET_FRACTION * width);
        expect(Math.abs(offsets[name])).toBeLessThanOrEqual(width);
      }
    }
  });

  it('draws magnitudes uniform on [0.25, 1] x width and both signs equally (fixed seed, 20,000 draws)', () => {
    const stream = createRandomStream('blinding-test/moments');
    const n = 20_000;
    let sumFraction = 0;
    let positive = 0;
    for (let k = 0; k < n; k++) {
      const offset = drawBlindingOffsets({ wa: 2 }, stream).wa;
      sumFraction += Math.abs(offset) / 2;
      if (offset > 0) positive++;
    }
    // Uniform on [a, 1]: mean (1 + a) / 2 = 0.625, sd (1 - a) / sqrt(12) = 0.2165 (textbook moments of a uniform law);
    // tolerance 4 standard errors of the mean, 4 x 0.2165 / sqrt(n).
    expect(Math.abs(sumFraction / n - 0.625)).toBeLessThan((4 * 0.2165) / Math.sqrt(n));
    // Sign: binomial(n, 1/2), sd sqrt(n) / 2; 4 sd.
    expect(Math.abs(positive - n / 2)).toBeLessThan(4 * Math.sqrt(n) / 2);
  });

  it('gives the same offsets for the same seed and other offsets for another seed', () => {
    const a = drawBlindingOffsets({ w0: 0.3, wa: 1 }, createRandomStream('s/blinding/abc'));
    const b = drawBlindingOffsets({ w0: 0.3, wa: 1 }, createRandomStream('s/blinding/abc'));
    const c = drawBlindingOffsets({ w0: 0.3, wa: 1 }, createRandomStream('s/blinding/abd'));
    expect(a).toEqual(b);
    expect(a).not.toEqual(c);
  });

  it('refuses a width that is not positive', () => {
    expect(() => drawBlindingOffsets({ w0: 0 }, createRandomStream('x'))).toThrow(/positive/);
    expect(() => drawBlindingOffsets({ w0: Number.NaN }, createRandomStream('x'))).toThrow(/positive/);
  });
});
