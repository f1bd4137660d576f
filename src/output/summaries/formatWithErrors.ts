import { pdgRoundingPlace } from './pdgRoundingPlace.js';
import { roundToDecimalPlace } from './roundToDecimalPlace.js';

/** Where a formatted number goes: LaTeX math mode (without the $ signs) or plain text (Markdown, terminal). */
export type NumberStyle = 'latex' | 'plain';

/** Significant digits shown when no usable error fixes the precision (zero, negative or non-finite errors). */
const FALLBACK_SIGNIFICANT_DIGITS = 4;

/** Text shown for a value that is not a finite number. */
const MISSING_TEXT = 'n/a';

/**
 * Place (power of ten) used for a value with two errors: the smaller
 * positive error decides (PDG rule, see pdgRoundingPlace), so that the
 * smaller error keeps at least one significant digit; when neither error is
 * positive and finite, the value's own FALLBACK_SIGNIFICANT_DIGITS decide.
 *
 * Cost: O(1).
 * @param value central value (any unit).
 * @param errors uncertainties in the unit of the value.
 * @returns the place p (round to multiples of 10^p).
 * @example roundingPlaceFor(0.298, [0.022, 0.021]) // -3
 */
export function roundingPlaceFor(value: number, errors: readonly number[]): number {
  const usable = errors.filter((error) => error > 0 && Number.isFinite(error));
  if (usable.length) return pdgRoundingPlace(Math.min(...usable)) as number;
  const magnitude = value !== 0 && Number.isFinite(value) ? Math.floor(Math.log10(Math.abs(value))) : 0;
  return magnitude - FALLBACK_SIGNIFICANT_DIGITS + 1;
}

/**
 * A value with asymmetric errors, PDG-rounded: the smaller error sets the
 * decimal place (see roundingPlaceFor), the value and both errors are
 * rounded to it. When both errors print the same, a symmetric form is used.
 *
 * Plain: '0.298 +0.022 -0.021' or '0.298 ± 0.022'.
 * LaTeX (math mode, no $): '0.298^{+0.022}_{-0.021}' or '0.298 \pm 0.022'.
 *
 * Cost: O(1).
 * @param value central value (any unit).
 * @param plus upper error (value to upper bound), same unit, >= 0.
 * @param minus lower error (lower bound to value), same unit, >= 0.
 * @param style 'plain' (default) or 'latex'.
 * @returns the text; 'n/a' when the value is not finite.
 * @example formatWithErrors(0.2981, 0.0219, 0.0214) // '0.298 +0.022 -0.021'
 * @example formatWithErrors(0.2981, 0.0219, 0.0214, 'latex') // '0.298^{+0.022}_{-0.021}'
 */
export function formatWithErrors(value: number, plus: number, minus: number, style: NumberStyle = 'plain'): string {
  if (!Number.isFinite(value)) return MISSING_TEXT;
  const place = roundingPlaceFor(value, [plus, minus]);
  const center = roundToDecimalPlace(value, place);
  const upper = Number.isFinite(plus) ? roundToDecimalPlace(Math.abs(plus), place) : MISSING_TEXT;
  const lower = Number.isFinite(minus) ? roundToDecimalPlace(Math.abs(minus), place) : MISSING_TEXT;
  if (upper === lower) return style === 'latex' ? `${center} \\pm ${upper}` : `${center} ± ${upper}`;
  return style === 'latex' ? `${center}^{+${upper}}_{-${lower}}` : `${center} +${upper} -${lower}`;
}

/**
 * A value with one symmetric error (e.g. mean ± sd), PDG-rounded.
 * Plain: '0.298 ± 0.022'; LaTeX: '0.298 \pm 0.022'.
 *
 * Cost: O(1).
 * @param value central value (any unit).
 * @param error uncertainty, same unit, >= 0.
 * @param style 'plain' (default) or 'latex'.
 * @example formatWithError(0.827, 0.119) // '0.83 ± 0.12'
 */
export function formatWithError(value: number, error: number, style: NumberStyle = 'plain'): string {
  return formatWithErrors(value, error, error, style);
}

/**
 * An interval [low, high] rounded to a given place, e.g. the 95.45%
 * interval at the place of the row's 68.27% errors.
 * Plain: '[0.255, 0.342]'; LaTeX: '[0.255,\,0.342]'.
 *
 * Cost: O(1).
 * @param low lower end (any unit).
 * @param high upper end, same unit.
 * @param place power of ten of the last digit (see roundingPlaceFor).
 * @param style 'plain' (default) or 'latex'.
 * @example formatInterval(0.25512, 0.34198, -3) // '[0.255, 0.342]'
 */
export function formatInterval(low: number, high: number, place: number, style: NumberStyle = 'plain'): string {
  const show = (x: number): string => (Number.isFinite(x) ? roundToDecimalPlace(x, place) : MISSING_TEXT);
  return style === 'latex' ? `[${show(low)},\\,${show(high)}]` : `[${show(low)}, ${show(high)}]`;
}
