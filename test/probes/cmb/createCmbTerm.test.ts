import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CMB_TEMPERATURE_K, compressedCmbDistances, createCosmology } from '../../../src/cosmology/index.js';
import { isCandelaError } from '../../../src/errors.js';
import { CMB_PROBE } from '../../../src/probes/cmb/index.js';

const MODEL = { darkEnergy: 'lambda' as const, flat: true, referenceH0KmPerSPerMpc: 70 };
// A Planck-2018-like point (Planck Collaboration 2020, VI, Table 2; from memory): only used as a place to evaluate.
const POINT = { omega_m: 0.3153, h0: 67.36, omega_b_h2: 0.02237 };

function priorFile(text: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'candela-cmb-'));
  writeFileSync(join(dir, 'prior.yaml'), text);
  return join(dir, 'prior.yaml');
}

function term(file: string) {
  const settings = { prior: file };
  return CMB_PROBE.createTerm(CMB_PROBE.load({ key: 'cmb', settings, writtenPaths: { prior: 'prior.yaml' } }), settings, MODEL);
}

describe('compressed CMB probe', () => {
  it('has chi-square 0 where the prior mean equals the model (identity check, common practice)', () => {
    const cosmology = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: POINT.omega_m, h0KmPerSPerMpc: POINT.h0, cmbTemperatureK: CMB_TEMPERATURE_K });
    if (!cosmology.ok) throw new Error(cosmology.reason);
    const d = compressedCmbDistances(cosmology.cosmology, POINT.omega_b_h2);
    const file = priorFile(`quantities: [shift_parameter, acoustic_scale, omega_b_h2]\nmean: [${d.shiftParameter}, ${d.acousticScale}, ${POINT.omega_b_h2}]\ncovariance:\n  - [2.1e-5, 0, 0]\n  - [0, 0.0081, 0]\n  - [0, 0, 2.25e-8]\n`);
    const cmb = term(file);
    expect(cmb.bestFitExtras?.(POINT).chi_square).toBeLessThan(1e-18);
    // One standard deviation off in l_A alone costs chi-square 1.
    const shifted = priorFile(`quantities: [acoustic_scale]\nmean: [${d.acousticScale + 0.09}]\ncovariance: [[0.0081]]\n`);
    expect(term(shifted).bestFitExtras?.(POINT).chi_square).toBeCloseTo(1, 6);
  });

  it('requires h0 and omega_b_h2 and rejects omega_b_h2 above Omega_m h^2 with a reason', () => {
    expect(CMB_PROBE.requires({})).toEqual(['h0', 'omega_b_h2']);
    const cmb = term(priorFile('quantities: [omega_b_h2]\nmean: [0.0224]\ncovariance: [[2.25e-8]]\n'));
    expect(cmb.logLikelihood({ ...POINT, omega_b_h2: 0.5 })).toBe(-Infinity);
    expect(cmb.rejectionReason({ ...POINT, omega_b_h2: 0.5 })).toMatch(/omega_b_h2/);
  });

  it('reads the shipped Planck 2018 example file', () => {
    const loaded = CMB_PROBE.load({ key: 'cmb', settings: { prior: 'data-external/planck2018-cmb-distance-prior.yaml' }, writtenPaths: {} });
    expect(loaded.dataCount).toBe(3);
  });

  it('names the key and the fix for an unknown quantity, a wrong-size or indefinite covariance', () => {
    const codes = (text: string) => {
      try {
        term(priorFile(text));
      } catch (error) {
        if (isCandelaError(error)) return error.issues.map((issue) => `${issue.code} ${issue.path ?? ''} ${issue.fix ?? ''}`).join('\n');
        throw error;
      }
      return 'no error';
    };
    expect(codes('quantities: [acoustic_scal]\nmean: [301]\ncovariance: [[0.01]]\n')).toMatch(/cmb.bad_prior quantities\[0\] did you mean "acoustic_scale"/);
    expect(codes('quantities: [acoustic_scale, omega_b_h2]\nmean: [301, 0.022]\ncovariance: [[0.01]]\n')).toMatch(/cmb.bad_prior covariance/);
    expect(codes('quantities: [acoustic_scale, omega_b_h2]\nmean: [301, 0.022]\ncovariance: [[1, 2], [2, 1]]\n')).toMatch(/covariance.not_positive_definite/);
  });
});
