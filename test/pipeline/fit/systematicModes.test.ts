// Systematic-mode files from the configuration to the likelihood: loading with
// cuts, side-by-side and block embedding, checksums, the check summary, and the
// equivalence of modes U with the dense covariance U U^T.
// Data: the Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018,
// Scolnic et al. 2018; 40 rows, see its SOURCE.md). The modes are deterministic
// numbers written by the test.
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readConfigFile } from '../../../src/config/index.js';
import type { CandelaConfig } from '../../../src/config/index.js';
import { formatIssues, isCandelaError, type Issue } from '../../../src/errors.js';
import { checkConfiguration } from '../../../src/pipeline/index.js';
import { buildModel } from '../../../src/pipeline/run/buildModel.js';
import { loadSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';

const TABLE = resolve('../shared/data-real/pantheon2018/Binned_data/lcparam_DS17f.txt');
/** Rows of the binned table (SOURCE.md: 40 redshift bins). */
const ROWS = 40;
/** Redshifts of the 40 bins (column zcmb of lcparam_DS17f.txt), to know which rows a cut keeps. */
const ZCMB = [0.014, 0.0194, 0.0264, 0.0329, 0.0396, 0.0475, 0.056, 0.064, 0.0721, 0.0811, 0.0889, 0.1001, 0.1071, 0.1195,
  0.1278, 0.1396, 0.1519, 0.1635, 0.1778, 0.1906, 0.2067, 0.2216, 0.2405, 0.2558, 0.2762, 0.2972, 0.3215, 0.3453, 0.3708,
  0.4049, 0.4355, 0.4738, 0.5174, 0.5742, 0.6299, 0.724, 0.821, 0.9511, 1.2336, 1.6123];
/**
 * Relative agreement of ln L between the Woodbury (modes) and the dense
 * (U U^T) paths: both are exact algebra (Woodbury 1950; matrix determinant
 * lemma) and differ by rounding only, ~1e-13 for 40 supernovae; 1e-8 leaves room.
 */
const EQUIVALENCE_RELATIVE_TOLERANCE = 1e-8;

const scratch = resolve('.candela-tmp/systematic-modes');

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** Deterministic modes, N x K, mag: smooth in redshift order, a few hundredths of a magnitude, distinct per seed. */
function modeMatrix(modes: number, seed: number): number[][] {
  return Array.from({ length: ROWS }, (_, i) => Array.from({ length: modes }, (_, k) => 0.02 * Math.sin(seed + 0.37 * (i + 1) * (k + 1)) + 0.004 * (k - 1)));
}

/** U U^T, N x N (products in the order of the modes, so the result is exactly symmetric). */
function outer(u: number[][], scale = 1): number[][] {
  return u.map((row) => u.map((other) => scale * scale * row.reduce((sum, value, k) => sum + value * other[k], 0)));
}

/** Writes rows of numbers (String(x) round-trips a double exactly) and returns the file name. */
function writeRows(name: string, rows: number[][], delimiter = ',', header?: string): string {
  writeFileSync(join(scratch, name), `${header ? `${header}\n` : ''}${rows.map((row) => row.map(String).join(delimiter)).join('\n')}\n`);
  return name;
}

interface DataSetSpec { label: string; redshift?: [number, number]; modes?: Array<{ file: string; scale?: number }>; covariances?: string[] }

/** A magnitudes configuration on the binned table (every error term already in dmb), flat LambdaCDM. */
function writeConfig(name: string, sets: DataSetSpec[], method = 'conventional'): CandelaConfig {
  const block = sets.map((set) => `  - label: ${set.label}
    kind: magnitudes
    table: { file: ${TABLE}, delimiter: whitespace }
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
${set.redshift ? `    cuts: { redshift: [${set.redshift.join(', ')}] }\n` : ''}${set.modes ? `    systematic_modes:\n${set.modes.map((m) => `      - { file: ${m.file}, scale: ${m.scale ?? 1} }`).join('\n')}\n` : ''}${set.covariances ? `    covariances:\n${set.covariances.map((file) => `      - { file: ${file} }`).join('\n')}\n` : ''}`).join('');
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, `title: modes test
seed: 3
supernovae:
${block}standardization:
  method: ${method}
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
sampler: { walkers: 8 }
output: { dir: ${join(scratch, 'out')} }
`);
  const result = readConfigFile(path);
  if (!result.ok) throw new Error(formatIssues(result.issues));
  return result.value;
}

function loadProblems(config: CandelaConfig): Issue[] {
  try {
    loadSupernovae(config);
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

/** Indices of the bins with min <= z <= max (the redshift cut's rule, docs/configuration.md). */
function keptRows(min: number, max: number): number[] {
  return ZCMB.flatMap((z, i) => (z >= min && z <= max ? [i] : []));
}

describe('loadSupernovae with systematic modes', () => {
  const a = modeMatrix(2, 0.1);
  const b = modeMatrix(1, 0.7);
  const c = modeMatrix(3, 1.3);

  it('has no modes when no data set names a mode file', () => {
    const data = loadSupernovae(writeConfig('none', [{ label: 'bins' }]));
    expect(data.systematicModes).toBeUndefined();
    expect(data.systematicModeFiles).toEqual([]);
  });

  it('keeps the rows of the supernovae that pass the cuts, scaled, and records the file for checksums', () => {
    writeRows('a.csv', a, ',', 'calibration,dust');
    const data = loadSupernovae(writeConfig('cut', [{ label: 'bins', redshift: [0.1, 2], modes: [{ file: 'a.csv', scale: 2 }] }]));
    const kept = keptRows(0.1, 2);
    expect(kept).toHaveLength(29); // bins 11..39 (z from 0.1001)
    expect(data.table.count).toBe(29);
    const modes = data.systematicModes!;
    expect([modes.count, modes.modeCount]).toEqual([29, 2]);
    expect(Array.from(modes.values)).toEqual(kept.flatMap((i) => a[i].map((value) => 2 * value))); // scale 2 multiplies exactly
    expect(data.inputFiles).toContainEqual({ written: 'a.csv', resolved: join(scratch, 'a.csv') });
    expect(data.systematicModeFiles).toEqual([{ label: 'bins', file: 'a.csv', supernovae: 40, modes: 2 }]);
  });

  it('places the columns of several files of one data set side by side', () => {
    writeRows('a.txt', a, ' ');
    writeRows('b.tsv', b, '\t');
    const data = loadSupernovae(writeConfig('side', [{ label: 'bins', modes: [{ file: 'a.txt' }, { file: 'b.tsv' }] }]));
    const modes = data.systematicModes!;
    expect([modes.count, modes.modeCount]).toEqual([40, 3]);
    expect(Array.from(modes.values)).toEqual(a.flatMap((row, i) => [...row, ...b[i]]));
  });

  it('embeds each data set\'s modes in its own rows, zeros in the rows of the other sets', () => {
    writeRows('a.csv', a);
    writeRows('c.csv', c);
    const config = writeConfig('blocks', [
      { label: 'low', redshift: [0.01, 0.2], modes: [{ file: 'a.csv' }] },
      { label: 'middle', redshift: [0.2, 0.5] },
      { label: 'high', redshift: [0.5, 2], modes: [{ file: 'c.csv' }] },
    ]);
    const data = loadSupernovae(config);
    const [low, middle, high] = [keptRows(0.01, 0.2), keptRows(0.2, 0.5), keptRows(0.5, 2)];
    expect([low.length, middle.length, high.length]).toEqual([20, 12, 8]);
    const modes = data.systematicModes!;
    expect([modes.count, modes.modeCount]).toEqual([40, 5]); // K = 2 + 3
    const expected = [
      ...low.map((i) => [...a[i], 0, 0, 0]),
      ...middle.map(() => [0, 0, 0, 0, 0]),
      ...high.map((i) => [0, 0, ...c[i]]),
    ];
    expect(Array.from(modes.values)).toEqual(expected.flat());
    expect(data.systematicModeFiles.map((entry) => entry.label)).toEqual(['low', 'high']);
  });

  it('collects the problems of mode files with those of covariance files', () => {
    writeFileSync(join(scratch, 'short.csv'), '0.1\n0.2\n');
    writeFileSync(join(scratch, 'bad-cov.txt'), '2\n1\nx\n0\n1\n');
    const issues = loadProblems(writeConfig('broken', [{ label: 'bins', modes: [{ file: 'short.csv' }, { file: 'absent.csv' }], covariances: ['bad-cov.txt'] }]));
    expect(issues.map((issue) => [issue.code, issue.file])).toEqual([
      ['covariance.non_numeric', 'bad-cov.txt'],
      ['modes.wrong_row_count', 'short.csv'],
      ['data.file_not_found', join(scratch, 'broken.yaml')],
    ]);
    // a missing file is named by the configuration key that names it (common practice: point at what the user can edit)
    expect(issues[2]).toMatchObject({ path: 'supernovae[0].systematic_modes[1].file' });
    expect(issues[2].message).toContain("'absent.csv'");
    expect(issues[2].found).toBe(`nothing at ${join(scratch, 'absent.csv')}`);
  });

  it('lists each mode file with its size in the check summary', () => {
    writeRows('a.csv', a);
    writeConfig('check', [{ label: 'bins', modes: [{ file: 'a.csv' }] }]);
    const { summaryLines } = checkConfiguration(join(scratch, 'check.yaml'));
    expect(summaryLines).toContain('  systematic modes a.csv: 40 supernovae x 2 modes (before cuts)');
  });
});

describe('buildModel with systematic modes', () => {
  const thetas = [0.2, 0.3, 0.45].map((omegaM) => Float64Array.of(omegaM));

  function logLikelihoods(config: CandelaConfig): number[] {
    const model = buildModel(config, 0, loadSupernovae(config));
    expect(model.parameterNames).toEqual(['omega_m']);
    return thetas.map((theta) => model.posterior.logLikelihood(theta));
  }

  function expectEquivalent(modes: number[], dense: number[]): void {
    // Woodbury identity (Woodbury 1950) and the matrix determinant lemma: exact algebra
    for (let i = 0; i < modes.length; i++) {
      expect(Number.isFinite(modes[i])).toBe(true);
      expect(Math.abs(modes[i] - dense[i]) / Math.abs(dense[i])).toBeLessThan(EQUIVALENCE_RELATIVE_TOLERANCE);
    }
    expect(new Set(dense).size).toBe(dense.length); // the three points are distinct, so agreement is not a constant's
  }

  it('gives the log-likelihood of the dense covariance U U^T for modes U (N x 3)', () => {
    const u = modeMatrix(3, 0.4);
    writeRows('u.csv', u);
    writeRows('uut.txt', outer(u), ' ');
    const withModes = logLikelihoods(writeConfig('eq-modes', [{ label: 'bins', modes: [{ file: 'u.csv' }] }]));
    const withMatrix = logLikelihoods(writeConfig('eq-dense', [{ label: 'bins', covariances: ['uut.txt'] }]));
    const diagonalOnly = logLikelihoods(writeConfig('eq-none', [{ label: 'bins' }]));
    expectEquivalent(withModes, withMatrix);
    expect(withModes[1]).not.toBeCloseTo(diagonalOnly[1], 3); // the modes do change the likelihood
  });

  it('agrees with the dense matrices after cuts, side-by-side files, a scale and two data sets', () => {
    const [lowModes, highFirst, highSecond] = [modeMatrix(2, 2.1), modeMatrix(1, 2.9), modeMatrix(2, 3.3)];
    writeRows('low.csv', lowModes);
    writeRows('high1.csv', highFirst);
    writeRows('high2.csv', highSecond);
    writeRows('low-dense.txt', outer(lowModes), ' ');
    writeRows('high1-dense.txt', outer(highFirst, 2), ' '); // scale 2 on the shifts = 4 on the covariance
    writeRows('high2-dense.txt', outer(highSecond), ' ');
    const withModes = logLikelihoods(writeConfig('eq2-modes', [
      { label: 'low', redshift: [0.01, 0.2], modes: [{ file: 'low.csv' }] },
      { label: 'high', redshift: [0.2, 2], modes: [{ file: 'high1.csv', scale: 2 }, { file: 'high2.csv' }] },
    ]));
    const withMatrix = logLikelihoods(writeConfig('eq2-dense', [
      { label: 'low', redshift: [0.01, 0.2], covariances: ['low-dense.txt'] },
      { label: 'high', redshift: [0.2, 2], covariances: ['high1-dense.txt', 'high2-dense.txt'] },
    ]));
    expectEquivalent(withModes, withMatrix);
  });
});
