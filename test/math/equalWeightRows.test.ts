import { describe, expect, it } from 'vitest';
import { equalWeightRows, resampleRowsByWeight } from '../../src/math/index.js';

describe('equalWeightRows', () => {
  it('picks without weights the row in the middle of each of `count` equal shares of the kept rows', () => {
    const kept = Int32Array.from({ length: 10 }, (_, k) => 100 + k);
    // shares of 2.5 rows: middles at 1.25, 3.75, 6.25, 8.75 -> positions 1, 3, 6, 8
    expect(Array.from(equalWeightRows(kept, null, 4, 'any'))).toEqual([101, 103, 106, 108]);
  });

  it('returns every kept row when fewer rows than draws are kept', () => {
    expect(Array.from(equalWeightRows(Int32Array.of(5, 9, 12), null, 400, 'any'))).toEqual([5, 9, 12]);
  });

  it('with weights maps the systematic resample (Kitagawa 1996) of the kept rows onto their chain rows', () => {
    const kept = Int32Array.of(40, 41, 42);
    const weights = Float64Array.of(0.5, 0, 0.5);
    const picks = equalWeightRows(kept, weights, 4, 'demo');
    expect(Array.from(picks)).toEqual(Array.from(resampleRowsByWeight(weights, 4, 'demo'), (k) => kept[k]));
    expect(Array.from(picks)).toEqual([40, 40, 42, 42]);
  });
});
