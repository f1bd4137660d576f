import { describe, expect, it } from 'vitest';
import { mockTruthJson, mockTruthValues, type MockSurveyFacts } from '../../../src/output/index.js';

// The reader must give back the numbers mockTruthJson writes under "truth" (docs/simulate.md layout).
const FACTS: MockSurveyFacts = {
  version: '0.0.0-test', surveyFile: 'survey.yaml', title: 'test survey', seed: 5,
  truth: { darkEnergy: 'cpl', curvature: 'free', omegaMatter: 0.31, omegaDarkEnergy: 0.68, w0: -0.95, wa: 0.15, h0KmPerSPerMpc: 70, alpha: 0.14, beta: 3.1, absMagMag: -19.3, massStepMag: 0.06, splitLogMass: 10, sigmaIntMag: 0.1 },
  scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, redshiftDriftMag: 0 },
  analysisSystematics: { hostMassSplitDex: 0, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 },
  samples: [],
  drawnSystematics: { calibrationOffsetMag: { nearby: 0.01 }, redshiftDriftMag: 0 },
};

describe('mockTruthValues', () => {
  it('gives the true parameter values mockTruthJson wrote, by parameter name, without the words beside them', () => {
    expect(mockTruthValues(mockTruthJson(FACTS, {}))).toEqual({
      omega_m: 0.31, omega_de: 0.68, w0: -0.95, wa: 0.15, h0: 70, alpha: 0.14, beta: 3.1, abs_mag: -19.3, mass_step: 0.06, split_log_mass: 10, sigma_int: 0.1,
    });
  });

  it('leaves out values that are not finite numbers, and gives nothing without a truth block', () => {
    expect(mockTruthValues('{"truth":{"omega_m":0.3,"w0":"x","wa":null,"h0":1e999}}')).toEqual({ omega_m: 0.3 });
    expect(mockTruthValues('{"about":"no truth here"}')).toEqual({});
  });

  it('throws for text that is not JSON or not a JSON object', () => {
    expect(() => mockTruthValues('{"truth": ')).toThrow(SyntaxError);
    expect(() => mockTruthValues('null')).toThrow('no JSON object');
    expect(() => mockTruthValues('[1, 2]')).toThrow('no JSON object');
  });
});
