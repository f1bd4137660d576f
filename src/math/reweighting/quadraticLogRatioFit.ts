import { choleskyInPlace, choleskySolveInPlace } from '../cholesky.js';

/** A quadratic fitted to a log ratio over standardized draws, or why none could be fitted. */
export type QuadraticLogRatioFit =
  | {
    ok: true;
    /** Mean of each parameter over the draws (unit of the parameter). */
    center: Float64Array;
    /** Standard deviation of each parameter over the draws (the standardization). */
    scale: Float64Array;
    /** Covariance R of the standardized draws, p x p row major (a correlation matrix up to n/(n-1)). */
    covariance: Float64Array;
    /** g: the linear coefficients in the standardized parameters (nats per standard deviation). */
    gradient: Float64Array;
    /** H: minus the second derivative of the fitted quadratic, p x p symmetric row major. */
    curvature: Float64Array;
  }
  | { ok: false; reason: string };

/** Fewest usable draws per fitted coefficient: fewer leave the least-squares fit underdetermined in practice (common practice). */
const DRAWS_PER_COEFFICIENT = 3;

/**
 * Least-squares fit of r(x) = c + g^T x - x^T H x / 2 to a log ratio r over
 * draws, with x_j = (theta_j - mean_j) / sd_j the standardized parameters
 * (so that the normal equations stay well conditioned), solved by the
 * normal equations and a Cholesky factorization. Draws whose log ratio is
 * -Infinity are left out. Helper of gaussianLinearResponse.
 *
 * Cost: O(n m^2) with m = 1 + p + p(p+1)/2 coefficients.
 * @param draws n x p row major (finite).
 * @param dimension p.
 * @param logRatio per draw (nats), finite or -Infinity.
 * @returns the standardization, R, g and H; or ok false when fewer than
 *   3 m draws are usable, a parameter does not vary, or the normal equations are singular.
 */
export function quadraticLogRatioFit(draws: Float64Array, dimension: number, logRatio: ArrayLike<number>): QuadraticLogRatioFit {
  const p = dimension;
  const count = logRatio.length;
  const coefficients = 1 + p + (p * (p + 1)) / 2;
  const usable: number[] = [];
  for (let i = 0; i < count; i++) if (Number.isFinite(logRatio[i])) usable.push(i);
  if (usable.length < DRAWS_PER_COEFFICIENT * coefficients) {
    return { ok: false, reason: `${usable.length} draws with a finite log ratio, fewer than ${DRAWS_PER_COEFFICIENT * coefficients} for a quadratic in ${p} parameters` };
  }
  const center = new Float64Array(p);
  const scale = new Float64Array(p);
  for (let j = 0; j < p; j++) {
    let sum = 0;
    for (let i = 0; i < count; i++) sum += draws[i * p + j];
    center[j] = sum / count;
    let squares = 0;
    for (let i = 0; i < count; i++) squares += (draws[i * p + j] - center[j]) ** 2;
    scale[j] = Math.sqrt(squares / (count - 1));
    if (!(scale[j] > 0)) return { ok: false, reason: `parameter ${j + 1} takes one value in every draw` };
  }
  const covariance = new Float64Array(p * p);
  const x = new Float64Array(p);
  const row = new Float64Array(coefficients);
  const normal = new Float64Array(coefficients * coefficients);
  const rightSide = new Float64Array(coefficients);
  let offset = 0;
  for (const i of usable) offset += logRatio[i];
  offset /= usable.length;
  for (let i = 0; i < count; i++) {
    for (let j = 0; j < p; j++) x[j] = (draws[i * p + j] - center[j]) / scale[j];
    for (let j = 0; j < p; j++) for (let l = 0; l < p; l++) covariance[j * p + l] += (x[j] * x[l]) / (count - 1);
    if (!Number.isFinite(logRatio[i])) continue;
    fillDesignRow(x, row);
    const target = logRatio[i] - offset;
    for (let a = 0; a < coefficients; a++) {
      rightSide[a] += row[a] * target;
      for (let b = 0; b <= a; b++) normal[a * coefficients + b] += row[a] * row[b];
    }
  }
  for (let a = 0; a < coefficients; a++) for (let b = 0; b < a; b++) normal[b * coefficients + a] = normal[a * coefficients + b];
  if (!choleskyInPlace(normal, coefficients).ok) return { ok: false, reason: 'the normal equations of the quadratic fit are singular' };
  const beta = choleskySolveInPlace(normal, coefficients, rightSide);
  const gradient = Float64Array.from(beta.subarray(1, 1 + p));
  const curvature = new Float64Array(p * p);
  let index = 1 + p;
  for (let j = 0; j < p; j++) {
    for (let l = j; l < p; l++) {
      // r contains q_jl x_j x_l; -x^T H x / 2 contains -H_jj x_j^2 / 2 and -H_jl x_j x_l (j < l).
      const value = j === l ? -2 * beta[index] : -beta[index];
      curvature[j * p + l] = value;
      curvature[l * p + j] = value;
      index++;
    }
  }
  return { ok: true, center, scale, covariance, gradient, curvature };
}

/** [1, x_1..x_p, x_j x_l for j <= l] in that order. */
function fillDesignRow(x: Float64Array, row: Float64Array): void {
  const p = x.length;
  row[0] = 1;
  for (let j = 0; j < p; j++) row[1 + j] = x[j];
  let index = 1 + p;
  for (let j = 0; j < p; j++) for (let l = j; l < p; l++) row[index++] = x[j] * x[l];
}
