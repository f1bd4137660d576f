import { describe, expect, it } from 'vitest';
import { closestWord } from '../../../src/math/index.js';

describe('closestWord', () => {
  const keys = ['walkers', 'ensembles', 'stretch_scale', 'max_steps'];

  it('finds typos, case and separator differences', () => {
    expect(closestWord('walker', keys)).toBe('walkers');
    expect(closestWord('Walkers', keys)).toBe('walkers');
    expect(closestWord('max-steps', keys)).toBe('max_steps');
    expect(closestWord('maxSteps', keys)).toBe('max_steps');
    expect(closestWord('strech_scale', keys)).toBe('stretch_scale');
  });

  it('offers nothing when no candidate is close enough to be a typo', () => {
    expect(closestWord('banana', keys)).toBeNull();
    expect(closestWord('ab', ['xy'])).toBeNull();
    expect(closestWord('walkers', [])).toBeNull();
  });
});
