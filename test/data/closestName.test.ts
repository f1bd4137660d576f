import { describe, expect, it } from 'vitest';
import { closestName } from '../../src/data/closestName.js';

describe('closestName', () => {
  it('suggests across a case difference, a transposition (Damerau 1964) and a substitution', () => {
    expect(closestName('ZCMB', ['zcmb', 'zhel'])).toBe('zcmb');
    expect(closestName('zcbm', ['zcmb', 'zhel'])).toBe('zcmb');
    expect(closestName('HOST_LOGMAS', ['HOST_LOGMASS', 'HOST_LOGMASS_ERR'])).toBe('HOST_LOGMASS');
  });
  it('offers nothing when no name is close', () => {
    expect(closestName('redshift', ['mb', 'dmb', 'x1'])).toBeUndefined();
  });
});
