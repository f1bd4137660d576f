/**
 * Reordering of a 3N x 3N light-curve covariance into candela's canonical
 * order: interleaved per supernova, (m_B, x1, c) within each block.
 */

/** A light-curve parameter as named in block orders. */
export type LightCurveParameter = 'm_b' | 'x1' | 'color';

/** The canonical order of parameters within a supernova block. */
export const CANONICAL_BLOCK_ORDER: readonly LightCurveParameter[] = ['m_b', 'x1', 'color'];

/**
 * Returns a new row-major 3N x 3N matrix in canonical order from `values` as
 * stored in a file. `interleaved`: the file index of (supernova s, parameter p)
 * is 3 s + position of p in `blockOrder`; `grouped`: all N values of the first
 * parameter of `blockOrder`, then the second, then the third, so the index is
 * position(p) N + s. Cost O(9 N^2).
 * @param values file-ordered matrix, row major, length (3N)^2.
 * @param count number of supernovae N.
 * @param blockOrder a permutation of ['m_b', 'x1', 'color'] giving the file's parameter order.
 * @param layout how the file groups the entries.
 * @example
 * // one supernova stored as (color, x1, m_b): the canonical (m_b, m_b) entry is the file's (2, 2)
 * reorderLightCurveCovariance(values, 1, ['color', 'x1', 'm_b'], 'interleaved')[0] === values[8]
 */
export function reorderLightCurveCovariance(
  values: Float64Array, count: number, blockOrder: readonly LightCurveParameter[], layout: 'interleaved' | 'grouped',
): Float64Array {
  const size = 3 * count;
  const fileIndex = new Int32Array(size);
  for (let s = 0; s < count; s++) {
    for (let p = 0; p < 3; p++) {
      const position = blockOrder.indexOf(CANONICAL_BLOCK_ORDER[p]);
      fileIndex[3 * s + p] = layout === 'interleaved' ? 3 * s + position : position * count + s;
    }
  }
  const out = new Float64Array(size * size);
  for (let i = 0; i < size; i++) {
    const fileRow = fileIndex[i] * size;
    const row = i * size;
    for (let j = 0; j < size; j++) out[row + j] = values[fileRow + fileIndex[j]];
  }
  return out;
}

/**
 * True when `order` is a permutation of m_b, x1, color.
 * @example isBlockOrder(['color', 'x1', 'm_b']) // true
 */
export function isBlockOrder(order: readonly string[]): order is LightCurveParameter[] {
  return order.length === 3 && CANONICAL_BLOCK_ORDER.every((p) => order.includes(p));
}
