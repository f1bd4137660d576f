import { describe, expect, it } from 'vitest';
import { formatInterval, formatWithError, formatWithErrors, pdgRoundingPlace, roundToDecimalPlace, roundingPlaceFor } from '../../../src/output/index.js';

// Source for the rule: Particle Data Group, Review of Particle Physics, Introduction,
// section "Rounding": the three highest-order digits of the error decide; 100-354 -> two
// significant digits, 355-949 -> one, 950-999 -> round up to 1000 and keep two; the value is
// rounded to the same decimal place. Each expected string below was worked out by hand.
describe('pdgRoundingPlace', () => {
  it('keeps two digits for leading digits 100-354, one for 355-949, two of 1000 for 950-999', () => {
    expect(pdgRoundingPlace(0.119)).toBe(-2); // 119 -> two digits -> hundredths
    expect(pdgRoundingPlace(0.367)).toBe(-1); // 367 -> one digit -> tenths
    expect(pdgRoundingPlace(0.971)).toBe(-1); // 971 -> 1000 -> "1.0" -> tenths
    expect(pdgRoundingPlace(0.354)).toBe(-2); // boundary: 354 is the last two-digit case
    expect(pdgRoundingPlace(0.355)).toBe(-1); // boundary: 355 is the first one-digit case (read as written, not 0.35499...)
    expect(pdgRoundingPlace(0.3549)).toBe(-2); // leading digits are truncated: 354
    expect(pdgRoundingPlace(0.949)).toBe(-1);
    expect(pdgRoundingPlace(0.95)).toBe(-1); // 950 -> 1000 -> "1.0"
    expect(pdgRoundingPlace(2)).toBe(-1); // 200 -> "2.0"
    expect(pdgRoundingPlace(35)).toBe(0); // 350 -> "35"
    expect(pdgRoundingPlace(1234)).toBe(2); // 123 -> "1200"
  });
  it('has no place for a zero, negative or non-finite error', () => {
    expect(pdgRoundingPlace(0)).toBeUndefined();
    expect(pdgRoundingPlace(-0.1)).toBeUndefined();
    expect(pdgRoundingPlace(Number.NaN)).toBeUndefined();
    expect(pdgRoundingPlace(Infinity)).toBeUndefined();
  });
});

describe('roundToDecimalPlace', () => {
  it('rounds the written decimal half away from zero and prints fixed decimals', () => {
    expect(roundToDecimalPlace(0.825, -2)).toBe('0.83'); // binary 0.8249999... but written 0.825
    expect(roundToDecimalPlace(-0.825, -2)).toBe('-0.83');
    expect(roundToDecimalPlace(0.971, -1)).toBe('1.0');
    expect(roundToDecimalPlace(1234, 2)).toBe('1200');
    expect(roundToDecimalPlace(70, -1)).toBe('70.0');
    expect(roundToDecimalPlace(0.004, -2)).toBe('0.00');
    expect(roundToDecimalPlace(-0.004, -2)).toBe('0.00'); // no "-0.00"
    expect(roundToDecimalPlace(0.00047, -3)).toBe('0.000');
    expect(roundToDecimalPlace(0.0005, -3)).toBe('0.001');
    expect(roundToDecimalPlace(-19.2534, -3)).toBe('-19.253');
    expect(roundToDecimalPlace(1e-7, -8)).toBe('0.00000010');
  });
});

describe('formatWithErrors', () => {
  it('rounds the worked examples of the PDG rule', () => {
    // 0.827 +- 0.119: digits 119 -> two significant digits (0.12) -> value to hundredths (0.83).
    expect(formatWithError(0.827, 0.119)).toBe('0.83 ± 0.12');
    // 0.827 +- 0.367: digits 367 -> one significant digit (0.4) -> value to tenths (0.8).
    expect(formatWithError(0.827, 0.367)).toBe('0.8 ± 0.4');
    // 0.827 +- 0.971: digits 971 -> rounded up to 1.0 (two digits) -> value to tenths (0.8).
    expect(formatWithError(0.827, 0.971)).toBe('0.8 ± 1.0');
  });
  it('lets the smaller of two asymmetric errors set the place', () => {
    // smaller error 0.0214: digits 214 -> two digits -> thousandths for all three numbers.
    expect(formatWithErrors(0.2981, 0.0219, 0.0214)).toBe('0.298 +0.022 -0.021');
    expect(formatWithErrors(0.2981, 0.0219, 0.0214, 'latex')).toBe('0.298^{+0.022}_{-0.021}');
    // smaller error 0.05: digits 500 -> one significant digit -> hundredths: 0.43 +0.21 -0.05.
    expect(formatWithErrors(0.4321, 0.2134, 0.05)).toBe('0.43 +0.21 -0.05');
    // H0-like numbers: smaller error 1.24 -> digits 124 -> tenths.
    expect(formatWithErrors(70.04, 1.31, 1.24)).toBe('70.0 +1.3 -1.2');
    expect(formatWithErrors(-19.2534, 0.0121, 0.0124, 'latex')).toBe('-19.253 \\pm 0.012');
  });
  it('falls back to four significant digits when no error is usable, and prints n/a for a missing value', () => {
    expect(formatWithErrors(0.123456, 0, 0)).toBe('0.1235 ± 0.0000');
    expect(formatWithErrors(Number.NaN, 0.1, 0.1)).toBe('n/a');
    expect(roundingPlaceFor(0.3, [0, Number.NaN, 0.02])).toBe(-3); // only 0.02 is usable: digits 200 -> "0.020"
  });
});

describe('formatInterval', () => {
  it('prints both ends at the given place', () => {
    expect(formatInterval(0.25512, 0.34198, -3)).toBe('[0.255, 0.342]');
    expect(formatInterval(0.25512, 0.34198, -3, 'latex')).toBe('[0.255,\\,0.342]');
  });
});
