import { createCosmology } from './createCosmology.js';
import { cosmologyParametersFromValues, type CosmologyFamily } from './cosmologyFromValues.js';

/** One curve to compute: parameter values by registry name and a constant magnitude shift. */
export interface DistanceModulusCurveDraw {
  /** Parameter values by name (omega_m, w0, wa, ...); any h0 among them is replaced by the options' H0. */
  values: Readonly<Record<string, number>>;
  /** Added to every distance modulus of the curve, mag (e.g. the draw's absolute magnitude minus a reference one). */
  shiftMag: number;
}

/** Where and at which H0 the curves are computed. */
export interface DistanceModulusCurveOptions {
  /** H0 of every curve, km/s/Mpc, whatever h0 the values hold (e.g. the H0 the magnitudes were fitted at). */
  h0KmPerSPerMpc: number;
  /** Largest redshift asked about; E^2(z) > 0 is checked up to it (createCosmology's maxRedshift). */
  maxRedshift: number;
}

/**
 * The distance modulus mu(z) = 5 log10(D_L / 10 pc) (Hogg 1999,
 * arXiv:astro-ph/9905116, eq. 25) of one parameter record on a redshift grid,
 * plus a constant shift, written into `out`.
 *
 * Cost: one createCosmology and one distance sweep over the grid.
 * @param family the model's dark-energy law, curvature and radiation.
 * @param draw the parameter values and the shift (mag).
 * @param redshift grid of CMB-frame redshifts (heliocentric taken equal).
 * @param options H0 (km/s/Mpc) and the largest redshift asked about.
 * @param out receives the curve, mag (length of `redshift`); left untouched when the parameters are unphysical.
 * @returns false when the parameters give no cosmology (createCosmology's checks), else true.
 * @throws nothing.
 * @example distanceModulusCurve({ darkEnergy: 'lambda', flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
 *   { values: { omega_m: 0.3 }, shiftMag: 0 }, Float64Array.of(0.5), { h0KmPerSPerMpc: 70, maxRedshift: 0.5 }, out) // out[0] ≈ 42.2612 (astropy 5.2.1)
 */
export function distanceModulusCurve(family: CosmologyFamily, draw: DistanceModulusCurveDraw, redshift: Float64Array, options: DistanceModulusCurveOptions, out: Float64Array): boolean {
  const h0 = options.h0KmPerSPerMpc;
  const outcome = createCosmology(cosmologyParametersFromValues(family, { ...draw.values, h0 }, h0), { maxRedshift: options.maxRedshift });
  if (!outcome.ok) return false;
  outcome.cosmology.distanceModuliMag(redshift, undefined, out);
  for (let i = 0; i < out.length; i++) out[i] += draw.shiftMag;
  return true;
}

/**
 * The shifted distance-modulus curves of many parameter records (e.g.
 * posterior draws), in the order given, leaving out the records whose
 * parameters are unphysical (see {@link distanceModulusCurve}).
 *
 * Cost: one createCosmology and one distance sweep per record.
 * @param family the model's dark-energy law, curvature and radiation.
 * @param draws parameter values and shift (mag) of each curve.
 * @param redshift grid of CMB-frame redshifts.
 * @param options H0 (km/s/Mpc) and the largest redshift asked about.
 * @returns one Float64Array (mag, length of `redshift`) per physical record.
 * @throws nothing.
 * @example distanceModulusCurves(family, [{ values: { omega_m: 0.3 }, shiftMag: 0.1 }], grid, { h0KmPerSPerMpc: 70, maxRedshift: 2 }).length // 1
 */
export function distanceModulusCurves(family: CosmologyFamily, draws: readonly DistanceModulusCurveDraw[], redshift: Float64Array, options: DistanceModulusCurveOptions): Float64Array[] {
  const curves: Float64Array[] = [];
  for (const draw of draws) {
    const out = new Float64Array(redshift.length);
    if (distanceModulusCurve(family, draw, redshift, options, out)) curves.push(out);
  }
  return curves;
}
