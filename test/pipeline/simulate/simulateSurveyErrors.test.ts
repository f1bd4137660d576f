// Invalid survey descriptions: every problem is reported with file, line,
// key path and a fix (the standard of the run configuration, docs/simulate.md).
import { describe, expect, it } from 'vitest';
import { surveyFromText } from '../../../src/config/index.js';
import type { Issue } from '../../../src/errors.js';
import { editSurvey, lineOf, SMALL_SURVEY } from '../support/simulateSurveyText.js';

function errorsOf(text: string): Issue[] {
  const result = surveyFromText(text, 'survey.yaml');
  expect(result.ok, 'expected the survey to be rejected').toBe(false);
  return result.ok ? [] : result.issues.filter((issue) => issue.severity !== 'warning');
}

function expectAt(issue: Issue, text: string, snippet: string, path: string): void {
  expect(issue.file).toBe('survey.yaml');
  expect(issue.line, `line of "${snippet}"`).toBe(lineOf(text, snippet));
  expect(issue.column).toBeGreaterThan(0);
  expect(issue.path).toBe(path);
  expect(issue.fix).toBeTruthy();
}

describe('surveyFromText', () => {
  it('accepts the valid description with its values and defaults', () => {
    const result = surveyFromText(SMALL_SURVEY, 'configs/survey.yaml');
    if (!result.ok) throw new Error(result.issues.map((i) => i.message).join('\n'));
    const survey = result.value;
    expect(survey.truth.w0).toBe(-0.9);
    expect(survey.samples.map((s) => s.count)).toEqual([40, 50]);
    expect(survey.samples[1].redshift.shape).toBe('volume');
    expect(survey.samples[1].errors.correlations).toEqual({ peakMagStretch: 0, peakMagColor: 0, stretchColor: 0 });
    expect(survey.output.dir).toEqual({ written: 'mock', resolved: 'configs/mock' });
    expect(result.warnings).toEqual([]);
  });

  it('reports an unknown key with the closest valid one', () => {
    const text = editSurvey('    calibration_offset_mag: 0.01\n', '    calibration_ofset_mag: 0.01\n');
    const [issue] = errorsOf(text);
    expect(issue.code).toBe('config.unknown_key');
    expectAt(issue, text, 'calibration_ofset_mag', 'samples[0].calibration_ofset_mag');
    expect(issue.fix).toBe('did you mean "calibration_offset_mag"?');
  });

  it('reports a count <= 0', () => {
    const text = editSurvey('    count: 40', '    count: 0');
    const [issue] = errorsOf(text);
    expect(issue.code).toBe('config.out_of_range');
    expectAt(issue, text, 'count: 0', 'samples[0].count');
    expect(issue.expected).toBe('an integer >= 1');
  });

  it('reports a redshift range with min >= max', () => {
    const text = editSurvey('{ min: 0.2, max: 1.0 }', '{ min: 1.0, max: 0.2 }');
    const [issue] = errorsOf(text);
    expect(issue.code).toBe('survey.redshift_range');
    expectAt(issue, text, 'min: 1.0, max: 0.2', 'samples[1].redshift.min');
    expect(issue.found).toBe('min: 1, max: 0.2');
  });

  it('reports a correlation with |rho| >= 1', () => {
    const text = editSurvey('m_b_color: 0.3,', 'm_b_color: 1.0,');
    const [issue] = errorsOf(text);
    expect(issue.code).toBe('config.out_of_range');
    expectAt(issue, text, 'm_b_color: 1.0', 'samples[0].errors.correlations.m_b_color');
    expect(issue.expected).toBe('a number > -1 and < 1');
  });

  it('reports correlations that are each valid but not jointly positive definite', () => {
    const text = editSurvey('{ m_b_x1: 0.1, m_b_color: 0.3, x1_color: -0.1 }', '{ m_b_x1: 0.9, m_b_color: 0.9, x1_color: -0.9 }');
    const [issue] = errorsOf(text);
    expect(issue.code).toBe('survey.correlations_inconsistent');
    expectAt(issue, text, 'm_b_x1: 0.9', 'samples[0].errors.correlations');
  });

  it('reports a missing required key and a model parameter the dark energy needs, at the start of their mapping', () => {
    const text = editSurvey('  wa: 0.2\n', '').replace('  sigma_int: 0.1\n', '');
    const issues = errorsOf(text);
    expect(issues.map((issue) => issue.path).sort()).toEqual(['truth.sigma_int', 'truth.wa']);
    expect(issues.every((issue) => issue.code === 'config.missing_key' && issue.line === lineOf(text, 'dark_energy: cpl'))).toBe(true);
  });

  it('collects every problem at once, in file order', () => {
    const text = editSurvey('    count: 40', '    count: -3').replace('  omega_m: 0.3', '  omega_m: high').replace('shape: volume', 'shape: volum');
    const issues = errorsOf(text);
    expect(issues.map((issue) => issue.path)).toEqual(['truth.omega_m', 'samples[0].count', 'samples[0].redshift.shape']);
    expect(issues[2].fix).toBe('did you mean "volume"?');
  });
});
