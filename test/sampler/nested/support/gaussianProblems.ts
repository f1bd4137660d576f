import type { NestedProblem } from '../../../../src/sampler/index.js';

const HALF_LOG_TWO_PI = 0.5 * Math.log(2 * Math.PI);

/** Uniform prior on the box [lower, upper]^D as a unit-cube transform. */
export function boxPrior(dimension: number, lower: number, upper: number): NestedProblem['priorTransform'] {
  return (unit, out) => {
    for (let i = 0; i < dimension; i++) out[i] = lower + (upper - lower) * unit[i];
  };
}

/** Normalized axis-aligned Gaussian likelihood N(theta; mean, diag(sigma^2)), in nats. */
export function axisGaussianLogLikelihood(mean: number[], sigma: number[]): (theta: Float64Array) => number {
  let normalization = 0;
  for (const s of sigma) normalization -= Math.log(s) + HALF_LOG_TWO_PI;
  return (theta) => {
    let sum = normalization;
    for (let i = 0; i < mean.length; i++) {
      const z = (theta[i] - mean[i]) / sigma[i];
      sum -= 0.5 * z * z;
    }
    return sum;
  };
}

/** Normalized 2-D Gaussian likelihood with standard deviations s1, s2 and correlation rho, in nats. */
export function correlatedGaussianLogLikelihood(mean: [number, number], s1: number, s2: number, rho: number): (theta: Float64Array) => number {
  const normalization = -Math.log(2 * Math.PI * s1 * s2 * Math.sqrt(1 - rho * rho));
  return (theta) => {
    const a = (theta[0] - mean[0]) / s1;
    const b = (theta[1] - mean[1]) / s2;
    return normalization - (0.5 * (a * a - 2 * rho * a * b + b * b)) / (1 - rho * rho);
  };
}

/** Equal mixture of two normalized isotropic 2-D Gaussians of width sigma centred at (-c, -c) and (c, c), in nats. */
export function twoModeLogLikelihood(c: number, sigma: number): (theta: Float64Array) => number {
  const normalization = Math.log(0.5) - Math.log(2 * Math.PI * sigma * sigma);
  return (theta) => {
    const a = ((theta[0] + c) ** 2 + (theta[1] + c) ** 2) / (sigma * sigma);
    const b = ((theta[0] - c) ** 2 + (theta[1] - c) ** 2) / (sigma * sigma);
    const small = Math.min(a, b);
    return normalization - 0.5 * small + Math.log1p(Math.exp(-0.5 * (Math.max(a, b) - small)));
  };
}
