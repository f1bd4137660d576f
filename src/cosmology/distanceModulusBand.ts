import { curveQuantiles } from '../math/index.js';
import type { CosmologyFamily } from './cosmologyFromValues.js';
import { distanceModulusCurves, type DistanceModulusCurveDraw, type DistanceModulusCurveOptions } from './distanceModulusCurves.js';

/** Cumulative probabilities of the median and of the 68.27% equal-tailed band (normal +-1 sigma: 0.158655, 0.841345). */
const MEDIAN_AND_68_BAND = [0.5, 0.158655, 0.841345];

/** Pointwise median and 68% band of distance-modulus curves, mag. */
export interface DistanceModulusBand {
  medianMag: Float64Array;
  low68Mag: Float64Array;
  high68Mag: Float64Array;
  /** Records that gave a curve (the others had unphysical parameters). */
  curves: number;
}

/**
 * Median and 68% equal-tailed band of the shifted distance-modulus curves of
 * many parameter records (e.g. posterior draws, each shifted by its own
 * absolute magnitude minus the best fit's so that curves and data share one
 * frame): the curves of {@link distanceModulusCurves}, then at each redshift
 * the type-7 quantiles (Hyndman & Fan 1996, definition 7) of math's
 * curveQuantiles at cumulative 0.5, 0.158655 and 0.841345.
 * No physical record gives NaN everywhere.
 *
 * Cost: one createCosmology and one distance sweep per record, plus
 * O(points x records log records) for the quantiles.
 * @param family the model's dark-energy law, curvature and radiation.
 * @param draws parameter values and shift (mag) of each curve, in a fixed order.
 * @param redshift grid of CMB-frame redshifts.
 * @param options H0 (km/s/Mpc) and the largest redshift asked about.
 * @returns the median, low68 and high68 curves (mag, length of `redshift`) and the count of curves used.
 * @throws nothing.
 * @example distanceModulusBand(family, draws, logSpacedGrid(0.01, 2, 120), { h0KmPerSPerMpc: 70, maxRedshift: 2 }).medianMag.length // 120
 */
export function distanceModulusBand(family: CosmologyFamily, draws: readonly DistanceModulusCurveDraw[], redshift: Float64Array, options: DistanceModulusCurveOptions): DistanceModulusBand {
  const curves = distanceModulusCurves(family, draws, redshift, options);
  const [medianMag, low68Mag, high68Mag] = curveQuantiles(curves, redshift.length, MEDIAN_AND_68_BAND);
  return { medianMag, low68Mag, high68Mag, curves: curves.length };
}
