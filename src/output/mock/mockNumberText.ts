/**
 * Decimals written per kind of value in the files of a mock survey. 6
 * decimals keep redshifts, magnitudes, x1 and c (and their errors, >= 0.005)
 * to better than 2e-4 of their smallest error; host masses need 4 (dex);
 * covariances and the systematics keep 7 significant digits.
 */
export const MOCK_DECIMALS = 6;
/** Decimals of host log masses and their errors, dex. */
export const MOCK_MASS_DECIMALS = 4;
/** Significant digits of covariances and systematic shifts. */
export const MOCK_SIGNIFICANT_DIGITS = 7;

/**
 * A number with a fixed count of decimals, never written as negative zero.
 * @param value the number.
 * @param decimals digits after the point (default MOCK_DECIMALS).
 * @returns the text.
 * @throws nothing.
 * @example fixedDecimals(-0.0000001) // '0.000000'
 */
export function fixedDecimals(value: number, decimals = MOCK_DECIMALS): string {
  const text = value.toFixed(decimals);
  return /^-0\.0*$/.test(text) ? text.slice(1) : text;
}

/**
 * A number in exponent form with MOCK_SIGNIFICANT_DIGITS digits; 0 as '0'.
 * @param value the number.
 * @returns the text.
 * @throws nothing.
 * @example significantDigits(0.000123456789) // '1.234568e-4'
 */
export function significantDigits(value: number): string {
  return value === 0 ? '0' : value.toExponential(MOCK_SIGNIFICANT_DIGITS - 1);
}
