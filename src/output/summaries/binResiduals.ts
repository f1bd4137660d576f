import type { BinnedResidual } from '../figures/index.js';
import { arrayExtent } from '../../math/index.js';

/**
 * Inverse-variance weighted mean residual in log-spaced redshift bins
 * (diagonal errors only: correlations between supernovae are ignored, as
 * usual for a display).
 * @param z redshifts (> 0 are binned).
 * @param residual residuals, mag.
 * @param error one-sigma errors, mag (> 0 are used).
 * @param bins number of equal bins in ln z.
 * @returns one entry per non-empty bin: weighted mean ln z as z, mean residual and its error (mag).
 * @throws nothing.
 * @example binResiduals(z, residual, sigma, 12)[0].mean
 */
export function binResiduals(z: Float64Array, residual: Float64Array, error: Float64Array, bins: number): BinnedResidual[] {
  const [zLow, zHigh] = arrayExtent(z.filter((v) => v > 0));
  const low = Math.log(zLow);
  const high = Math.log(zHigh);
  const width = (high - low) / bins || 1;
  const sums = Array.from({ length: bins }, () => ({ weight: 0, weighted: 0, weightedZ: 0 }));
  for (let i = 0; i < z.length; i++) {
    if (!(z[i] > 0 && error[i] > 0 && Number.isFinite(residual[i]))) continue;
    const bin = Math.min(bins - 1, Math.floor((Math.log(z[i]) - low) / width));
    const weight = 1 / (error[i] * error[i]);
    sums[bin].weight += weight;
    sums[bin].weighted += weight * residual[i];
    sums[bin].weightedZ += weight * Math.log(z[i]);
  }
  return sums.filter((s) => s.weight > 0).map((s) => ({ z: Math.exp(s.weightedZ / s.weight), mean: s.weighted / s.weight, err: 1 / Math.sqrt(s.weight) }));
}
