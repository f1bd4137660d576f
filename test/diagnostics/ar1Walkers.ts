import { createRandomStream } from '../../src/math/index.js';

/**
 * Independent stationary AR(1) series x_{t+1} = phi x_t + sqrt(1 - phi^2) e_t,
 * x_0 ~ N(0, 1), one per walker, from a seeded stream. Its integrated
 * autocorrelation time is (1 + phi)/(1 - phi) (textbook result: rho(t) = phi^|t|,
 * so 1 + 2 sum_{t>=1} phi^t = (1 + phi)/(1 - phi)).
 */
export function ar1Walkers(walkers: number, steps: number, phi: number, seed: string): Float64Array[] {
  const stream = createRandomStream(seed);
  const innovationScale = Math.sqrt(1 - phi * phi);
  return Array.from({ length: walkers }, () => {
    const series = new Float64Array(steps);
    series[0] = stream.normal();
    for (let step = 1; step < steps; step++) series[step] = phi * series[step - 1] + innovationScale * stream.normal();
    return series;
  });
}

/** The exact integrated autocorrelation time of an AR(1) process with coefficient phi. */
export function ar1Tau(phi: number): number {
  return (1 + phi) / (1 - phi);
}

/**
 * Standard deviation of the windowed tau estimator, sqrt(2 (2M + 1) / N) tau,
 * for window M and N draws in all (Sokal 1997, sec. 3, "Monte Carlo methods in
 * statistical mechanics", eq. 3.19; valid for tau << M << N).
 */
export function sokalTauStandardError(tau: number, windowSteps: number, totalDraws: number): number {
  return Math.sqrt((2 * (2 * windowSteps + 1)) / totalDraws) * tau;
}

/**
 * Leading bias of the windowed tau estimator for an AR(1) of `steps` steps per
 * walker: the sample autocovariance about the sample mean has
 * E[gamma_hat(t)] ~ (1 - t/n) gamma(t) - sigma^2 tau / n (Priestley 1981,
 * Spectral Analysis and Time Series, sec. 5.3, from memory), so summing
 * 2 rho_hat(t) over t = 1..M gives -(2 M tau + 2 phi/(1 - phi)^2) / n.
 * Negative: short chains underestimate tau.
 */
export function ar1TauEstimatorBias(phi: number, windowSteps: number, steps: number): number {
  return -(2 * windowSteps * ar1Tau(phi) + (2 * phi) / (1 - phi) ** 2) / steps;
}
