// Which parameters each model samples. The rules are candela's design
// (docs/configuration.md, "Which parameters a model uses"); the physics behind
// them: w0 = -1, wa = 0 is a cosmological constant (Chevallier & Polarski 2001;
// Linder 2003), and H0 is degenerate with the absolute magnitude without
// calibrators (common practice).
import { describe, expect, it } from 'vitest';
import { DEFAULT_PRIORS, derivedForModel, parametersForModel } from '../../src/config/index.js';
import { VALID_LIGHT_CURVES, VALID_MAGNITUDES, configOf } from './configTextHelpers.js';

const names = (text: string, modelIndex = 0, labels?: string[]): string[] =>
  parametersForModel(configOf(text).config, modelIndex, labels).free.map((p) => p.name);

describe('parametersForModel', () => {
  it('samples only omega_m for flat LambdaCDM on standardized magnitudes without scatter', () => {
    const result = parametersForModel(configOf(VALID_MAGNITUDES).config, 0);
    expect(result.free).toEqual([{ name: 'omega_m', prior: DEFAULT_PRIORS.omega_m }]);
    expect(result.fixed).toEqual({ w0: -1, wa: 0, h0: 70 });
    expect(result.awaitsSampleLabels).toBe(false);
  });

  it('adds omega_de for free curvature, w0 for constant_w and w0, wa for cpl', () => {
    const models = `models:
  - { label: a, dark_energy: lambda, curvature: free }
  - { label: b, dark_energy: constant_w }
  - { label: c, dark_energy: cpl, curvature: free }
`;
    const text = VALID_MAGNITUDES.replace(/models:[\s\S]*$/, models);
    expect(names(text, 0)).toEqual(['omega_m', 'omega_de']);
    expect(names(text, 1)).toEqual(['omega_m', 'w0']);
    expect(names(text, 2)).toEqual(['omega_m', 'omega_de', 'w0', 'wa']);
    expect(parametersForModel(configOf(text).config, 1).fixed).toEqual({ wa: 0, h0: 70 });
  });

  it('samples alpha, beta, mass_step and sigma_int for light curves', () => {
    expect(names(VALID_LIGHT_CURVES)).toEqual(['omega_m', 'alpha', 'beta', 'mass_step', 'sigma_int']);
  });

  it('drops mass_step without the host step and sigma_int without scatter; adds abs_mag when the offset is sampled', () => {
    const text = `${VALID_LIGHT_CURVES}standardization:
  host_mass_step: { enabled: false }
  scatter: { intrinsic: off }
  offset: sample
`;
    expect(names(text)).toEqual(['omega_m', 'abs_mag', 'alpha', 'beta']);
  });

  it('adds the population parameters for the hierarchical method', () => {
    const text = `${VALID_LIGHT_CURVES}standardization: { method: hierarchical }\n`;
    expect(names(text)).toEqual(['omega_m', 'alpha', 'beta', 'mass_step', 'sigma_int', 'x1_mean', 'x1_width', 'color_mean', 'color_width']);
  });

  it('reads x1_mean_slope as the stretch-mean slope, not as x1_mean of a sample "slope" (regression)', () => {
    const text = `${VALID_LIGHT_CURVES}standardization: { method: hierarchical }\nparameters:\n  x1_mean_slope: { prior: uniform, min: -1, max: 1 }\n`;
    const free = names(text);
    expect(free).toContain('x1_mean_slope');
    expect(free).toContain('x1_mean');
    expect(parametersForModel(configOf(text).config, 0).awaitsSampleLabels).toBe(false);
  });

  it('adds what each configured probe declares: h_ruler for BAO with a free ruler, h0 and omega_b_h2 with a computed one', () => {
    const bao = (ruler: string) => VALID_MAGNITUDES.replace('models:', `probes:\n  bao: { table: ../shared/data-real/desi-dr2-bao/measurements.csv, ruler: ${ruler} }\nmodels:`);
    expect(names(bao('free'))).toEqual(['omega_m', 'h_ruler']);
    expect(names(bao('computed'))).toEqual(['omega_m', 'h0', 'omega_b_h2']);
  });

  it('samples h0 only when calibrators are mapped', () => {
    const text = VALID_MAGNITUDES.replace('      magnitude_err: dmb', '      magnitude_err: dmb\n      calibrator_mu: CEPH');
    const result = parametersForModel(configOf(text).config, 0);
    expect(result.free.map((p) => p.name)).toEqual(['omega_m', 'h0']);
    expect(result.free[1].prior).toEqual(DEFAULT_PRIORS.h0);
    expect(result.fixed).toEqual({ w0: -1, wa: 0 });
  });

  it('holds h0 at a user-fixed value, else at reference_h0', () => {
    expect(parametersForModel(configOf(`${VALID_MAGNITUDES}parameters:\n  h0: { fixed: 73.2 }\n`).config, 0).fixed.h0).toBe(73.2);
    expect(parametersForModel(configOf(`${VALID_MAGNITUDES}reference_h0: 67.4\n`).config, 0).fixed.h0).toBe(67.4);
  });

  it('lets a model override the global block', () => {
    const text = VALID_MAGNITUDES.replace(/models:[\s\S]*$/, `models:
  - label: w_fixed
    dark_energy: constant_w
    parameters:
      w0: { fixed: -0.9 }
      omega_m: { prior: gaussian, mean: 0.3, sd: 0.02 }
parameters:
  omega_m: { prior: uniform, min: 0.1, max: 0.6 }
`);
    const result = parametersForModel(configOf(text).config, 0);
    expect(result.free).toEqual([{ name: 'omega_m', prior: { kind: 'gaussian', mean: 0.3, sd: 0.02 } }]);
    expect(result.fixed.w0).toBe(-0.9);
  });

  it('expands per-sample scatter over the sample labels, each with its own or the shared prior', () => {
    const text = `${VALID_LIGHT_CURVES}standardization: { scatter: { intrinsic: per_sample } }
parameters:
  sigma_int: { prior: uniform, min: 0, max: 0.3 }
  sigma_int_SNLS: { fixed: 0.08 }
`;
    const { config } = configOf(text);
    const pending = parametersForModel(config, 0);
    expect(pending.awaitsSampleLabels).toBe(true);
    expect(pending.free.map((p) => p.name)).toEqual(['omega_m', 'alpha', 'beta', 'mass_step']);
    expect(pending.fixed.sigma_int_SNLS).toBe(0.08);
    const known = parametersForModel(config, 0, ['SNLS', 'SDSS', 'low-z']);
    expect(known.awaitsSampleLabels).toBe(false);
    expect(known.free.slice(4)).toEqual([
      { name: 'sigma_int_SDSS', prior: { kind: 'uniform', min: 0, max: 0.3 } },
      { name: 'sigma_int_low-z', prior: { kind: 'uniform', min: 0, max: 0.3 } },
    ]);
  });

  it('throws RangeError for a model index that does not exist', () => {
    expect(() => parametersForModel(configOf(VALID_MAGNITUDES).config, 1)).toThrow(RangeError);
  });
});

describe('derivedForModel', () => {
  it('defaults to q0, z_accel, age_gyr, with omega_k for free curvature and offset when abs_mag is sampled', () => {
    const text = VALID_MAGNITUDES.replace(/models:[\s\S]*$/, 'models:\n  - { label: f }\n  - { label: c, curvature: free }\n');
    const { config } = configOf(text);
    expect(derivedForModel(config, 0)).toEqual(['q0', 'z_accel', 'age_gyr']);
    expect(derivedForModel(config, 1)).toEqual(['omega_k', 'q0', 'z_accel', 'age_gyr']);
    const sampled = configOf(`${text}standardization: { offset: sample, scatter: { intrinsic: off } }\n`.replace(/standardization:\n  scatter:\n    intrinsic: off\n/, '')).config;
    expect(derivedForModel(sampled, 0)).toEqual(['q0', 'z_accel', 'age_gyr', 'offset']);
  });

  it('uses the configured list as given', () => {
    expect(derivedForModel(configOf(`${VALID_MAGNITUDES}derived: [age_gyr, omega_k]\n`).config, 0)).toEqual(['age_gyr', 'omega_k']);
  });
});
