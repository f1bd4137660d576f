import { describe, expect, it } from 'vitest';
import { logBayesFactor, readBayesFactor } from '../../src/compare/index.js';

describe('readBayesFactor', () => {
  it('puts 2 ln B into the four bands of Kass & Raftery (1995): <2, 2-6, 6-10, >=10', () => {
    const cases: Array<[number, string]> = [
      [0, 'negligible'], [0.99, 'negligible'], [1, 'positive'], [2.99, 'positive'], [3, 'strong'], [4.99, 'strong'], [5, 'very strong'], [40, 'very strong'],
    ];
    for (const [lnB, strength] of cases) {
      expect(readBayesFactor(lnB).strength, `ln B = ${lnB}`).toBe(strength);
      expect(readBayesFactor(-lnB).strength, `ln B = ${-lnB}`).toBe(strength);
    }
  });

  it('says which model is favoured, in either direction', () => {
    expect(readBayesFactor(4, 'wCDM', 'LCDM')).toEqual({ twiceLogBayesFactor: 8, strength: 'strong', favours: 'model', sentence: 'strong support for wCDM over LCDM (2 ln B = 8.00)' });
    expect(readBayesFactor(-1.5, 'wCDM', 'LCDM').sentence).toBe('positive support for LCDM over wCDM (2 ln B = -3.00)');
    expect(readBayesFactor(0.2, 'wCDM', 'LCDM').favours).toBe('neither');
  });

  it('throws compare.invalid_argument for NaN', () => {
    expect(() => readBayesFactor(Number.NaN)).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'compare.invalid_argument' })] }));
  });
});

describe('logBayesFactor', () => {
  it('is ln Z_model - ln Z_base with errors added in quadrature (independent runs)', () => {
    expect(logBayesFactor({ logZ: -10, logZError: 0.3 }, { logZ: -12, logZError: 0.4 })).toEqual({ logBayesFactor: 2, error: 0.5 });
  });

  it('throws compare.invalid_argument for a non-finite ln Z', () => {
    expect(() => logBayesFactor({ logZ: -Infinity, logZError: 0.1 }, { logZ: 0, logZError: 0.1 })).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ path: 'model' })] }));
  });
});
