import type { SystematicModes } from './supernovaTable.js';

/**
 * The systematic modes of the supernovae kept by a cut: the rows of U
 * (N x K, mag) of the kept supernovae, in the order of `keptIndices`; every
 * mode (column) is kept, so the cut covariance U_kept U_kept^T equals the
 * rows and columns of U U^T of the kept supernovae.
 * Cost O(k K) for k kept supernovae and K modes.
 * @param modes the modes of the uncut table.
 * @param keptIndices 0-based supernova indices into the uncut table (from applyCuts).
 * @throws RangeError when an index is outside the table (a programming error).
 * @example
 * // U = [[1, 2], [3, 4], [5, 6]] (3 supernovae, 2 modes)
 * subsetSystematicModes(modes, Int32Array.of(2, 0)).values // [5, 6, 1, 2]
 */
export function subsetSystematicModes(modes: SystematicModes, keptIndices: Int32Array): SystematicModes {
  const width = modes.modeCount;
  const values = new Float64Array(keptIndices.length * width);
  keptIndices.forEach((index, row) => {
    if (!(index >= 0 && index < modes.count)) {
      throw new RangeError(`subsetSystematicModes: supernova ${index} outside modes of ${modes.count} supernovae`);
    }
    values.set(modes.values.subarray(index * width, (index + 1) * width), row * width);
  });
  return { count: keptIndices.length, modeCount: width, values, sourceFile: modes.sourceFile };
}
