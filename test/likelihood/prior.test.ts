import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../src/math/index.js';
import { priorContains, priorCumulative, priorLogDensity, priorQuantile, samplePrior, validatePrior, type Prior } from '../../src/likelihood/index.js';

// Reference values from scipy 1.17.1 (scipy.stats.norm, truncnorm, loguniform), computed once
// and pasted here; closed forms are written out beside each check.
const unit: Prior = { kind: 'uniform', min: -1, max: 3 };
const normal: Prior = { kind: 'gaussian', mean: 0, sd: 1 };
const absoluteMagnitude: Prior = { kind: 'gaussian', mean: -19.3, sd: 0.2 };
const truncated: Prior = { kind: 'truncated_gaussian', mean: 0.3, sd: 0.1, min: 0, max: 0.5 };
const farTail: Prior = { kind: 'truncated_gaussian', mean: 0, sd: 1, min: 5, max: 7 };
const logUniform: Prior = { kind: 'log_uniform', min: 0.01, max: 10 };

describe('priorLogDensity', () => {
  it('is -ln(max - min) inside a uniform prior and -Infinity outside (closed form)', () => {
    expect(priorLogDensity(unit, 0.5)).toBeCloseTo(-Math.log(4), 15);
    expect(priorLogDensity(unit, 3)).toBeCloseTo(-Math.log(4), 15); // bounds included
    expect(priorLogDensity(unit, 3.0001)).toBe(-Infinity);
    expect(priorLogDensity(unit, NaN)).toBe(-Infinity);
  });
  it('matches the normal log density (scipy.stats.norm(-19.3, 0.2).logpdf(-19.0) = -0.4345006207705777, tol 1e-13)', () => {
    expect(priorLogDensity(absoluteMagnitude, -19.0)).toBeCloseTo(-0.4345006207705777, 13);
  });
  it('renormalizes a truncated Gaussian (scipy.stats.truncnorm logpdf; tol 1e-12)', () => {
    expect(priorLogDensity(truncated, 0.35)).toBeCloseTo(1.2830417473442601, 12);
    expect(priorLogDensity(farTail, 5.5)).toBeCloseTo(-0.9789356745085236, 10); // mass 2.9e-7: tail-precise sums needed
    expect(priorLogDensity(truncated, 0.51)).toBe(-Infinity);
  });
  it('is -ln x - ln ln(max/min) for log-uniform (scipy.stats.loguniform(0.01, 10).logpdf(0.5) = -1.23949755335612)', () => {
    expect(priorLogDensity(logUniform, 0.5)).toBeCloseTo(-1.23949755335612, 13);
  });
  it('integrates to one (Simpson rule on 2001 points, tol 1e-9; normalization is the definition)', () => {
    // The log-uniform density is integrated in ln x (dx = x d ln x), where it is flat.
    for (const [prior, logScale] of [[unit, false], [absoluteMagnitude, false], [truncated, false], [logUniform, true]] as const) {
      const lower: number = prior.kind === 'gaussian' ? prior.mean - 12 * prior.sd : logScale ? Math.log(prior.min) : prior.min;
      const upper: number = prior.kind === 'gaussian' ? prior.mean + 12 * prior.sd : logScale ? Math.log(prior.max) : prior.max;
      const steps = 2000;
      const h = (upper - lower) / steps;
      let sum = 0;
      for (let i = 0; i <= steps; i++) {
        const weight = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
        const t = lower + i * h;
        // exp(ln min) may round below min: clamp the abscissa into the support.
        const x = prior.kind === 'log_uniform' ? Math.min(prior.max, Math.max(prior.min, Math.exp(t))) : t;
        sum += weight * Math.exp(priorLogDensity(prior, x) + (logScale ? t : 0));
      }
      expect((sum * h) / 3).toBeCloseTo(1, 9);
    }
  });
});

describe('priorCumulative and priorQuantile', () => {
  it('give the normal CDF and quantile of scipy.stats.norm (tol 1e-15 absolute, 1e-12 relative in tails)', () => {
    expect(priorCumulative(normal, 1)).toBeCloseTo(0.8413447460685429, 15);
    expect(priorCumulative(normal, -3) / 0.0013498980316300933).toBeCloseTo(1, 13);
    expect(priorQuantile(normal, 0.975)).toBeCloseTo(1.959963984540054, 13);
    expect(priorQuantile(normal, 1e-10) / -6.361340902404056).toBeCloseTo(1, 12);
  });
  it('give the truncated-normal CDF and quantile of scipy.stats.truncnorm (tol 1e-12, far tail 1e-9)', () => {
    expect(priorCumulative(truncated, 0.42)).toBeCloseTo(0.9054006136800895, 12);
    expect(priorQuantile(truncated, 0.7)).toBeCloseTo(0.34802632093177194, 12);
    expect(priorCumulative(farTail, 5.2)).toBeCloseTo(0.6523883417721321, 9);
    expect(priorQuantile(farTail, 0.3)).toBeCloseTo(5.068333898730669, 9);
  });
  it('give the log-uniform CDF and quantile (closed forms; scipy.stats.loguniform agrees)', () => {
    expect(priorCumulative(logUniform, 0.5)).toBeCloseTo(0.5663233347786729, 14);
    expect(priorQuantile(logUniform, 0.25)).toBeCloseTo(0.05623413251903493, 14);
    expect(priorQuantile({ kind: 'log_uniform', min: 1, max: 100 }, 0.5)).toBeCloseTo(10, 13);
  });
  it('are inverse functions for every kind (identity; tol 1e-10 in u)', () => {
    for (const prior of [unit, normal, absoluteMagnitude, truncated, farTail, logUniform]) {
      for (const u of [1e-6, 0.01, 0.2, 0.5, 0.77, 0.99, 1 - 1e-6]) {
        const x = priorQuantile(prior, u);
        expect(priorContains(prior, x)).toBe(true);
        expect(priorCumulative(prior, x)).toBeCloseTo(u, 10);
      }
    }
  });
  it('map the ends of the unit interval to the bounds, and reject u outside [0, 1]', () => {
    expect(priorQuantile(unit, 0)).toBe(-1);
    expect(priorQuantile(unit, 1)).toBe(3);
    expect(priorQuantile(normal, 0)).toBe(-Infinity);
    expect(priorQuantile(unit, 1.5)).toBeNaN();
  });
});

describe('samplePrior', () => {
  it('draws with the prior mean and spread (20000 draws; tolerance 4 standard errors, common practice)', () => {
    const rng = createRandomStream('prior-sampling');
    const count = 20000;
    for (const [prior, mean, variance] of [
      [unit, 1, 16 / 12], // uniform: (a+b)/2, (b-a)^2/12
      [absoluteMagnitude, -19.3, 0.04],
      [logUniform, (10 - 0.01) / Math.log(1000), (10 ** 2 - 0.01 ** 2) / (2 * Math.log(1000)) - ((10 - 0.01) / Math.log(1000)) ** 2], // E[x] = (b-a)/ln(b/a), E[x^2] = (b^2-a^2)/(2 ln(b/a))
    ] as const) {
      let sum = 0;
      for (let i = 0; i < count; i++) {
        const x = samplePrior(prior, rng);
        expect(priorContains(prior, x)).toBe(true);
        sum += x;
      }
      expect(Math.abs(sum / count - mean)).toBeLessThan(4 * Math.sqrt(variance / count));
    }
  });
});

describe('validatePrior', () => {
  it('accepts valid priors', () => {
    for (const prior of [unit, normal, truncated, logUniform]) expect(validatePrior(prior, 'p')).toEqual([]);
  });
  it('returns issues with codes and paths for bad priors', () => {
    expect(validatePrior({ kind: 'uniform', min: 1, max: 0 }, 'omega_m.prior').map((i) => [i.code, i.path])).toEqual([['prior.empty_interval', 'omega_m.prior.min']]);
    expect(validatePrior({ kind: 'gaussian', mean: 0, sd: 0 }, 'p')[0].code).toBe('prior.nonpositive_sd');
    expect(validatePrior({ kind: 'log_uniform', min: 0, max: 1 }, 'p')[0].code).toBe('prior.log_uniform_nonpositive');
    expect(validatePrior({ kind: 'gaussian', mean: NaN, sd: 1 }, 'p')[0].code).toBe('prior.not_finite');
    expect(validatePrior({ kind: 'truncated_gaussian', mean: 0, sd: 1, min: 60, max: 61 }, 'p')[0].code).toBe('prior.negligible_mass');
    expect(validatePrior({ kind: 'flat' } as unknown as Prior, 'p')[0].code).toBe('prior.unknown_kind');
  });
});
