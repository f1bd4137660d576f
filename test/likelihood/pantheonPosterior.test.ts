import { describe, expect, it } from 'vitest';
import { createPosterior, createSupernovaTerm } from '../../src/likelihood/index.js';
import { options } from './pathHelpers.js';
import { readPantheonBinned, readPantheonBinnedSystematics } from './pantheonBinned.js';

// Pantheon's dmb already holds every statistical term (SOURCE.md), so no extra scatter is added here.
const noExtraScatter = {
  massStep: { enabled: false, splitLogMass: 10, shape: 'sharp' as const, widthDex: 0 },
  scatter: { lensingPerRedshift: 0, peculiarVelocityKmPerS: 0, includeRedshiftErrors: false },
  intrinsicScatter: 'off' as const, alphaBetaCovariance: 'exact' as const,
};

describe('Pantheon 2018 binned, stat + sys, flat LambdaCDM', () => {
  const table = readPantheonBinned();
  const systematic = readPantheonBinnedSystematics();

  it('gives Omega_m = 0.298 +- 0.022 on a 1-D grid posterior (Scolnic et al. 2018, ApJ 859, 101; values from memory; tol 0.005)', () => {
    const term = createSupernovaTerm(options(table, [systematic], { standardization: noExtraScatter }));
    const posterior = createPosterior({ free: [{ name: 'omega_m', prior: { kind: 'uniform', min: 0, max: 1 } }], fixed: {}, terms: [term] });
    const steps = 2000; // Simpson rule on [0, 1]: the posterior is smooth, width 0.02 = 40 steps
    const theta = new Float64Array(1);
    const logValues = Array.from({ length: steps + 1 }, (_, i) => {
      theta[0] = i / steps;
      return posterior.logPosterior(theta);
    });
    const peak = Math.max(...logValues);
    let mass = 0;
    let first = 0;
    let second = 0;
    logValues.forEach((value, i) => {
      const weight = (i === 0 || i === steps ? 1 : i % 2 ? 4 : 2) * Math.exp(value - peak);
      const x = i / steps;
      mass += weight;
      first += weight * x;
      second += weight * x * x;
    });
    const mean = first / mass;
    const sd = Math.sqrt(second / mass - mean * mean);
    expect(Math.abs(mean - 0.298)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(sd - 0.022)).toBeLessThanOrEqual(0.005);
  });

  it('marginalizes abs_mag analytically as numerical integration of the sampled-offset likelihood does (Simpson, 4001 points; tol 1e-8)', () => {
    // Without calibrators the marginalized offset is abs_mag at the nominal H0 = 70: integrate the
    // sampled-mode likelihood over abs_mag at h0 = 70 (flat prior of unit density per mag).
    const sampled = createSupernovaTerm(options(table, [systematic], { standardization: noExtraScatter, offset: 'sample', fixed: { h0: 70 }, fastPath: 'general' }));
    for (const [fastPath, omegaMatter] of [['general', 0.2], ['compressed', 0.3], ['general', 0.45], ['compressed', 0.45]] as const) {
      const marginalized = createSupernovaTerm(options(table, [systematic], { standardization: noExtraScatter, fastPath }));
      const best = marginalized.bestFitOffset({ omega_m: omegaMatter });
      const steps = 4000;
      const halfWidth = 0.1; // the offset is known to ~0.01 mag: +-10 sigma
      const h = (2 * halfWidth) / steps;
      const peak = sampled.logLikelihood({ omega_m: omegaMatter, h0: 70, abs_mag: best });
      let sum = 0;
      for (let i = 0; i <= steps; i++) {
        const weight = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
        sum += weight * Math.exp(sampled.logLikelihood({ omega_m: omegaMatter, h0: 70, abs_mag: best - halfWidth + i * h }) - peak);
      }
      expect(marginalized.logLikelihood({ omega_m: omegaMatter })).toBeCloseTo(peak + Math.log((sum * h) / 3), 8);
    }
  });
});
