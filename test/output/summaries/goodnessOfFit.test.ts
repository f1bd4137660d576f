import { describe, expect, it } from 'vitest';
import { goodnessOfFit, goodnessOfFitWarning } from '../../../src/output/summaries/goodnessOfFit.js';

// Upper-tail critical values of the chi-square distribution: NIST/SEMATECH
// e-Handbook of Statistical Methods, section 1.3.6.7.4 (table of the
// chi-square distribution), and Abramowitz & Stegun (1964), table 26.8.
describe('goodnessOfFit', () => {
  it('gives the tabulated upper-tail probabilities', () => {
    expect(goodnessOfFit(18.307, 10)!.pValue).toBeCloseTo(0.05, 4); // k = 10, 0.05 point 18.307
    expect(goodnessOfFit(23.209, 10)!.pValue).toBeCloseTo(0.01, 4); // k = 10, 0.01 point 23.209
    expect(goodnessOfFit(3.940, 10)!.pValue).toBeCloseTo(0.95, 4); // k = 10, 0.95 point 3.940
    expect(goodnessOfFit(124.342, 100)!.pValue).toBeCloseTo(0.05, 4); // k = 100, 0.05 point 124.342
  });

  it('flags p below 0.001 (k = 10: 29.588 is the 0.001 point) and above 0.999 (k = 10: 1.479 is the 0.999 point)', () => {
    expect(goodnessOfFit(29.0, 10)!.flagged).toBe(false);
    expect(goodnessOfFit(30.5, 10)!.flagged).toBe(true);
    expect(goodnessOfFit(1.6, 10)!.flagged).toBe(false);
    expect(goodnessOfFit(1.3, 10)!.flagged).toBe(true);
  });

  it('reads a chi-square per degree of freedom of 0.43 on 1,700 points as errors too large', () => {
    const fit = goodnessOfFit(0.43 * 1700, 1700)!;
    expect(fit.reducedChiSquare).toBeCloseTo(0.43, 12);
    const warning = goodnessOfFitWarning(fit)!;
    expect(warning).toMatchObject({ code: 'goodness_of_fit', parameter: null });
    expect(warning.message).toContain('errors too large');
    expect(goodnessOfFitWarning(goodnessOfFit(1700, 1700)!)).toBeNull();
  });

  it('is null without a chi-square or a degree of freedom', () => {
    expect(goodnessOfFit(null, 10)).toBeNull();
    expect(goodnessOfFit(3, 0)).toBeNull();
  });
});
