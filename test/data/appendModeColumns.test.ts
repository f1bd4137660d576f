import { describe, expect, it } from 'vitest';
import { appendModeColumns } from '../../src/data/index.js';

describe('appendModeColumns', () => {
  it('puts the columns of the second set after those of the first, row by row', () => {
    const first = { count: 2, modeCount: 2, values: Float64Array.of(1, 2, 3, 4), sourceFile: 'a' };
    const joined = appendModeColumns(first, { values: Float64Array.of(5, 6), modeCount: 1 }, 2, 'joined');
    expect(joined).toMatchObject({ count: 2, modeCount: 3, sourceFile: 'joined' });
    expect(Array.from(joined.values)).toEqual([1, 2, 5, 3, 4, 6]);
  });

  it('takes no first set, and gives no columns when neither has any', () => {
    expect(Array.from(appendModeColumns(null, { values: Float64Array.of(7, 8), modeCount: 1 }, 2, 'x').values)).toEqual([7, 8]);
    expect(appendModeColumns(null, { values: new Float64Array(0), modeCount: 0 }, 2, 'x').modeCount).toBe(0);
  });
});
