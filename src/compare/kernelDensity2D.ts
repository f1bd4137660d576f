import { CandelaError } from '../errors.js';
import { checkedWeights, effectiveDrawCount, weightedMeanAndCovariance } from './weightedDraws.js';

/**
 * Scott's-rule kernel covariance for a 2-D Gaussian kernel density estimate,
 * H = n_eff^(-2/(d+4)) Sigma = n_eff^(-1/3) Sigma for d = 2 (Scott 1992,
 * Multivariate Density Estimation, chapter 6), with the weighted covariance
 * Sigma of the draws and the Kish effective number of draws.
 *
 * Cost: O(n).
 * @param xs First coordinate of the draws.
 * @param ys Second coordinate of the draws.
 * @param weights Optional non-negative weights.
 * @returns H as [Hxx, Hxy, Hxy, Hyy] (row major), in squared parameter units.
 * @throws CandelaError `compare.invalid_argument` for bad weights or draws without a 2-D spread.
 * @example kernelBandwidth2D(xs, ys) // about n^(-1/3) times the sample covariance
 */
export function kernelBandwidth2D(xs: ArrayLike<number>, ys: ArrayLike<number>, weights?: ArrayLike<number>): Float64Array {
  if (xs.length !== ys.length) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'ys', message: 'both coordinates need the same number of draws', expected: String(xs.length), found: String(ys.length) });
  }
  const w = checkedWeights(xs.length, weights, 'weights');
  const { covariance } = weightedMeanAndCovariance([xs, ys], w);
  const factor = Math.pow(effectiveDrawCount(w), -1 / 3);
  const determinant = covariance[0] * covariance[3] - covariance[1] * covariance[2];
  if (!(covariance[0] > 0) || !(determinant > 0)) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'samples', message: 'the draws do not spread in two dimensions', expected: 'a positive-definite sample covariance', found: `determinant ${determinant}` });
  }
  return covariance.map((value) => value * factor);
}

/**
 * Weighted Gaussian kernel density estimate at one 2-D point with kernel
 * covariance H, and reflection at finite prior edges along each axis (Schuster
 * 1985, extended by product of mirror images: up to 3 x 3 images of the point).
 * The kernel is evaluated through the hand-written Cholesky factor of H.
 *
 * Cost: O(n x images).
 * @param xs First coordinate of the draws (parameter units).
 * @param ys Second coordinate of the draws.
 * @param weights Non-negative weights, or undefined for equal weights.
 * @param point [x, y] inside the edges.
 * @param bandwidthMatrix Kernel covariance H = [Hxx, Hxy, Hxy, Hyy], positive definite.
 * @param lowerEdges Lower prior edges [ax, ay] (-Infinity for none).
 * @param upperEdges Upper prior edges [bx, by] (Infinity for none).
 * @param indices Optional draw indices (bootstrap resamples).
 * @returns Density in 1 / (x units x y units).
 * @throws CandelaError `compare.invalid_argument` for an H that is not positive definite or a point outside the edges.
 * @example kernelDensity2D(xs, ys, undefined, [0, 0], h) // about 1 / (2 pi) for unit-normal draws
 */
export function kernelDensity2D(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  weights: ArrayLike<number> | undefined,
  point: readonly [number, number],
  bandwidthMatrix: ArrayLike<number>,
  lowerEdges: readonly [number, number] = [-Infinity, -Infinity],
  upperEdges: readonly [number, number] = [Infinity, Infinity],
  indices?: Int32Array,
): number {
  const l11 = Math.sqrt(bandwidthMatrix[0]);
  const l21 = bandwidthMatrix[1] / l11;
  const l22 = Math.sqrt(bandwidthMatrix[3] - l21 * l21);
  if (!(l11 > 0) || !(l22 > 0) || !Number.isFinite(l11 * l22)) {
    throw new CandelaError({ code: 'compare.invalid_argument', path: 'bandwidthMatrix', message: 'the kernel covariance must be positive definite', expected: 'Hxx > 0, Hxx Hyy > Hxy^2', found: Array.from(bandwidthMatrix).join(', ') });
  }
  const imagesOf = (axis: 0 | 1): number[] => {
    const value = point[axis];
    if (!(value >= lowerEdges[axis] && value <= upperEdges[axis])) {
      throw new CandelaError({ code: 'compare.invalid_argument', path: `point[${axis}]`, message: 'the density is wanted outside the prior edges', expected: `${lowerEdges[axis]} <= value <= ${upperEdges[axis]}`, found: String(value) });
    }
    const list = [value];
    if (Number.isFinite(lowerEdges[axis])) list.push(2 * lowerEdges[axis] - value);
    if (Number.isFinite(upperEdges[axis])) list.push(2 * upperEdges[axis] - value);
    return list;
  };
  const xImages = imagesOf(0);
  const yImages = imagesOf(1);
  const count = indices ? indices.length : xs.length;
  let weightTotal = 0;
  for (let m = 0; m < count; m++) weightTotal += weights ? weights[indices ? indices[m] : m] : 1;
  // Image-major loops keep the inner loop free of branches on the image lists.
  let sum = 0;
  for (const xImage of xImages) {
    for (const yImage of yImages) {
      for (let m = 0; m < count; m++) {
        const k = indices ? indices[m] : m;
        const u = (xImage - xs[k]) / l11;
        const v = (yImage - ys[k] - l21 * u) / l22;
        sum += (weights ? weights[k] : 1) * Math.exp(-0.5 * (u * u + v * v));
      }
    }
  }
  return weightTotal > 0 ? sum / weightTotal / (2 * Math.PI * l11 * l22) : 0;
}
