import { describe, expect, it } from 'vitest';
import { BAO_PROBE } from '../../../src/probes/bao/index.js';
import type { LikelihoodTerm } from '../../../src/likelihood/index.js';

const TABLE = '../shared/data-real/desi-dr2-bao/measurements.csv';
const COVARIANCE = '../shared/data-real/desi-dr2-bao/covariance.txt';
const MODEL = { darkEnergy: 'lambda' as const, flat: true, referenceH0KmPerSPerMpc: 70 };

function desiTerm(): LikelihoodTerm {
  const settings = { table: TABLE, covariance: COVARIANCE, ruler: 'free' };
  const loaded = BAO_PROBE.load({ key: 'bao', settings, writtenPaths: { table: TABLE, covariance: COVARIANCE } });
  return BAO_PROBE.createTerm(loaded, settings, MODEL);
}

/** Posterior moments on a fine grid (flat priors wide enough to hold the whole mass): exact up to the grid spacing, no Monte Carlo error. */
function gridMoments(term: LikelihoodTerm): { mean: [number, number]; sd: [number, number] } {
  const [m0, m1, r0, r1, n] = [0.24, 0.36, 97, 106, 241];
  const logs: number[] = [];
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const omega = m0 + ((m1 - m0) * i) / (n - 1);
      const ruler = r0 + ((r1 - r0) * j) / (n - 1);
      logs.push(term.logLikelihood({ omega_m: omega, h_ruler: ruler }));
      xs.push(omega);
      ys.push(ruler);
    }
  }
  const top = Math.max(...logs);
  let total = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let syy = 0;
  logs.forEach((value, k) => {
    const w = Math.exp(value - top);
    total += w;
    sx += w * xs[k];
    sy += w * ys[k];
    sxx += w * xs[k] ** 2;
    syy += w * ys[k] ** 2;
  });
  const mean: [number, number] = [sx / total, sy / total];
  return { mean, sd: [Math.sqrt(sxx / total - mean[0] ** 2), Math.sqrt(syy / total - mean[1] ** 2)] };
}

describe('BAO probe', () => {
  it('declares h_ruler with a free ruler and h0, omega_b_h2 with a computed one', () => {
    expect(BAO_PROBE.requires({ ruler: 'free' })).toEqual(['h_ruler']);
    expect(BAO_PROBE.requires({ ruler: 'computed' })).toEqual(['h0', 'omega_b_h2']);
  });

  it('reproduces the published DESI DR2 BAO-only flat LambdaCDM constraints', () => {
    // Source: DESI Collaboration (2025), arXiv:2503.14738, quoted in ../shared/data-real/desi-dr2-bao/SOURCE.md:
    // Omega_m = 0.2975 +- 0.0086, h r_d = 101.54 +- 0.73 Mpc. The tolerance: 0.1 sigma in the mean, 5% in the width.
    const { mean, sd } = gridMoments(desiTerm());
    expect(Math.abs(mean[0] - 0.2975)).toBeLessThan(0.1 * 0.0086);
    expect(Math.abs(mean[1] - 101.54)).toBeLessThan(0.1 * 0.73);
    expect(Math.abs(sd[0] / 0.0086 - 1)).toBeLessThan(0.05);
    expect(Math.abs(sd[1] / 0.73 - 1)).toBeLessThan(0.05);
  });

  it('gives -Infinity with a reason where the ruler is not positive, never NaN', () => {
    const term = desiTerm();
    expect(term.logLikelihood({ omega_m: 0.3, h_ruler: -5 })).toBe(-Infinity);
    expect(term.rejectionReason({ omega_m: 0.3, h_ruler: -5 })).toMatch(/sound horizon/);
    expect(term.rejectionReason({ omega_m: 0.3, h_ruler: 100 })).toBeNull();
  });
});
