import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { checkSystematicModes } from '../../src/likelihood/checkSystematicModes.js';

describe('checkSystematicModes', () => {
  const values = Float64Array.of(0.01, 0.02, -0.01, 0, 0.03, 0.01);
  it('returns the values of N x K modes, and null without modes or with K = 0', () => {
    expect(checkSystematicModes({ count: 3, modeCount: 2, values, sourceFile: 'm.csv' }, 3)).toBe(values);
    expect(checkSystematicModes(undefined, 3)).toBeNull();
    expect(checkSystematicModes({ count: 3, modeCount: 0, values: new Float64Array(0), sourceFile: 'm.csv' }, 3)).toBeNull();
  });
  it('refuses modes for another number of supernovae, naming the file', () => {
    try {
      checkSystematicModes({ count: 3, modeCount: 2, values, sourceFile: 'm.csv' }, 4);
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0]).toMatchObject({ code: 'likelihood.modes_mismatch', file: 'm.csv', expected: '4 rows x K modes' });
    }
  });
  it('refuses a non-finite shift with its supernova row', () => {
    const broken = Float64Array.from(values);
    broken[3] = Infinity;
    try {
      checkSystematicModes({ count: 3, modeCount: 2, values: broken, sourceFile: 'm.csv' }, 3);
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0]).toMatchObject({ code: 'likelihood.low_rank_mode', row: 2, message: 'mode 2 of supernova 2 is not a finite number' });
    }
  });
});
