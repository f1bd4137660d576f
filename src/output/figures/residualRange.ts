/** Share of supernovae whose residual plus error must fit on the axis; the rest (outliers) are clipped at the panel edge. */
const COVERED_SHARE = 0.98;
/** Smallest half-range of the residual axis (mag), so a near-perfect fit still shows a readable scale. */
const MIN_HALF_RANGE_MAG = 0.15;
/** Residual-axis half-ranges are rounded up to this step (mag). */
const HALF_RANGE_STEP_MAG = 0.1;
/** Slack (in steps) so that a reach of exactly 0.3 mag, stored as 0.30000000000000004, is not rounded up to 0.4. */
const STEP_ROUNDING_SLACK = 1e-9;

/**
 * A symmetric range for a residual axis: wide enough for 98% of the points
 * with their error bars (the largest outliers are clipped instead of
 * squeezing everyone else), at least ±0.15 mag, rounded up to 0.1 mag.
 *
 * Cost: O(n log n) (one sort).
 *
 * @param residualMag residuals (mag); non-finite entries are ignored
 * @param errorMag one-sigma errors (mag), same length; non-finite entries count as 0
 * @returns [-halfRange, +halfRange] (mag)
 * @example residualRangeMag(Float64Array.of(0.1, -0.3), Float64Array.of(0.1, 0.1)) // [-0.4, 0.4]
 */
export function residualRangeMag(residualMag: ArrayLike<number>, errorMag: ArrayLike<number>): [number, number] {
  const reach: number[] = [];
  for (let index = 0; index < residualMag.length; index++) {
    const value = residualMag[index];
    if (!Number.isFinite(value)) continue;
    const error = Number.isFinite(errorMag[index]) ? Math.abs(errorMag[index]) : 0;
    reach.push(Math.abs(value) + error);
  }
  reach.sort((a, b) => a - b);
  const covered = reach.length ? reach[Math.floor(COVERED_SHARE * (reach.length - 1))] : 0;
  const half = Math.max(MIN_HALF_RANGE_MAG, Math.ceil(covered / HALF_RANGE_STEP_MAG - STEP_ROUNDING_SLACK) * HALF_RANGE_STEP_MAG);
  const rounded = Number(half.toFixed(6));
  return [-rounded, rounded];
}
