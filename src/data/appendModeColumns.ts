import type { SystematicModes } from './supernovaTable.js';

/**
 * Two sets of systematic modes of the same N supernovae side by side:
 * U = [A | B], N x (K_A + K_B), row major, the columns of A first. Either
 * set may have no columns; the covariance of the result is A A^T + B B^T.
 * Cost O(N (K_A + K_B)).
 * @param first A (N x K_A, mag), or null for none.
 * @param second B: its N x K_B values (mag, row major) and K_B.
 * @param count N, the number of supernovae.
 * @param sourceFile what the joined modes are called in messages.
 * @returns the joined modes (no column names).
 * @throws nothing.
 * @example appendModeColumns(null, { values: Float64Array.of(1, 2), modeCount: 1 }, 2, 'x').modeCount // 1
 */
export function appendModeColumns(
  first: SystematicModes | null, second: { values: Float64Array; modeCount: number }, count: number, sourceFile: string,
): SystematicModes {
  const firstCount = first ? first.modeCount : 0;
  const secondCount = second.modeCount;
  const width = firstCount + secondCount;
  const values = new Float64Array(count * width);
  for (let i = 0; i < count; i++) {
    for (let j = 0; j < firstCount; j++) values[i * width + j] = (first as SystematicModes).values[i * firstCount + j];
    for (let j = 0; j < secondCount; j++) values[i * width + firstCount + j] = second.values[i * secondCount + j];
  }
  return { count, modeCount: width, values, sourceFile };
}
