import { describe, expect, it } from 'vitest';
import { editDistance } from '../../../src/math/index.js';

describe('editDistance', () => {
  it('gives the Levenshtein (1966) distance for insertions, deletions and substitutions', () => {
    // kitten -> sitting = 3 (k->s, e->i, +g): the standard worked example (common practice, textbook example).
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('abc', '')).toBe(3);
    expect(editDistance('same', 'same')).toBe(0);
  });

  it('counts a swap of two neighbours as one edit (Damerau 1964)', () => {
    expect(editDistance('ab', 'ba')).toBe(1);
    expect(editDistance('walkres', 'walkers')).toBe(1);
  });

  it('is the restricted (optimal string alignment) form: ca -> abc is 3, not 2', () => {
    // The classic example separating the two Damerau-Levenshtein variants (from memory:
    // the unrestricted distance is 2 via ca -> ac -> abc, which edits a substring twice).
    expect(editDistance('ca', 'abc')).toBe(3);
  });

  it('is symmetric', () => {
    for (const [a, b] of [['omega_m', 'omgea_m'], ['sigma_int', 'sigma'], ['x1', 'color']]) {
      expect(editDistance(a, b)).toBe(editDistance(b, a));
    }
  });
});
