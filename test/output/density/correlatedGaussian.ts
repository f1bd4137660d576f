import { createRandomStream } from '../../../src/math/index.js';

// A correlated 2-D Gaussian: sd 1 and 2, correlation 0.6, centred at (0.3, -1).
export const SD_X = 1;
export const SD_Y = 2;
export const RHO = 0.6;
export const MEAN_X = 0.3;
export const MEAN_Y = -1;
export const DET = SD_X * SD_X * SD_Y * SD_Y * (1 - RHO * RHO);
/** Delta chi^2 of a 2-parameter region of mass m: -2 ln(1 - m) = 2.30 and 6.18 (Press et al., Numerical Recipes, section 15.6, table). */
export const deltaChiSquare = (mass: number): number => -2 * Math.log(1 - mass);

export function gaussianDraws(seed: string, count: number): { x: Float64Array; y: Float64Array } {
  const stream = createRandomStream(seed);
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const a = stream.normal();
    const b = stream.normal();
    x[i] = MEAN_X + SD_X * a;
    y[i] = MEAN_Y + SD_Y * (RHO * a + Math.sqrt(1 - RHO * RHO) * b);
  }
  return { x, y };
}

/**
 * Probability that a draw of the true Gaussian falls inside the ellipse v^T A^-1 v < c (v from the mean).
 * With Sigma = L L^T and v = L r (r standard normal in polar form), P = (1/2pi) int (1 - exp(-c / (2 q(theta)))) dtheta,
 * q(theta) = u^T L^T A^-1 L u, u = (cos, sin): the 2-D normal radius law P(r^2 < R^2) = 1 - exp(-R^2/2). The
 * periodic trapezoid rule converges geometrically: 720 nodes agree with 2880 to 1e-15 here (checked). With A = Sigma
 * it returns 1 - exp(-c/2) (the test checks this).
 */
export function trueMassInsideEllipse(a: [number, number, number], c: number): number {
  const [axx, axy, ayy] = a;
  const det = axx * ayy - axy * axy;
  const l21 = RHO * SD_Y;
  const l22 = SD_Y * Math.sqrt(1 - RHO * RHO);
  let sum = 0;
  const nodes = 720;
  for (let k = 0; k < nodes; k++) {
    const theta = (2 * Math.PI * k) / nodes;
    const v1 = SD_X * Math.cos(theta);
    const v2 = l21 * Math.cos(theta) + l22 * Math.sin(theta);
    const q = (ayy * v1 * v1 - 2 * axy * v1 * v2 + axx * v2 * v2) / det;
    sum += 1 - Math.exp(-c / (2 * q));
  }
  return sum / nodes;
}
