/**
 * Physical and numerical constants, in one place, with units in their names.
 * Values match those used by astropy 5.2.1 (CODATA 2018, IAU 2015), so that
 * distances agree with the reference tables in ../shared/reference.
 */

/** Speed of light in vacuum, km/s (exact, SI definition). */
export const SPEED_OF_LIGHT_KM_PER_S = 299792.458;
/** One megaparsec in km (IAU 2015: 1 pc = 648000/pi au, au = 149597870.7 km). */
export const MEGAPARSEC_KM = (648000 / Math.PI) * 149597870.7 * 1e6;
/** One gigayear in seconds (1e9 Julian years of 365.25 days). */
export const GIGAYEAR_S = 1e9 * 365.25 * 86400;
/** Stefan-Boltzmann constant, W m^-2 K^-4 (CODATA 2018, exact). */
export const STEFAN_BOLTZMANN_W_PER_M2_K4 = 5.670374419e-8;
/** Newtonian constant of gravitation, m^3 kg^-1 s^-2 (CODATA 2018). */
export const GRAVITATIONAL_CONSTANT_SI = 6.6743e-11;
/** Speed of light, m/s. */
export const SPEED_OF_LIGHT_M_PER_S = 299792458;
/** 5 / ln 10: converts a fractional distance error to magnitudes. */
export const FIVE_OVER_LN10 = 5 / Math.LN10;
/** ln(2 pi) / 2: the normalization of a Gaussian density in log form, and a term of Stirling's series. */
export const HALF_LOG_TWO_PI = 0.5 * Math.log(2 * Math.PI);
