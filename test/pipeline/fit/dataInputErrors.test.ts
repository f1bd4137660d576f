import { copyFileSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { gzipSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { PANTHEON_BINNED_FOLDER } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// Bad input that used to slip through, each made from a broken copy of the Pantheon 2018 binned
// Hubble diagram (Scolnic et al. 2018; ../shared/data-real/pantheon2018/Binned_data, 40 rows and a
// 40 x 40 systematic matrix). `check` must refuse what `fit` would refuse, name the configuration key
// (file:line) that names a bad file, and a refused fit must leave no output folder (exit 2).
const scratch = useScratchFolder('data-input-errors');

beforeAll(() => {
  mkdirSync(scratch, { recursive: true });
  for (const file of ['lcparam_DS17f.txt', 'sys_DS17f.txt']) copyFileSync(join(PANTHEON_BINNED_FOLDER, file), join(scratch, file));
  writeFileSync(join(scratch, 'sys.txt.gz'), gzipSync(readFileSync(join(scratch, 'sys_DS17f.txt'))));
  mkdirSync(join(scratch, 'a-folder'), { recursive: true });
  // The same table with the magnitude error of the third bin (file line 4) replaced by 1e200.
  const lines = readFileSync(join(scratch, 'lcparam_DS17f.txt'), 'utf8').split('\n');
  const fields = lines[3].split(' ');
  fields[5] = '1e200'; // name zcmb zhel dz mb dmb ...: dmb is the sixth field
  lines[3] = fields.join(' ');
  writeFileSync(join(scratch, 'huge-error.txt'), lines.join('\n'));
});

/** A configuration on the copied data; `table`, `covariance` and `cuts` replace the working values. */
function config(name: string, options: { table?: string; covariance?: string; cuts?: string } = {}): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, `title: "broken input"
seed: 1
supernovae:
  - label: bins
    kind: magnitudes
    table:
      file: ${options.table ?? 'lcparam_DS17f.txt'}
      delimiter: whitespace
    columns: { id: name, z: zcmb, z_helio: zhel, magnitude: mb, magnitude_err: dmb }
    covariances:
      - file: ${options.covariance ?? 'sys_DS17f.txt'}
        applies_to: magnitudes
    cuts:
      redshift: ${options.cuts ?? '[0.01, 2.5]'}
standardization:
  scatter: { intrinsic: off, lensing_per_redshift: 0, peculiar_velocity_km_s: 0, redshift_errors: false }
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
sampler: { walkers: 8, ensembles: 2, max_steps: 100, check_every: 100, checkpoint_every: 0, workers: 1 }
output: { dir: ${join(scratch, `out-${name}`)} }
`);
  return path;
}

describe('check names the configuration key of a bad input file', () => {
  it('points a missing table at supernovae[0].table.file on line 7, with the path it looked for', async () => {
    const path = config('missing-table', { table: 'absent.txt' });
    const { code, stderr } = await runCommandLine(['check', path]);
    expect(code).toBe(2);
    expect(stderr).toContain(`${path}:7:7: error at supernovae[0].table.file: the table file 'absent.txt' does not exist (found nothing at ${join(scratch, 'absent.txt')})`);
    expect(stderr).toContain('folder of the configuration file');
  });

  it('points a folder given as the table at its key', async () => {
    const path = config('folder-table', { table: 'a-folder' });
    const { code, stderr } = await runCommandLine(['check', path]);
    expect(code).toBe(2);
    expect(stderr).toContain(`${path}:7:7: error at supernovae[0].table.file: the table file 'a-folder' is a folder, not a file`);
  });

  it('points a gzip covariance at supernovae[0].covariances[0].file and prints none of its bytes', async () => {
    const path = config('gzip-covariance', { covariance: 'sys.txt.gz' });
    const { code, stderr } = await runCommandLine(['check', path]);
    expect(code).toBe(2);
    expect(stderr).toContain(`${path}:11:9: error at supernovae[0].covariances[0].file: the covariance file 'sys.txt.gz' is gzip-compressed`);
    expect(stderr).toContain('gunzip sys.txt.gz');
    expect(stderr).not.toMatch(/[\u0000-\u0008\u000e-\u001f\u007f-\u009f\ufffd]/); // no control bytes, no undecodable bytes
  });

  it('points cuts that remove every supernova at supernovae[0].cuts', async () => {
    const path = config('all-cut', { cuts: '[3, 4]' }); // the binned redshifts end near z = 1.6 (the file)
    const { code, stderr } = await runCommandLine(['check', path]);
    expect(code).toBe(2);
    expect(stderr).toContain(`${path}:13:5: error at supernovae[0].cuts: the cuts removed all 40 supernovae (data set 'bins', table lcparam_DS17f.txt) (found keep z >= 3 or calibrator: 40 removed)`);
    expect(stderr).toContain('loosen the cuts under supernovae[0].cuts');
  });
});

describe('check refuses what fit would refuse, and a refused fit writes nothing', () => {
  it('refuses a magnitude error of 1e200 in check and in fit, with file, line and column; fit leaves no folder', async () => {
    const path = config('huge-error', { table: 'huge-error.txt' });
    const checked = await runCommandLine(['check', path]);
    expect(checked.code).toBe(2);
    expect(checked.stderr).toMatch(/huge-error\.txt:4:\d+: error at dmb: column 'dmb' \(field magnitude_err\) holds a value no supernova can have \(expected magnitude_err <= 10000 mag, found 1e200\)/);
    const out = join(scratch, 'out-huge-error');
    const fitted = await runCommandLine(['fit', path, '--out', out]);
    expect(fitted.code).toBe(2);
    expect(fitted.stderr).toContain('huge-error.txt:4:');
    expect(existsSync(out)).toBe(false);
  });
});

describe('check names the probe key of a bad probe file', () => {
  it('points a missing BAO table at probes.bao.table, with the path it looked for', async () => {
    // DESI DR2 BAO (DESI Collaboration 2025, ../shared/data-real/desi-dr2-bao): the real covariance, a table that is not there
    const path = join(scratch, 'missing-bao.yaml');
    writeFileSync(path, `title: "broken probe"
probes:
  bao:
    table: no-measurements.csv
    covariance: ${resolve('../shared/data-real/desi-dr2-bao/covariance.txt')}
    ruler: free
models:
  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }
parameters:
  omega_m: { prior: uniform, min: 0.1, max: 0.6 }
  h_ruler: { prior: uniform, min: 80, max: 130 }
`);
    const { code, stderr } = await runCommandLine(['check', path]);
    expect(code).toBe(2);
    expect(stderr).toContain(`${path}:4:5: error at probes.bao.table: the bao table file 'no-measurements.csv' does not exist (found nothing at ${join(scratch, 'no-measurements.csv')})`);
  });
});
