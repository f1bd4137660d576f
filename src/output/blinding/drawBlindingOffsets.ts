/**
 * The secret additive offsets of a blinded run: one per blinded parameter,
 * drawn from a seeded stream, so that shown value = true value + offset.
 * An additive offset moves a marginal without changing its shape, so
 * widths, correlations, R-hat, ESS and autocorrelation times of the shown
 * values equal those of the true ones (common practice of blind analyses).
 */
import type { RandomStream } from '../../math/index.js';

/**
 * Smallest |offset| as a fraction of the parameter's width: an offset is
 * never near zero, so a shown value is never by chance close to the true one
 * (common practice; chosen so that |offset| exceeds the last digit any table
 * quotes for a posterior narrower than the width).
 */
export const MINIMUM_OFFSET_FRACTION = 0.25;

/**
 * Draws one offset per parameter, in the order of `widths`' keys: a random
 * sign times a magnitude uniform in [MINIMUM_OFFSET_FRACTION x width, width].
 * Two uniform deviates per parameter, so the same stream gives the same
 * offsets on every machine.
 * Cost: O(parameters).
 * @param widths largest |offset| per parameter name, in the parameter's unit (> 0, finite).
 * @param stream the seeded stream (math/createRandomStream), advanced by 2 x parameters draws.
 * @returns offset per parameter name, in the parameter's unit.
 * @throws RangeError when a width is not a positive finite number (the configuration reader refuses those first).
 * @example drawBlindingOffsets({ w0: 0.3 }, createRandomStream('7/blinding')).w0 // a number with 0.075 <= |w0| <= 0.3
 */
export function drawBlindingOffsets(widths: Readonly<Record<string, number>>, stream: RandomStream): Record<string, number> {
  const offsets: Record<string, number> = {};
  for (const [name, width] of Object.entries(widths)) {
    if (!(Number.isFinite(width) && width > 0)) throw new RangeError(`blinding width of ${name} must be a positive finite number, got ${width}`);
    const sign = stream.uniform() < 0.5 ? -1 : 1;
    const fraction = MINIMUM_OFFSET_FRACTION + (1 - MINIMUM_OFFSET_FRACTION) * stream.uniform();
    offsets[name] = sign * fraction * width;
  }
  return offsets;
}
