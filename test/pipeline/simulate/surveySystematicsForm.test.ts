// output.systematics_form of a survey description: default, modes, default file names, bad values.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SURVEY_OUTPUT, surveyFromText } from '../../../src/config/index.js';
import type { SurveyDescription } from '../../../src/config/index.js';
import type { Issue } from '../../../src/errors.js';
import { editSurvey, lineOf, SMALL_SURVEY } from '../support/simulateSurveyText.js';

const OUTPUT_BLOCK = `output:
  dir: mock
  table: sn.csv
  covariance: sys.txt
  truth: truth.json
`;

function parsed(text: string): SurveyDescription {
  const result = surveyFromText(text, 'survey.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => `${issue.path}: ${issue.message}`).join('\n'));
  return result.value;
}

function errorsOf(text: string): Issue[] {
  const result = surveyFromText(text, 'survey.yaml');
  expect(result.ok, 'expected the survey to be rejected').toBe(false);
  return result.ok ? [] : result.issues.filter((issue) => issue.severity !== 'warning');
}

describe('surveyFromText output.systematics_form', () => {
  it('defaults to matrix, so that existing descriptions write what they wrote before', () => {
    const output = parsed(SMALL_SURVEY).output;
    expect(output.systematicsForm).toBe('matrix');
    expect(output.covariance).toBe('sys.txt');
    expect(DEFAULT_SURVEY_OUTPUT.systematicsForm).toBe('matrix');
  });

  it('reads modes and keeps a file name the user gave', () => {
    const output = parsed(editSurvey('  covariance: sys.txt\n', '  covariance: sys.txt\n  systematics_form: modes\n')).output;
    expect(output).toMatchObject({ systematicsForm: 'modes', covariance: 'sys.txt', table: 'sn.csv', truth: 'truth.json' });
  });

  it('names the file systematic_modes.csv with modes and systematics.txt with matrix when the user named none', () => {
    const withoutName = (form: string) => SMALL_SURVEY.replace(OUTPUT_BLOCK, `output:\n  dir: mock\n  systematics_form: ${form}\n`);
    expect(SMALL_SURVEY.includes(OUTPUT_BLOCK)).toBe(true);
    expect(parsed(withoutName('modes')).output.covariance).toBe('systematic_modes.csv');
    expect(parsed(withoutName('matrix')).output.covariance).toBe('systematics.txt');
  });

  it('rejects an unknown value with the closest one', () => {
    const text = editSurvey('  covariance: sys.txt\n', '  covariance: sys.txt\n  systematics_form: mode\n');
    const [issue] = errorsOf(text);
    expect(issue).toMatchObject({
      code: 'config.unknown_value', path: 'output.systematics_form', file: 'survey.yaml', line: lineOf(text, 'systematics_form: mode'),
      expected: 'one of matrix, modes', fix: 'did you mean "modes"?',
    });
  });

  it('rejects a misspelt key with the closest one', () => {
    const text = editSurvey('  covariance: sys.txt\n', '  covariance: sys.txt\n  systematic_form: modes\n');
    const [issue] = errorsOf(text);
    expect(issue).toMatchObject({ code: 'config.unknown_key', path: 'output.systematic_form', fix: 'did you mean "systematics_form"?' });
  });
});
