// candela budget on a short fit of the test survey's mock (its named modes file, one row
// per column): the files it writes, the report section, and bad input (exit 2 with key and fix).
// The numbers themselves are checked against closed forms in test/math/reweighting.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../../src/cli/main.js';
import { isCandelaError } from '../../../src/errors.js';
import { runBudget, runFit, simulateSurvey } from '../../../src/pipeline/index.js';
import { mockFitConfigText } from '../support/mockFitConfigText.js';
import { editSurvey } from '../support/simulateSurveyText.js';

const scratch = resolve('.candela-tmp/budget-run');
const PARAMETERS = `  omega_m: { prior: gaussian, mean: 0.3, sd: 0.02 }
  w0: { prior: uniform, min: -3, max: 1 }
  wa: { fixed: 0.2 }
  abs_mag: { prior: uniform, min: -21, max: -18 }
  alpha: { prior: uniform, min: 0, max: 0.5 }
  beta: { prior: uniform, min: 0, max: 6 }
  mass_step: { fixed: 0.05 }
  sigma_int: { fixed: 0.1 }`;

async function fit(name: string, systematics: string): Promise<string> {
  const path = join(scratch, `${name}.yaml`);
  const text = mockFitConfigText('mock/sn.csv', systematics, PARAMETERS) +
    `sampler: { walkers: 12, ensembles: 2, max_steps: 400, check_every: 100, target_ess: 1000000, workers: 1 }\noutput: { dir: ${join(scratch, name)}, figures: [], png: false }\n`;
  writeFileSync(path, text);
  const [outcome] = await runFit({ configPath: path });
  return outcome.runDir;
}

let withModes: string;
let withMatrix: string;
let without: string;
beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  const survey = join(scratch, 'survey.yaml');
  writeFileSync(survey, editSurvey('  truth: truth.json\n', '  truth: truth.json\n  named_modes: modes.csv\n')
    .replace('\nsamples:', '\nanalysis_systematics: { coherent_velocity_km_s: 150 }\nsamples:'));
  simulateSurvey({ surveyPath: survey, outDir: join(scratch, 'mock'), force: true });
  withModes = await fit('modes', '    systematic_modes: [{ file: mock/modes.csv, name: mock, per_column: true }]');
  withMatrix = await fit('matrix', '    covariances: [{ file: mock/sys.txt, applies_to: magnitudes, name: calibration_and_drift }]');
  without = await fit('plain', '');
}, 120_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('runBudget', () => {
  it('weighs each column of a per_column mode file and writes the tables, the figure and the report section', async () => {
    const outcome = await runBudget({ runDir: withModes, maxDraws: 1000, parameters: ['w0', 'omega_m'] });
    expect(outcome.table.rows.map((row) => row.name)).toEqual(['mock.calibration_near', 'mock.calibration_far', 'mock.redshift_drift', 'mock.coherent_velocity']);
    expect(outcome.table.parameters).toEqual(['w0', 'omega_m']);
    for (const file of ['budget.md', 'budget.tex', 'budget.json', 'figures/budget.svg', 'report.html']) expect(existsSync(join(withModes, file)), file).toBe(true);
    const json = JSON.parse(readFileSync(join(withModes, 'budget.json'), 'utf8'));
    expect(json.method).toMatch(/^importance reweighting of \d+ draws/);
    expect(json.systematics[0].parameters.w0).toHaveProperty('shift_when_removed');
    expect(readFileSync(join(withModes, 'report.html'), 'utf8')).toContain('<h2>Systematic budget</h2>');
  }, 120_000);

  it('weighs a covariance matrix as one systematic, by its name, without rebuilding the report when asked not to', async () => {
    const outcome = await runBudget({ runDir: withMatrix, maxDraws: 500, report: false });
    expect(outcome.table.rows.map((row) => row.name)).toEqual(['calibration_and_drift']);
    expect(outcome.files.some((file) => file.endsWith('report.html'))).toBe(false);
    // One systematic: removing it is the statistical-only variant, so both give the same standard deviations.
    outcome.table.parameters.forEach((_, j) => expect(outcome.table.rows[0].contribution[j]).toBeCloseTo(outcome.table.totalSystematic[j], 12));
  }, 120_000);

  it('refuses a parameter the run does not sample, with the closest name', async () => {
    await expect(runBudget({ runDir: withModes, parameters: ['w_0'], report: false })).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'budget.unknown_parameter' && error.issues[0].fix === 'did you mean "w0"?');
  });

  it('refuses a run without systematics, naming the configuration keys', async () => {
    await expect(runBudget({ runDir: without, report: false })).rejects.toSatisfy((error: unknown) =>
      isCandelaError(error) && error.issues[0].code === 'budget.no_systematics' && /systematic_modes/.test(error.issues[0].path ?? ''));
  });

  it('exits 2 from the command line on bad input, and on a folder that is not a run', async () => {
    expect(await main(['budget', without, '--no-report'])).toBe(2);
    expect(await main(['budget', scratch])).toBe(2);
    expect(await main(['budget', withModes, '--draws', 'many'])).toBe(2);
    expect(await main(['budget', withModes, '--draws', '10', '--no-report'])).toBe(2);
  });
});
