// The hierarchical standardization with systematic modes, end to end: the configuration is
// accepted, the pipeline hands the modes to the hierarchical term (Woodbury block path), and
// `candela standardize` evaluates and fits through it. Reference: the same configuration with
// U U^T written out as an N x N covariance file, which the hierarchical term factorizes as a
// dense 3N x 3N matrix; the Woodbury identity (Woodbury 1950) is exact, so the two agree to rounding.
// Data: the JLA light-curve parameters as re-released by Rahman et al. (2022)
// (../shared/data-real/jla-rahman2021, see its SOURCE.md; 740 rows), cut to 0.2 <= z < 0.3.
// The modes are deterministic numbers written by the test.
import { readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../../src/config/index.js';
import { checkConfiguration } from '../../../src/pipeline/index.js';
import { buildModel } from '../../../src/pipeline/run/buildModel.js';
import { loadSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

const TABLE = resolve('../shared/data-real/jla-rahman2021/jla_lcparams.txt');
/** Rows of the table before cuts (SOURCE.md: 740 supernovae). */
const ROWS = 740;
const K = 3;
/** Both paths are exact algebra and differ by rounding (~1e-13 relative here); 1e-9 leaves room. */
const RELATIVE_TOLERANCE = 1e-9;
const scratch = useScratchFolder('hierarchical-modes');

/** Deterministic modes (mag), 740 x 3: a sample-wide zero point, a smooth drift with the row, a wiggle. */
const MODES = Array.from({ length: ROWS }, (_, i) => [0.015, 0.02 * Math.sin(0.01 * i), 0.01 * Math.cos(0.37 * i)]);

function writeConfig(name: string, systematics: 'modes' | 'matrix' | 'none'): string {
  if (systematics === 'modes') writeFileSync(join(scratch, 'modes.csv'), `zero_point,drift,wiggle\n${MODES.map((row) => row.join(',')).join('\n')}\n`);
  if (systematics === 'matrix') {
    const lines = MODES.map((row) => MODES.map((other) => row.reduce((sum, value, k) => sum + value * other[k], 0)).join(' '));
    writeFileSync(join(scratch, 'modes-matrix.txt'), `${lines.join('\n')}\n`);
  }
  const block = { modes: '    systematic_modes:\n      - file: modes.csv\n', matrix: '    covariances:\n      - file: modes-matrix.txt\n', none: '' }[systematics];
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, `title: hierarchical with modes
seed: 5
supernovae:
  - label: jla
    kind: light_curves
    table: { file: ${TABLE}, delimiter: whitespace, index_column: yes }
    columns: { id: name, sample: set, z: zcmb, z_helio: zhel, m_b: mb, m_b_err: dmb, x1: x1, x1_err: dx1, color: color, color_err: dcolor,
      cov_m_b_x1: cov_m_s, cov_m_b_color: cov_m_c, cov_x1_color: cov_s_c, host_log_mass: 3rdvar }
    cuts: { redshift: [0.2, 0.2999] }
${block}standardization:
  method: hierarchical
  host_mass_step: { enabled: true, split_log_mass: 10, shape: sharp }
  scatter: { intrinsic: global, lensing_per_redshift: 0.055, peculiar_velocity_km_s: 150, redshift_errors: false }
  offset: marginalize
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
sampler: { walkers: 32 }
output: { dir: ${join(scratch, 'out')} }
`);
  return path;
}

const AT = { omega_m: 0.3, alpha: 0.14, beta: 3.1, mass_step: 0.06, sigma_int: 0.1, x1_mean: 0, x1_width: 1, color_mean: 0, color_width: 0.08 };

function logLikelihoodAt(path: string) {
  const config = loadConfigFile(path);
  const model = buildModel(config, 0, loadSupernovae(config));
  const theta = Float64Array.from(model.parameterNames, (name) => AT[name as keyof typeof AT]);
  return { model, value: model.supernovae!.logLikelihood(model.posterior.values(theta)) };
}

/** Rows of a standardize CSV as objects of numbers (id and sample kept as text). */
function csvRows(text: string): Array<Record<string, string>> {
  const [header, ...lines] = text.trim().split('\n');
  const names = header.split(',');
  return lines.map((line) => Object.fromEntries(line.split(',').map((cell, k) => [names[k], cell])));
}

describe('hierarchical standardization with systematic modes, configuration to likelihood', () => {
  it('check accepts the configuration and the pipeline builds the Woodbury block path', () => {
    const path = writeConfig('modes', 'modes');
    const summary = checkConfiguration(path);
    expect(JSON.stringify(summary)).not.toMatch(/modes_not_hierarchical/);
    const { model } = logLikelihoodAt(path);
    expect(model.supernovae!.path).toBe('blocks');
    expect(model.supernovae!.describe().join('\n')).toMatch(/3 systematic modes on m_B through the Woodbury identity/);
  });

  it('ln L equals that of the same U U^T given as an N x N covariance (dense 3N x 3N path; 1e-9 relative), and differs from no modes', () => {
    const modes = logLikelihoodAt(writeConfig('modes', 'modes'));
    const dense = logLikelihoodAt(writeConfig('matrix', 'matrix'));
    const none = logLikelihoodAt(writeConfig('none', 'none'));
    expect(dense.model.supernovae!.path).toBe('dense');
    expect(modes.model.supernovae!.dataCount).toBe(3 * 149); // 149 rows of the table have 0.2 <= zcmb <= 0.2999 (counted with awk)
    expect(Math.abs(modes.value - dense.value)).toBeLessThanOrEqual(RELATIVE_TOLERANCE * Math.abs(dense.value));
    // Guard: the modes move ln L (by 0.33 here), so the agreement above is not that of two terms without modes.
    expect(Math.abs(modes.value - none.value)).toBeGreaterThan(0.1);
  });

  /** Runs `candela standardize` on the modes and the matrix configurations; returns their tables and printed values. */
  async function standardizeBoth(given: Record<string, number>) {
    const at = Object.entries(given).flatMap(([name, value]) => ['--at', `${name}=${value}`]);
    const runs = [];
    for (const systematics of ['modes', 'matrix'] as const) {
      const out = join(scratch, `${systematics}.csv`);
      const run = await runCommandLine(['standardize', writeConfig(systematics, systematics), ...at, '--out', out]);
      expect(run.code, run.stderr).toBe(0);
      const printed = (name: string) => Number(new RegExp(`\\b${name}=(-?[0-9.e-]+)`).exec(run.stderr)?.[1]);
      runs.push({ rows: csvRows(readFileSync(out, 'utf8')), stderr: run.stderr, printed });
    }
    return runs;
  }

  it('candela standardize at given values writes the table of the dense path: mu, sigma_mu, latent x1 and c (1e-9)', async () => {
    const [modes, dense] = await standardizeBoth(AT);
    expect(modes.rows).toHaveLength(149);
    for (const column of ['mu_obs', 'sigma_mu', 'residual', 'x1_latent', 'x1_latent_sd', 'color_latent', 'color_latent_sd']) {
      modes.rows.forEach((row, i) => expect(Number(row[column])).toBeCloseTo(Number(dense.rows[i][column]), 9));
    }
  });

  it('candela standardize fits alpha and beta through the modes to the best fit of the dense path', async () => {
    const { alpha: _alpha, beta: _beta, ...given } = AT;
    const [modes, dense] = await standardizeBoth(given);
    expect(modes.stderr).toMatch(/fitted: alpha, beta/);
    // The simplex stops when its vertices lie within 1e-6 of their initial step (NELDER_MEAD_POSITION_TOLERANCE),
    // about 1e-7 in alpha and beta here; the printed values have 6 significant digits. 1e-4 leaves room.
    for (const name of ['alpha', 'beta']) {
      expect(modes.printed(name)).toBeGreaterThan(0);
      expect(modes.printed(name)).toBeCloseTo(dense.printed(name), 4);
    }
  });
});
