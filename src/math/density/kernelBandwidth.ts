import { CandelaError } from '../../errors.js';
import type { BandwidthRule } from './densityTypes.js';

/** Interquartile range of a unit normal, 2 x 0.6745 (Silverman 1986, eq. 3.30). */
const NORMAL_INTERQUARTILE_RANGE = 1.34;

/** The spread of one parameter's sample, as a bandwidth rule needs it. */
export interface SampleSpread {
  /** Standard deviation (parameter unit). */
  sd: number;
  /** Interquartile range (parameter unit); used by Silverman's 1-D rule when given. */
  interquartileRange?: number;
}

/**
 * Gaussian-kernel bandwidth (kernel standard deviation) from a
 * normal-reference rule, with n the Kish effective count:
 * - 'scott': h = sd n^(-1/(d+4)), Scott's rule for a product kernel
 *   (Scott 1992, "Multivariate Density Estimation", Wiley, ch. 6), used
 *   for d = 1 too (Scott's own 1-D rule carries a factor 1.06);
 * - 'silverman': for d = 1, h = 0.9 min(sd, IQR/1.34) n^(-1/5) (Silverman
 *   1986, "Density Estimation for Statistics and Data Analysis", eq. 3.31);
 *   for d = 2, h = (4/(d+2))^(1/(d+4)) sd n^(-1/(d+4)) (eq. 4.14), which
 *   equals Scott's rule at d = 2.
 * The result is multiplied by `factor`.
 *
 * Cost: O(1).
 * @param spread sd (and IQR) of the sample, parameter unit.
 * @param effectiveCount Kish effective count (> 0).
 * @param dimension 1 or 2.
 * @param rule 'scott' or 'silverman'.
 * @param factor multiplier (> 0), default 1.
 * @returns bandwidth in the parameter's unit.
 * @throws CandelaError `math.degenerate_sample` when the spread is zero
 *   (every sample equal), `math.bad_bandwidth` for a non-positive factor.
 * @example kernelBandwidth({ sd: 1 }, 100000, 1, 'scott') // 0.1 (100000^(-1/5))
 */
export function kernelBandwidth(spread: SampleSpread, effectiveCount: number, dimension: 1 | 2, rule: BandwidthRule, factor = 1): number {
  if (!(factor > 0) || !Number.isFinite(factor)) {
    throw new CandelaError({ code: 'math.bad_bandwidth', message: 'the bandwidth factor must be a positive number', expected: '> 0', found: String(factor) });
  }
  let scale = spread.sd;
  let constant = 1;
  if (rule === 'silverman') {
    if (dimension === 1) {
      constant = 0.9;
      const robust = (spread.interquartileRange ?? 0) / NORMAL_INTERQUARTILE_RANGE;
      if (robust > 0) scale = Math.min(scale, robust);
    } else {
      constant = Math.pow(4 / (dimension + 2), 1 / (dimension + 4));
    }
  }
  const bandwidth = factor * constant * scale * Math.pow(effectiveCount, -1 / (dimension + 4));
  if (!(bandwidth > 0) || !Number.isFinite(bandwidth)) {
    throw new CandelaError({
      code: 'math.degenerate_sample', message: 'cannot smooth a sample without spread (every value equal)',
      expected: 'a positive standard deviation', found: String(spread.sd), fix: 'leave fixed parameters out of the density plots',
    });
  }
  return bandwidth;
}
