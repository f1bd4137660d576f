/**
 * Rounds a number to a power-of-ten place and prints it, working on the
 * shortest decimal that reads back as the same double (so 0.825 rounds to
 * "0.83" as written, not to "0.82" as the binary value 0.8249999... would),
 * rounding halves away from zero. Fixed notation, never exponents; "-0"
 * is printed as "0".
 *
 * Cost: O(number of digits).
 * @param value finite number (any unit).
 * @param place the power of ten of the last kept digit: -2 keeps hundredths, 1 rounds to tens.
 * @returns the rounded number as text with exactly max(0, -place) decimals.
 * @example roundToDecimalPlace(0.8275, -2) // '0.83'
 * @example roundToDecimalPlace(1234, 2) // '1200'
 */
export function roundToDecimalPlace(value: number, place: number): string {
  if (!Number.isFinite(value)) return String(value);
  const negative = value < 0;
  const [mantissa, exponentText] = Math.abs(value).toExponential().split('e');
  const digits = mantissa.replace('.', '');
  const exponent = Number(exponentText);
  // digits[k] multiplies 10^(exponent - k); keep those with exponent - k >= place.
  const keep = exponent - place + 1;
  let integer: bigint;
  if (keep < 0) {
    integer = 0n;
  } else {
    const kept = digits.slice(0, keep).padEnd(keep, '0');
    integer = kept === '' ? 0n : BigInt(kept);
    const next = keep < digits.length ? Number(digits[keep]) : 0;
    if (next >= 5) integer += 1n;
  }
  let text: string;
  if (place >= 0) {
    text = integer === 0n ? '0' : integer.toString() + '0'.repeat(place);
  } else {
    const decimals = -place;
    const padded = integer.toString().padStart(decimals + 1, '0');
    text = `${padded.slice(0, padded.length - decimals)}.${padded.slice(padded.length - decimals)}`;
  }
  return negative && integer !== 0n ? `-${text}` : text;
}
