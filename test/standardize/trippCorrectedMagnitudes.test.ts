import { describe, expect, it } from 'vitest';
import { readSupernovaTable, type SupernovaTable } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';
import { highMassFraction, lightCurveVariance, trippCorrectedMagnitudes, type HostMassStep } from '../../src/standardize/index.js';

const SHARP: HostMassStep = { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0 };

/** A hand-made light-curve table (values chosen for easy arithmetic). */
function handTable(): SupernovaTable {
  const count = 4;
  return {
    kind: 'light_curves', count, ids: ['a', 'b', 'c', 'd'], samples: ['all', 'all', 'all', 'all'], sampleNames: ['all'], sampleIndex: new Int32Array(count),
    redshift: Float64Array.of(0.1, 0.5, 0.3, 0.2), redshiftHelio: Float64Array.of(0.1, 0.5, 0.3, 0.2), redshiftErr: new Float64Array(count),
    peakMag: Float64Array.of(20, 22.5, 21, 21), peakMagErr: Float64Array.of(0.1, 0.2, 0.1, 0.1),
    stretch: Float64Array.of(1, -2, 0, 0), stretchErr: Float64Array.of(0.5, 0.3, 0.1, 0.1),
    color: Float64Array.of(0.1, -0.05, 0, 0), colorErr: Float64Array.of(0.04, 0.03, 0.02, 0.02),
    covPeakMagStretch: Float64Array.of(0.01, 0, 0, 0), covPeakMagColor: Float64Array.of(0.002, 0, 0, 0), covStretchColor: Float64Array.of(-0.005, 0, 0, 0),
    hostLogMass: Float64Array.of(10.5, 9, NaN, 10), biasCorrectionMag: Float64Array.of(0.02, 0, 0, 0),
    sourceLine: Int32Array.of(2, 3, 4, 5), sourceFile: 'hand',
  };
}

describe('trippCorrectedMagnitudes (Tripp 1998) worked by hand', () => {
  // alpha = 0.15, beta = 3.0, mass step 0.06 mag, sharp split at 10.
  const coefficients = { alpha: 0.15, beta: 3.0, massStepMag: 0.06 };
  it('adds alpha x1, subtracts beta c and the bias correction, and +-step/2 by host mass', () => {
    const out = trippCorrectedMagnitudes(handTable(), coefficients, SHARP, new Float64Array(4));
    // a: 20 + 0.15*1 - 3*0.1 + 0.06*(1 - 0.5) - 0.02 = 20 + 0.15 - 0.30 + 0.03 - 0.02 = 19.86  (high-mass host)
    expect(out[0]).toBeCloseTo(19.86, 12);
    // b: 22.5 + 0.15*(-2) - 3*(-0.05) + 0.06*(0 - 0.5) = 22.5 - 0.30 + 0.15 - 0.03 = 22.32  (low-mass host)
    expect(out[1]).toBeCloseTo(22.32, 12);
    // c: unknown mass -> fraction 0.5 -> no step: 21
    expect(out[2]).toBe(21);
    // d: mass exactly at the split -> fraction 0.5 -> no step: 21
    expect(out[3]).toBe(21);
  });

  it('uses the logistic fraction when asked, and no step when disabled', () => {
    const table = handTable();
    const logistic: HostMassStep = { enabled: true, splitLogMass: 10.4, shape: 'logistic', widthDex: 0.1 };
    const out = trippCorrectedMagnitudes(table, coefficients, logistic, new Float64Array(4));
    // a: fraction 1 / (1 + exp(-1)) = 0.7310585786300049 (by hand); step term 0.06 * 0.2310585786 = 0.013863514718
    expect(out[0]).toBeCloseTo(20 + 0.15 - 0.3 - 0.02 + 0.06 * (1 / (1 + Math.exp(-1)) - 0.5), 12);
    expect(out[0]).toBeCloseTo(19.843863514718, 11);
    const off = trippCorrectedMagnitudes(table, coefficients, { ...SHARP, enabled: false }, new Float64Array(4));
    expect(off[0]).toBeCloseTo(19.83, 12); // 20 + 0.15 - 0.30 - 0.02
  });

  it('refuses a table without light-curve columns', () => {
    const table: SupernovaTable = { ...handTable(), kind: 'magnitudes', peakMag: undefined };
    try {
      trippCorrectedMagnitudes(table, coefficients, SHARP, new Float64Array(4));
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].code).toBe('standardize.not_light_curves');
    }
  });
});

describe('lightCurveVariance worked by hand', () => {
  it('combines the errors and the three covariances with the Tripp coefficients', () => {
    const out = lightCurveVariance(handTable(), 0.15, 3.0, new Float64Array(4));
    // a: 0.1^2 + 0.15^2 0.5^2 + 3^2 0.04^2 + 2(0.15)(0.01) - 2(3)(0.002) - 2(0.15)(3)(-0.005)
    //  = 0.01 + 0.005625 + 0.0144 + 0.003 - 0.012 + 0.0045 = 0.025525 mag^2
    expect(out[0]).toBeCloseTo(0.025525, 14);
    // b: 0.04 + 0.0225*0.09 + 9*0.0009 = 0.04 + 0.002025 + 0.0081 = 0.050125 mag^2
    expect(out[1]).toBeCloseTo(0.050125, 14);
  });
});

describe('highMassFraction', () => {
  it('is 0, 1/2, 1 around a sharp split and 1/2 for an unknown mass', () => {
    expect([9.99, 10, 10.01, NaN].map((m) => highMassFraction(m, SHARP))).toEqual([0, 0.5, 1, 0.5]);
  });
  it('follows the logistic curve 1 / (1 + exp(-(m - split) / width))', () => {
    const step: HostMassStep = { enabled: true, splitLogMass: 10, shape: 'logistic', widthDex: 0.2 };
    expect(highMassFraction(10, step)).toBe(0.5);
    expect(highMassFraction(10.2, step)).toBeCloseTo(0.7310585786300049, 13); // 1 / (1 + e^-1), by hand; (10.2 - 10) / 0.2 is 1 only to ~1e-15
    expect(highMassFraction(10.2, step) + highMassFraction(9.8, step)).toBeCloseTo(1, 15); // symmetry of the logistic
  });
});

describe('trippCorrectedMagnitudes reproduces the DES-SN5YR distance moduli (DES Collaboration 2024; Vincenzi et al. 2024)', () => {
  const file = '../shared/data-real/des-sn5yr/DES-SN5YR_HD+MetaData.csv';
  // Global nuisance parameters of the release README, quoted in SOURCE.md.
  const ALPHA = 0.16087;
  const BETA = 3.1178;
  const GAMMA = 0.03754;
  const M0_AVG = -29.95821;

  function standardizedResiduals(massStepMag: number): { mean: number; rms: number; count: number } {
    const { table } = readSupernovaTable({
      file, kind: 'light_curves', delimiter: 'comma', indexColumn: 'no',
      columns: {
        id: 'CID', z: 'zHD', z_helio: 'zHEL', m_b: 'mB', m_b_err: 'mBERR', x1: 'x1', x1_err: 'x1ERR', color: 'c', color_err: 'cERR',
        host_log_mass: 'HOST_LOGMASS', bias_correction: 'biasCor_mu', magnitude: 'MU', magnitude_err: 'MUERR_FINAL',
      },
    });
    // SOURCE.md: M0avg refers to -2.5 log10(x0), not to mB; the peak magnitude is derived here from x0.
    const amplitude = readSupernovaTable({ file, kind: 'magnitudes', delimiter: 'comma', indexColumn: 'no', columns: { z: 'zHD', magnitude: 'x0', magnitude_err: 'x0ERR' } }).table.magnitude as Float64Array;
    const peak = table.peakMag as Float64Array;
    amplitude.forEach((x0, i) => {
      const derived = -2.5 * Math.log10(x0);
      // SOURCE.md: mB = -2.5 log10(x0) + 10.63...; x0 has 5 significant digits, so allow 1e-3 mag
      expect(Math.abs(peak[i] - derived - 10.635)).toBeLessThan(1e-3);
      peak[i] = derived;
    });
    const corrected = trippCorrectedMagnitudes(table, { alpha: ALPHA, beta: BETA, massStepMag }, SHARP, new Float64Array(table.count));
    const mu = table.magnitude as Float64Array;
    let sum = 0;
    let squares = 0;
    for (let i = 0; i < table.count; i++) {
      const difference = corrected[i] - M0_AVG - mu[i];
      sum += difference;
      squares += difference * difference;
    }
    return { mean: sum / table.count, rms: Math.sqrt(squares / table.count), count: table.count };
  }

  it('within 0.002 mag r.m.s. over all 1829 supernovae with gamma added on the high-mass side', () => {
    const { mean, rms, count } = standardizedResiduals(GAMMA);
    expect(count).toBe(1829);
    // SOURCE.md: scatter 0.0011 mag, mean 0.0000 (two rows at HOST_LOGMASS = 10.00 are off by ~0.03 with any plain step);
    // tolerance from the task: 0.002 mag r.m.s.; the mean within 0.0005 mag (rounding of x1, c to 4 decimals).
    expect(rms).toBeLessThan(0.002);
    expect(Math.abs(mean)).toBeLessThan(0.0005);
  });

  it('and fails with the opposite sign of the step (the sign convention is tested, not assumed)', () => {
    // SOURCE.md: with the opposite sign of the mass step the scatter is 0.035 mag.
    expect(standardizedResiduals(-GAMMA).rms).toBeGreaterThan(0.03);
  });
});
