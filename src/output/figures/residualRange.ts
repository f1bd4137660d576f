import { robustDataRange } from './robustDataRange.js';

/** Quantile of |residual| that must fit on the axis, with a typical error bar around it; rarer outliers are cut and marked. */
const COVERED_QUANTILE = 0.99;
/** Smallest half-range of the residual axis (mag), so a near-perfect fit still shows a readable scale. */
const MIN_HALF_RANGE_MAG = 0.15;
/** Residual-axis half-ranges are rounded up to this step (mag). */
const HALF_RANGE_STEP_MAG = 0.1;
/** Slack (in steps) so that a reach of exactly 0.3 mag, stored as 0.30000000000000004, is not rounded up to 0.4. */
const STEP_ROUNDING_SLACK = 1e-9;

/**
 * A symmetric range for a residual axis set by the data, not by the largest
 * error bars: the 99th percentile of |residual| over the points that are not
 * strongly down-weighted (see robustDataRange) plus the median error, at
 * least ±0.15 mag, rounded up to 0.1 mag. Points and bars beyond it are cut
 * at the axis and marked by the figure.
 *
 * Cost: O(n log n).
 *
 * @param residualMag residuals (mag); non-finite entries are ignored
 * @param errorMag one-sigma errors (mag), same length; non-finite entries count as 0
 * @returns [-halfRange, +halfRange] (mag)
 * @example residualRangeMag(Float64Array.of(0.1, -0.3), Float64Array.of(0.1, 0.1)) // [-0.4, 0.4]
 */
export function residualRangeMag(residualMag: ArrayLike<number>, errorMag: ArrayLike<number>): [number, number] {
  const magnitude = Float64Array.from({ length: residualMag.length }, (_, index) => Math.abs(residualMag[index]));
  const range = robustDataRange(magnitude, errorMag, 0, COVERED_QUANTILE);
  const reach = (Number.isFinite(range.high) ? range.high : 0) + range.typicalError;
  const half = Math.max(MIN_HALF_RANGE_MAG, Math.ceil(reach / HALF_RANGE_STEP_MAG - STEP_ROUNDING_SLACK) * HALF_RANGE_STEP_MAG);
  const rounded = Number(half.toFixed(6));
  return [-rounded, rounded];
}
