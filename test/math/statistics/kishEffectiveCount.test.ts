import { describe, expect, it } from 'vitest';
import { kishEffectiveCount } from '../../../src/math/index.js';

describe('kishEffectiveCount', () => {
  it('is (sum w)^2 / sum w^2 (Kish 1965)', () => {
    expect(kishEffectiveCount([1, 1, 2])).toBeCloseTo(16 / 6, 15);
    expect(kishEffectiveCount([0.25, 0.25, 0.25, 0.25])).toBeCloseTo(4, 15);
  });
});
