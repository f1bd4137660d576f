/**
 * Probability masses of the "one sigma" and "two sigma" credible levels: the
 * mass of a normal distribution within 1 and 2 standard deviations of its
 * mean, erf(1/sqrt 2) and erf(sqrt 2). Values printed by Python's math.erf
 * (checked against the usual 68.27% and 95.45% of any statistics handbook).
 */

/** erf(1/sqrt(2)) = 0.682689..., the 68.27% level. */
export const ONE_SIGMA_MASS = 0.6826894921370859;

/** erf(sqrt(2)) = 0.954499..., the 95.45% level. */
export const TWO_SIGMA_MASS = 0.9544997361036416;
