import { describe, expect, it } from 'vitest';
import { blindColumns, blindValues } from '../../../src/output/index.js';

describe('blindColumns', () => {
  it('adds each offset to its column only, keeps -Infinity and NaN, and leaves the input unchanged', () => {
    const w0 = Float64Array.of(-1, -0.9, Number.NaN, -Infinity);
    const alpha = Float64Array.of(0.14, 0.15, 0.16, 0.17);
    const shown = blindColumns({ w0, alpha }, { w0: 0.25 });
    expect(Array.from(shown.w0)).toEqual([-0.75, -0.9 + 0.25, Number.NaN, -Infinity]);
    expect(shown.alpha).toBe(alpha);
    expect(w0[0]).toBe(-1);
  });

  it('keeps the spread: the sample standard deviation of a shifted column is unchanged (shift invariance of the variance)', () => {
    const values = Float64Array.from({ length: 101 }, (_, k) => Math.sin(k));
    const shifted = blindColumns({ x: values }, { x: 0.3 }).x;
    const sd = (a: Float64Array) => { const m = a.reduce((s, v) => s + v, 0) / a.length; return Math.sqrt(a.reduce((s, v) => s + (v - m) ** 2, 0) / (a.length - 1)); };
    expect(sd(shifted)).toBeCloseTo(sd(values), 12);
  });
});

describe('blindValues', () => {
  it('shifts the named values and keeps the key order', () => {
    expect(blindValues({ w0: -1, alpha: 0.14, wa: 0 }, { w0: 0.2, wa: -0.5 })).toEqual({ w0: -0.8, alpha: 0.14, wa: -0.5 });
    expect(Object.keys(blindValues({ w0: -1, alpha: 0.14, wa: 0 }, { wa: 1 }))).toEqual(['w0', 'alpha', 'wa']);
  });
});
