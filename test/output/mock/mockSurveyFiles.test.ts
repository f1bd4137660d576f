import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { mockSurveyFiles } from '../../../src/output/index.js';
import type { MockSurveyFilesInput } from '../../../src/output/index.js';

const INPUT: MockSurveyFilesInput = {
  version: '0.0.0-test', surveyFile: 'survey.yaml', title: 'test survey', seed: 5,
  truth: { darkEnergy: 'lambda', curvature: 'flat', omegaMatter: 0.3, omegaDarkEnergy: null, w0: -1, wa: 0, h0KmPerSPerMpc: 70, alpha: 0.14, beta: 3.1, absMagMag: -19.3, massStepMag: 0.06, splitLogMass: 10, sigmaIntMag: 0.1 },
  scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, redshiftDriftMag: 0 },
  analysisSystematics: { hostMassSplitDex: 0, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 },
  samples: [],
  drawnSystematics: { calibrationOffsetMag: {}, redshiftDriftMag: 0 },
  table: { count: 1, ids: ['a'], samples: ['s'], redshift: Float64Array.of(0.5), redshiftHelio: Float64Array.of(0.5) },
  fileNames: { table: 't.csv', covariance: 'c.txt', namedModes: null },
  systematics: null,
  namedModes: null,
};
const sha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

describe('mockSurveyFiles', () => {
  it('records the SHA-256 (FIPS 180-4) of the table it wrote, and no systematics file when there is none', () => {
    const files = mockSurveyFiles(INPUT);
    const truth = JSON.parse(files.truth);
    expect(truth.files.table).toEqual({ name: 't.csv', rows: 1, columns: files.table.split('\n')[0].split(','), sha256: sha256(files.table) });
    expect(files.covariance).toBeNull();
    expect(truth.files.covariance).toBeNull();
    expect(truth.analysis_systematics).toBeUndefined();
    expect(truth.truth).toEqual({ dark_energy: 'lambda', curvature: 'flat', omega_m: 0.3, w0: -1, wa: 0, h0: 70, alpha: 0.14, beta: 3.1, abs_mag: -19.3, mass_step: 0.06, split_log_mass: 10, sigma_int: 0.1 });
  });

  it('records the form, size and mode names of a modes file and of the named modes', () => {
    const modes = { count: 1, modeCount: 2, values: Float64Array.of(0.01, 0.02) };
    const files = mockSurveyFiles({ ...INPUT, fileNames: { ...INPUT.fileNames, namedModes: 'n.csv' }, systematics: { form: 'modes', modes, names: ['u', 'v'] }, namedModes: { modes, names: ['u', 'v'] } });
    const truth = JSON.parse(files.truth);
    expect(truth.files.covariance).toEqual({ name: 'c.txt', form: 'modes', size: [1, 2], columns: ['u', 'v'], sha256: sha256(files.covariance as string) });
    expect(truth.files.named_modes).toEqual({ name: 'n.csv', form: 'modes', size: [1, 2], columns: ['u', 'v'], sha256: sha256(files.namedModes as string) });
  });
});
