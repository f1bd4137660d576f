// `candela simulate` with output.systematics_form: modes -- the modes file, truth.json,
// a fit configuration loading it, and surveys beyond the dense matrix's size limit.
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { main } from '../../../src/cli/main.js';
import { readConfigFile } from '../../../src/config/index.js';
import { readSystematicModes } from '../../../src/data/index.js';
import { formatIssues, isCandelaError } from '../../../src/errors.js';
import { MAX_COVARIANCE_SUPERNOVAE } from '../../../src/mock/index.js';
import { simulateSurvey } from '../../../src/pipeline/index.js';
import { drawSurvey, loadSurvey } from '../../../src/pipeline/simulate/simulateSurvey.js';
import type { SimulateOutcome } from '../../../src/pipeline/index.js';
import { buildModel } from '../../../src/pipeline/run/buildModel.js';
import { loadSupernovae } from '../../../src/pipeline/run/loadSupernovae.js';
import { mockFitConfigText } from '../support/mockFitConfigText.js';
import { editSurvey, SMALL_SURVEY } from '../support/simulateSurveyText.js';

/**
 * Agreement of ln L between the modes file (Woodbury path) and the matrix
 * file (dense path), the task's bound: the algebra is exact (Woodbury 1950;
 * the matrix determinant lemma), and the two files round differently to 7
 * significant digits, which moves C_sys (~1e-4 mag^2) by <= 5e-7 relative
 * against variances ~1e-2. Measured |delta ln L| ~ 3e-8 at ln L = 8 to 30,
 * 2.3e-9 to 3.4e-9 relative.
 */
const FILE_EQUIVALENCE_RELATIVE_TOLERANCE = 1e-8;
/** 7 significant digits written: relative rounding <= 5e-7 (plus the decimal conversion). */
const SEVEN_DIGITS_RELATIVE = 5.000001e-7;

mkdirSync('.candela-tmp', { recursive: true });
const scratch = mkdtempSync(join('.candela-tmp', 'simulate-modes-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
afterEach(() => { process.exitCode = undefined; });

const MODES_SURVEY = editSurvey('  covariance: sys.txt\n', '  covariance: modes.csv\n  systematics_form: modes\n');

function surveyFile(name: string, text: string): string {
  const path = join(scratch, name);
  writeFileSync(path, text);
  return path;
}

/** A fit configuration of the mock's table with the systematics entry given, five free parameters. */
function fitConfigFile(name: string, systematics: string) {
  const path = join(scratch, name);
  writeFileSync(path, mockFitConfigText('matrix/sn.csv', systematics, `  omega_m: { prior: uniform, min: 0, max: 1 }
  w0: { prior: uniform, min: -3, max: 1 }
  wa: { fixed: 0.2 }
  abs_mag: { prior: uniform, min: -21, max: -18 }
  alpha: { prior: uniform, min: 0, max: 0.5 }
  beta: { prior: uniform, min: 0, max: 6 }
  mass_step: { fixed: 0.05 }
  sigma_int: { fixed: 0.1 }`));
  const result = readConfigFile(path);
  if (!result.ok) throw new Error(formatIssues(result.issues));
  return result.value;
}

describe('simulateSurvey with systematics_form: modes', () => {
  const modesPath = surveyFile('modes.yaml', MODES_SURVEY);
  const matrixPath = surveyFile('matrix.yaml', SMALL_SURVEY);
  let modesOutcome: SimulateOutcome;
  let matrixOutcome: SimulateOutcome;
  beforeAll(() => {
    modesOutcome = simulateSurvey({ surveyPath: modesPath, outDir: join(scratch, 'modes'), force: true });
    matrixOutcome = simulateSurvey({ surveyPath: matrixPath, outDir: join(scratch, 'matrix'), force: true });
  });

  it('writes a modes file that readSystematicModes reads back (mode names in the header, 7 significant digits)', () => {
    const file = join(scratch, 'modes', 'modes.csv');
    expect(modesOutcome.files.map((f) => f.path)).toEqual([join(scratch, 'modes', 'sn.csv'), file, join(scratch, 'modes', 'truth.json')]);
    expect(readFileSync(file, 'utf8').split('\n')[0]).toBe('calibration_near,calibration_far,redshift_drift');
    const modes = readSystematicModes({ file, displayName: 'modes.csv', expectedSupernovae: 90, scale: 1 });
    expect(modes.modeCount).toBe(3);
    const drawn = drawSurvey(loadSurvey(modesPath).value, '99', false).systematicModes!;
    let worst = 0;
    drawn.values.forEach((value, k) => {
      if (value === 0) expect(modes.values[k]).toBe(0);
      else worst = Math.max(worst, Math.abs(modes.values[k] / value - 1));
    });
    expect(worst).toBeLessThanOrEqual(SEVEN_DIGITS_RELATIVE);
  });

  it('draws the same table as the matrix form and records the modes file in truth.json', () => {
    const read = (dir: string, name: string) => readFileSync(join(scratch, dir, name));
    expect(read('modes', 'sn.csv').equals(read('matrix', 'sn.csv'))).toBe(true);
    const truth = JSON.parse(read('modes', 'truth.json').toString());
    expect(truth.files.covariance).toEqual({
      name: 'modes.csv', form: 'modes', size: [90, 3], columns: ['calibration_near', 'calibration_far', 'redshift_drift'],
      sha256: createHash('sha256').update(read('modes', 'modes.csv')).digest('hex'),
    });
    expect(modesOutcome.systematicsEntry).toEqual({ key: 'systematic_modes', file: join(scratch, 'modes', 'modes.csv') });
    expect(matrixOutcome.systematicsEntry).toEqual({ key: 'covariances', file: join(scratch, 'matrix', 'sys.txt') });
  });

  it('gives a fit configuration the log-likelihood of the matrix form at three points (both via buildModel)', () => {
    const withModes = fitConfigFile('fit-modes.yaml', '    systematic_modes:\n      - file: modes/modes.csv');
    const withMatrix = fitConfigFile('fit-matrix.yaml', '    covariances:\n      - { file: matrix/sys.txt, applies_to: magnitudes }');
    const modesModel = buildModel(withModes, 0, loadSupernovae(withModes));
    const matrixModel = buildModel(withMatrix, 0, loadSupernovae(withMatrix));
    expect(modesModel.parameterNames).toEqual(['omega_m', 'w0', 'abs_mag', 'alpha', 'beta']);
    expect(matrixModel.parameterNames).toEqual(modesModel.parameterNames);
    expect(modesModel.supernovae?.path).toBe('low_rank');
    expect(matrixModel.supernovae?.path).toBe('general');
    const points = [[0.3, -0.9, -19.3, 0.14, 3.1], [0.25, -1.1, -19.35, 0.12, 2.9], [0.4, -0.7, -19.2, 0.17, 3.4]];
    const values = points.map((point) => {
      const theta = Float64Array.from(point);
      return [modesModel.posterior.logLikelihood(theta), matrixModel.posterior.logLikelihood(theta)];
    });
    for (const [modes, matrix] of values) {
      expect(Number.isFinite(modes)).toBe(true);
      expect(Math.abs(modes - matrix) / Math.abs(matrix)).toBeLessThan(FILE_EQUIVALENCE_RELATIVE_TOLERANCE);
    }
    expect(new Set(values.map((v) => v[1])).size).toBe(3); // distinct points, so the agreement is not a constant's
  });

  it('prints the systematic_modes entry for a fit configuration on the command line', async () => {
    let stdout = '';
    const spy = vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => { stdout += String(chunk); return true; });
    try {
      expect(await main(['simulate', modesPath, '--out', join(scratch, 'cli'), '--force'])).toBe(0);
    } finally {
      spy.mockRestore();
    }
    expect(stdout).toContain(`to fit it, give its data set systematic_modes: [{ file: ${join(scratch, 'cli', 'modes.csv')} }]`);
  });
});

describe(`simulateSurvey beyond ${MAX_COVARIANCE_SUPERNOVAE} supernovae`, () => {
  const count = 2 * MAX_COVARIANCE_SUPERNOVAE - 40;
  const large = (text: string) => text.replace('    count: 50', `    count: ${count}`);

  it('writes 20,000 supernovae with systematics in the modes form', () => {
    const outcome = simulateSurvey({ surveyPath: surveyFile('large-modes.yaml', large(MODES_SURVEY)), outDir: join(scratch, 'large-modes') });
    expect(outcome.supernovae).toBe(2 * MAX_COVARIANCE_SUPERNOVAE);
    const modes = readSystematicModes({ file: join(scratch, 'large-modes', 'modes.csv'), displayName: 'modes.csv', expectedSupernovae: outcome.supernovae, scale: 1 });
    expect(modes.modeCount).toBe(3);
  });

  it('refuses the matrix form with mock.covariance_too_large, naming the survey file, and writes nothing', () => {
    const path = surveyFile('large-matrix.yaml', large(SMALL_SURVEY));
    let issues: Array<{ code: string; file?: string }> = [];
    try {
      simulateSurvey({ surveyPath: path, outDir: join(scratch, 'large-matrix') });
    } catch (error) {
      if (isCandelaError(error)) issues = error.issues;
    }
    expect(issues.map((issue) => [issue.code, issue.file])).toEqual([['mock.covariance_too_large', path]]);
    expect(existsSync(join(scratch, 'large-matrix'))).toBe(false);
  });
});
