import { describe, expect, it } from 'vitest';
import { quadratureDifference } from '../../../src/math/reweighting/quadratureDifference.js';

describe('quadratureDifference', () => {
  it('give 3 for errors 5 and 4 (a 3-4-5 triangle, by hand)', () => {
    expect(quadratureDifference(5, 4)).toBe(3);
  });

  it('keep the sign when the error without the ingredient is the larger one (Monte Carlo noise)', () => {
    expect(quadratureDifference(4, 5)).toBe(-3);
  });

  it('give 0 for equal errors and the full error when the other is 0', () => {
    expect(quadratureDifference(0.2, 0.2)).toBe(0);
    expect(quadratureDifference(0.2, 0)).toBeCloseTo(0.2, 15);
  });
});
