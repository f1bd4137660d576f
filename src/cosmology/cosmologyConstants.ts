/**
 * The physical constants of the cosmology layer that are facts about our
 * Universe rather than unit conversions (those live in ../math/constants.ts,
 * with the speed of light SPEED_OF_LIGHT_KM_PER_S = 299792.458 km/s).
 * The default number of effective neutrino species, N_eff = 3.046
 * (Mangano et al. 2005), is DEFAULT_EFFECTIVE_NEUTRINO_SPECIES beside the
 * parameter resolution that applies it.
 */

/**
 * Temperature of the cosmic microwave background today, K: 2.7255 +- 0.0006 K
 * (Fixsen 2009, ApJ 707, 916, from COBE/FIRAS recalibrated with WMAP).
 * The value the reference tables (astropy Planck-like cosmologies) use.
 */
export const CMB_TEMPERATURE_K = 2.7255;
