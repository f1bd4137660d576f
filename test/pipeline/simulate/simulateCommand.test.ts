// `candela simulate` through the real command-line entry point.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { readCovarianceMatrix, readSupernovaTable, readSystematicModes } from '../../../src/data/index.js';
import { checkConfiguration } from '../../../src/pipeline/index.js';
import { drawSurvey, loadSurvey } from '../../../src/pipeline/simulate/simulateSurvey.js';
import { MOCK_TABLE_COLUMNS } from '../../../src/pipeline/simulate/simulateFileContents.js';
import { editSurvey, lineOf, SMALL_SURVEY } from '../support/simulateSurveyText.js';
import { runCommandLine } from '../../support/runCommandLine.js';

mkdirSync('.candela-tmp', { recursive: true });
const scratch = mkdtempSync(join('.candela-tmp', 'simulate-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
afterEach(() => { process.exitCode = undefined; });

const run = (...argv: string[]) => runCommandLine(argv);

function surveyFile(name: string, text = SMALL_SURVEY): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

const FILES = ['sn.csv', 'sys.txt', 'truth.json'];
const read = (dir: string, name: string): Buffer => readFileSync(join(dir, name));

describe('candela simulate', () => {
  const survey = surveyFile('survey.yaml');

  it('writes the same bytes for the same seed and different ones for another seed', async () => {
    const first = await run('simulate', survey);
    expect(first.code).toBe(0);
    expect(first.stdout).toContain('drew 90 supernovae (near 40, far 50) with seed 99');
    const defaultDir = join(scratch, 'mock');
    const again = await run('simulate', survey, '--out', join(scratch, 'again'));
    expect(again.code).toBe(0);
    for (const name of FILES) expect(read(join(scratch, 'again'), name).equals(read(defaultDir, name)), name).toBe(true);
    const other = await run('simulate', survey, '--out', join(scratch, 'other'), '--seed', '7');
    expect(other.code).toBe(0);
    expect(read(join(scratch, 'other'), 'sn.csv').equals(read(defaultDir, 'sn.csv'))).toBe(false);
    expect(JSON.parse(read(join(scratch, 'other'), 'truth.json').toString()).seed).toBe('7');
  });

  it('never replaces existing files without --force, and does with it', async () => {
    const dir = join(scratch, 'guarded');
    expect((await run('simulate', survey, '--out', dir)).code).toBe(0);
    const before = statSync(join(dir, 'sn.csv')).mtimeMs;
    const refused = await run('simulate', survey, '--out', dir, '--seed', '8');
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain(`${join(dir, 'sn.csv')}: error: the output file exists already`);
    expect(refused.stderr).toContain('pass --force');
    expect(statSync(join(dir, 'sn.csv')).mtimeMs).toBe(before);
    expect((await run('simulate', survey, '--out', dir, '--seed', '8', '--force')).code).toBe(0);
    expect(JSON.parse(read(dir, 'truth.json').toString()).seed).toBe('8');
  });

  it('writes a table the data layer reads back with the demo configuration columns, and checksums in truth.json', async () => {
    const dir = join(scratch, 'readback');
    expect((await run('simulate', survey, '--out', dir)).code).toBe(0);
    const columns = checkConfiguration('configs/demo.yaml').config.supernovae[0].columns;
    const { table } = readSupernovaTable({ file: join(dir, 'sn.csv'), kind: 'light_curves', delimiter: 'comma', indexColumn: 'no', columns });
    const mock = drawSurvey(loadSurvey(survey).value, '99', false);
    expect(table.count).toBe(90);
    expect(table.ids).toEqual(mock.table.ids);
    expect(table.samples).toEqual(mock.table.samples);
    // 6 decimals written: |difference| <= 5e-7 (plus the rounding of the decimal conversion).
    for (const field of ['redshift', 'peakMag', 'stretch', 'color', 'peakMagErr'] as const) {
      const worst = Math.max(...Array.from(table[field]!, (value, i) => Math.abs(value - mock.table[field]![i])));
      expect(worst, field).toBeLessThanOrEqual(5.000001e-7);
    }
    const covariance = readCovarianceMatrix({ file: join(dir, 'sys.txt'), target: 'magnitudes', expectedSupernovae: 90, scale: 1 });
    const systematic = mock.systematicCovariance!;
    // 7 significant digits: relative difference <= 5e-7.
    expect(Math.max(...Array.from(covariance.values, (value, k) => Math.abs(value / systematic[k] - 1)))).toBeLessThanOrEqual(5.000001e-7);
    const truth = JSON.parse(read(dir, 'truth.json').toString());
    expect(truth.files.table.sha256).toBe(createHash('sha256').update(read(dir, 'sn.csv')).digest('hex'));
    expect(truth.files.covariance.sha256).toBe(createHash('sha256').update(read(dir, 'sys.txt')).digest('hex'));
    expect(truth.files.table.columns).toEqual([...MOCK_TABLE_COLUMNS]);
    expect(truth.truth).toMatchObject({ dark_energy: 'cpl', omega_m: 0.3, w0: -0.9, wa: 0.2, abs_mag: -19.3 });
    expect(Object.keys(truth.drawn_systematics.calibration_offset_mag)).toEqual(['near', 'far']);
  });

  it('exits 2 naming file, line, key and fix for a bad survey, and writes nothing', async () => {
    const text = editSurvey('    count: 40', '    count: 0');
    const bad = surveyFile('bad.yaml', text);
    const outcome = await run('simulate', bad, '--out', join(scratch, 'never'));
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toContain(`${bad}:${lineOf(text, 'count: 0')}:12: error at samples[0].count: out of range`);
    expect(outcome.stderr).toContain('fix: give the number of supernovae, an integer >= 1');
    expect(existsSync(join(scratch, 'never'))).toBe(false);
  });

  it('refuses forecast-only flags without --forecast', async () => {
    const outcome = await run('simulate', survey, '--json');
    expect(outcome.code).toBe(2);
    expect(outcome.stderr).toContain('--json');
  });
});

describe('the bundled demo data', () => {
  it('are what "candela simulate configs/demo-survey.yaml" draws (byte for byte)', async () => {
    const dir = join(scratch, 'demo');
    expect((await run('simulate', 'configs/demo-survey.yaml', '--out', dir)).code).toBe(0);
    for (const name of ['kestrel-supernovae.csv', 'kestrel-systematics.txt', 'kestrel-modes.csv']) {
      expect(read(dir, name).equals(read('data-demo', name)), name).toBe(true);
    }
    const fresh = JSON.parse(read(dir, 'truth.json').toString());
    const bundled = JSON.parse(read('data-demo', 'truth.json').toString());
    expect({ ...fresh, generator: null }).toEqual({ ...bundled, generator: null });
  });

  it('are read by configs/demo.yaml, which "candela check" accepts', async () => {
    const checked = await run('check', 'configs/demo.yaml');
    expect(checked.code).toBe(0);
    expect(checked.stdout).toContain('configs/demo.yaml: configuration is valid');
    const set = checkConfiguration('configs/demo.yaml').config.supernovae[0];
    const { table } = readSupernovaTable({
      file: set.table.file.resolved, kind: set.kind, delimiter: set.table.delimiter, indexColumn: set.table.indexColumn, columns: set.columns,
    });
    expect(table.count).toBe(800);
    expect(table.sampleNames).toEqual(['nearby', 'wide', 'deep']);
    const modes = readSystematicModes({ file: set.systematicModes[0].file.resolved, displayName: 'kestrel-modes.csv', expectedSupernovae: 800, scale: 1 });
    expect([modes.count, modes.modeCount]).toEqual([800, 6]);
    expect(modes.columnNames).toEqual(['calibration_nearby', 'calibration_wide', 'calibration_deep', 'redshift_drift', 'host_mass_split', 'coherent_velocity']);
  });
});
