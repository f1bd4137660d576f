import type { SystematicModes } from './supernovaTable.js';

/**
 * Systematic modes with some columns removed from their covariance
 * C_sys = U U^T: the removed columns of U are set to zero, so that their
 * part u_k u_k^T vanishes while the width K and every other column's index
 * stay as they were; null when every column is removed (no modes left).
 * The input is not changed.
 *
 * Cost: O(N K) for the copy.
 * @param modes U, N x K row major (mag).
 * @param removed indices of the columns to remove, each in 0..K-1.
 * @returns a copy with those columns zeroed, or null when none is left.
 * @throws nothing.
 * @example withoutModeColumns({ count: 1, modeCount: 2, values: Float64Array.of(0.1, 0.2), sourceFile: 'm.csv' }, [0])?.values // Float64Array [0, 0.2]
 */
export function withoutModeColumns(modes: SystematicModes, removed: ReadonlySet<number>): SystematicModes | null {
  if (removed.size >= modes.modeCount) return null;
  const values = Float64Array.from(modes.values);
  for (let i = 0; i < modes.count; i++) for (const j of removed) values[i * modes.modeCount + j] = 0;
  return { ...modes, values };
}
