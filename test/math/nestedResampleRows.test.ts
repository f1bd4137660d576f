import { describe, expect, it } from 'vitest';
import { resampleRowsByWeight } from '../../src/math/nestedResampleRows.js';
import { isCandelaError } from '../../src/errors.js';

// Systematic resampling (Kitagawa 1996; Carpenter, Clifford & Fearnhead 1999): each row is
// picked floor(n w) or ceil(n w) times, w its normalized weight (the defining property of the scheme).
describe('resampleRowsByWeight', () => {
  it('picks every row floor or ceil of count x its normalized weight times, in ascending order', () => {
    const weights = Float64Array.from({ length: 50 }, (_, k) => (k % 7 === 0 ? 0 : 1 + Math.sin(k) ** 2));
    const total = weights.reduce((sum, w) => sum + w, 0);
    for (const seed of ['a', 'b', 'c']) {
      const picks = resampleRowsByWeight(weights, 1000, seed);
      expect(picks.length).toBe(1000);
      const counts = new Array(50).fill(0);
      for (const row of picks) counts[row]++;
      counts.forEach((count, row) => {
        const expected = (1000 * weights[row]) / total;
        expect(count, `row ${row}`).toBeGreaterThanOrEqual(Math.floor(expected));
        expect(count, `row ${row}`).toBeLessThanOrEqual(Math.ceil(expected));
      });
      expect(Array.from(picks)).toEqual(Array.from(picks).sort((a, b) => a - b));
    }
  });

  it('never picks a row of zero weight and is the same for the same seed', () => {
    const weights = Float64Array.of(0, 0.25, 0, 0.75, 0);
    const picks = resampleRowsByWeight(weights, 8, 'seed');
    expect(Array.from(picks)).toEqual([1, 1, 3, 3, 3, 3, 3, 3]);
    expect(resampleRowsByWeight(weights, 8, 'seed')).toEqual(picks);
  });

  it('throws run.bad_weights for negative or all-zero weights and run.bad_resample for a bad count', () => {
    const code = (action: () => unknown) => { try { action(); } catch (error) { return isCandelaError(error) ? error.issues[0].code : 'other'; } return 'none'; };
    expect(code(() => resampleRowsByWeight([1, -1], 2, 's'))).toBe('run.bad_weights');
    expect(code(() => resampleRowsByWeight([0, 0], 2, 's'))).toBe('run.bad_weights');
    expect(code(() => resampleRowsByWeight([1, 1], 0, 's'))).toBe('run.bad_resample');
  });
});
