// The survey description's analysis systematics and named-modes file (docs/simulate.md).
import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_SYSTEMATICS, surveyFromText } from '../../src/config/index.js';
import { SMALL_SURVEY } from '../pipeline/support/simulateSurveyText.js';

function withTopLevel(block: string): string {
  return SMALL_SURVEY.replace('\nsamples:', `\n${block}\nsamples:`);
}

describe('surveyFromText: analysis_systematics and output.named_modes', () => {
  it('are off by default (no analysis mode, no named-modes file)', () => {
    const result = surveyFromText(SMALL_SURVEY, 'survey.yaml');
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.value.analysisSystematics).toEqual(DEFAULT_ANALYSIS_SYSTEMATICS);
    expect(result.value.analysisSystematics).toEqual({ hostMassSplitDex: 0, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 });
    expect(result.value.output.namedModes).toBeNull();
  });

  it('read the split, the coherent velocity and its limit', () => {
    const text = withTopLevel('analysis_systematics: { host_mass_split_dex: 0.2, coherent_velocity_km_s: 100, coherent_velocity_max_redshift: 0.08 }');
    const result = surveyFromText(text, 'survey.yaml');
    expect(result.ok && result.value.analysisSystematics).toEqual({ hostMassSplitDex: 0.2, coherentVelocityKmPerS: 100, coherentVelocityMaxRedshift: 0.08 });
  });

  it('refuse a velocity given in m/s and an unknown key, with a fix', () => {
    const result = surveyFromText(withTopLevel('analysis_systematics: { coherent_velocity_km_s: 100000, host_mass_splt_dex: 0.2 }'), 'survey.yaml');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const codes = result.issues.map((issue) => `${issue.path}: ${issue.fix}`);
    expect(codes.some((line) => line.startsWith('analysis_systematics.coherent_velocity_km_s: give the velocity in km/s'))).toBe(true);
    expect(codes.some((line) => line.includes('host_mass_split_dex'))).toBe(true);
  });

  it('read a named-modes file name and refuse one that repeats another output file', () => {
    const named = surveyFromText(SMALL_SURVEY.replace(/\noutput:\n/, '\noutput:\n  named_modes: modes.csv\n'), 'survey.yaml');
    expect(named.ok && named.value.output.namedModes).toBe('modes.csv');
    const clash = surveyFromText(SMALL_SURVEY.replace(/\noutput:\n/, '\noutput:\n  named_modes: truth.json\n'), 'survey.yaml');
    expect(clash.ok).toBe(false);
  });
});
