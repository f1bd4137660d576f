// `candela simulate --forecast` through the real command-line entry point.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { SMALL_SURVEY } from '../support/simulateSurveyText.js';
import { runCommandLine } from '../../support/runCommandLine.js';

mkdirSync('.candela-tmp', { recursive: true });
const scratch = mkdtempSync(join('.candela-tmp', 'forecast-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
afterEach(() => { process.exitCode = undefined; });

const run = (...argv: string[]) => runCommandLine(argv);

const survey = join(scratch, 'survey.yaml');
writeFileSync(survey, SMALL_SURVEY);
const fit = join(scratch, 'fit.yaml');
writeFileSync(fit, `seed: 3
supernovae:
  - label: mock
    kind: light_curves
    table: { file: mock/sn.csv, delimiter: comma }
    columns: { id: id, sample: sample, z: z_cmb, m_b: m_b, m_b_err: m_b_err, x1: x1, x1_err: x1_err, color: color, color_err: color_err, host_log_mass: host_log_mass }
standardization:
  scatter: { intrinsic: global, lensing_per_redshift: 0.055, peculiar_velocity_km_s: 300, redshift_errors: false }
  alpha_beta_covariance: frozen
  frozen_at: { alpha: 0.14, beta: 3.1 }
  offset: marginalize
models:
  - { label: flat_lcdm, dark_energy: lambda }
  - { label: flat_w, dark_energy: constant_w }
parameters:
  beta: { prior: gaussian, mean: 3.1, sd: 0.2 }
  sigma_int: { fixed: 0.1 }
`);

describe('candela simulate --forecast', () => {
  it('prints the default w0waCDM forecast as text', async () => {
    const { code, stdout } = await run('simulate', survey, '--forecast');
    expect(code).toBe(0);
    expect(stdout).toContain('model flat_w0wa (dark energy cpl, flat)');
    expect(stdout).toMatch(/figure of merit \(w0, wa\) = 1\/sqrt\(det Cov\) = [0-9.]+/);
    expect(stdout).toContain('covariance information from: alpha, beta');
  });

  it('follows a fit configuration: its models, priors and the marginalized offset, as JSON', async () => {
    const { code, stdout } = await run('simulate', survey, '--forecast', '--fit-config', fit, '--json');
    expect(code).toBe(0);
    const result = JSON.parse(stdout);
    expect(result.models.map((m: { label: string }) => m.label)).toEqual(['flat_lcdm', 'flat_w']);
    const [lcdm, wcdm] = result.models;
    expect(lcdm.parameters).toEqual(['omega_m', 'abs_mag', 'alpha', 'beta', 'mass_step']);
    expect(wcdm.parameters).toEqual(['omega_m', 'w0', 'abs_mag', 'alpha', 'beta', 'mass_step']);
    expect(lcdm.gaussian_priors).toEqual([{ name: 'beta', sd: 0.2 }]);
    expect(lcdm.figure_of_merit).toBeNull();
    expect(lcdm.covariance_parameters).toEqual([]);
    // The lambda model holds w0 = -1, wa = 0 while the truth has w0 = -0.9, wa = 0.2: it is forecast at
    // its own fiducial (said in a note), where the noise-free survey has chi^2 = 0 (identity, common practice).
    expect(lcdm.notes.some((note: string) => note.startsWith('w0 is fixed at -1 (survey truth -0.9): this model is forecast on the survey drawn with w0 = -1'))).toBe(true);
    expect(lcdm.chi_square_at_truth).toBeLessThan(1e-18);
    expect(wcdm.chi_square_at_truth).toBeLessThan(1e-18);
    expect(wcdm.notes.some((note: string) => note.includes('abs_mag is marginalized in the fit'))).toBe(true);
    // sigma is the square root of the covariance diagonal, and the correlation its normalization.
    wcdm.parameters.forEach((name: string, i: number) => {
      expect(wcdm.sigma[name]).toBeCloseTo(Math.sqrt(wcdm.covariance[i][i]), 14);
      expect(wcdm.correlation[i][i]).toBe(1);
    });
  });

  it('refuses output options with --forecast', async () => {
    const { code, stderr } = await run('simulate', survey, '--forecast', '--out', join(scratch, 'x'));
    expect(code).toBe(2);
    expect(stderr).toContain('--out');
  });
});
