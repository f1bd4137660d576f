// output.named_modes: every systematic of a survey as a named mode, the drawn ones then
// the analysis systematics, beside unchanged table and matrix bytes.
import { describe, expect, it } from 'vitest';
import { surveyFromText } from '../../../src/config/index.js';
import { analysisSystematicModes } from '../../../src/mock/index.js';
import { simulateFileContents } from '../../../src/pipeline/simulate/simulateFileContents.js';
import { drawSurvey } from '../../../src/pipeline/simulate/simulateSurvey.js';
import { editSurvey, SMALL_SURVEY } from '../support/simulateSurveyText.js';

function survey(text: string) {
  const result = surveyFromText(text, 'survey.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => issue.message).join('\n'));
  return result.value;
}

const NAMED = editSurvey('  truth: truth.json\n', '  truth: truth.json\n  named_modes: modes.csv\n')
  .replace('\nsamples:', '\nanalysis_systematics: { host_mass_split_dex: 0.3, coherent_velocity_km_s: 120 }\nsamples:');

describe('simulateFileContents with output.named_modes', () => {
  const plain = survey(SMALL_SURVEY);
  const named = survey(NAMED);
  const plainFiles = simulateFileContents(plain, drawSurvey(plain, '99', false), 99);
  const mock = drawSurvey(named, '99', false);
  const files = simulateFileContents(named, mock, 99);

  it('leaves the table and the matrix byte for byte as without it (the analysis systematics are not drawn)', () => {
    expect(files.table).toBe(plainFiles.table);
    expect(files.covariance).toBe(plainFiles.covariance);
    expect(plainFiles.namedModes).toBeNull();
  });

  it('writes the drawn modes, then the host-mass split and the coherent velocity, under a header of names', () => {
    const lines = (files.namedModes ?? '').trimEnd().split('\n');
    expect(lines[0].endsWith('redshift_drift,host_mass_split,coherent_velocity')).toBe(true);
    expect(lines).toHaveLength(mock.table.count + 1);
    const analysis = analysisSystematicModes({
      redshift: mock.table.redshift, hostLogMass: Float64Array.from(mock.table.hostLogMass!, (m) => Number(m.toFixed(4))),
      massStepMag: 0.05, splitLogMass: 10,
    }, named.analysisSystematics);
    for (let i = 0; i < mock.table.count; i++) {
      const cells = lines[i + 1].split(',').map(Number);
      const k = cells.length;
      // 7 significant digits written (simulate.md): relative rounding below 5e-7.
      expect(Math.abs(cells[k - 2] - analysis.values[2 * i])).toBeLessThanOrEqual(5e-7 * Math.abs(analysis.values[2 * i]));
      expect(Math.abs(cells[k - 1] - analysis.values[2 * i + 1])).toBeLessThanOrEqual(5e-7 * Math.abs(analysis.values[2 * i + 1]));
    }
  });

  it('records the file with its columns and checksum, and the analysis settings, in truth.json', () => {
    const truth = JSON.parse(files.truth);
    expect(truth.files.named_modes.columns.slice(-2)).toEqual(['host_mass_split', 'coherent_velocity']);
    expect(truth.files.named_modes.size).toEqual([mock.table.count, truth.files.named_modes.columns.length]);
    expect(truth.analysis_systematics).toEqual({ host_mass_split_dex: 0.3, coherent_velocity_km_s: 120, coherent_velocity_max_redshift: 0.1 });
    expect(JSON.parse(plainFiles.truth).analysis_systematics).toBeUndefined();
  });
});
