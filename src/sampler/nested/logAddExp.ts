/**
 * ln(e^a + e^b) without overflow or underflow (common practice); either
 * argument may be -Infinity (a zero term).
 *
 * Cost: one exp and one log1p.
 * @example logAddExp(Math.log(2), Math.log(3)) // ln 5
 */
export function logAddExp(a: number, b: number): number {
  if (a === -Infinity) return b;
  if (b === -Infinity) return a;
  return a > b ? a + Math.log1p(Math.exp(b - a)) : b + Math.log1p(Math.exp(a - b));
}
