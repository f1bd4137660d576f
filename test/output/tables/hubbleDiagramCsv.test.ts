import { describe, expect, it } from 'vitest';
import { hubbleDiagramCsv } from '../../../src/output/index.js';

const diagram = {
  ids: ['sn2011fe', 'bin,7'],
  redshift: Float64Array.of(0.0008, 0.5),
  distanceModulusMag: Float64Array.of(29.04, 42.27),
  distanceModulusErrorMag: Float64Array.of(0.05, 0.1),
  modelDistanceModulusMag: Float64Array.of(29.1, 42.3),
  residualMag: Float64Array.of(-0.06, -0.03),
  isCalibrator: [true, false],
};

describe('hubbleDiagramCsv', () => {
  it('writes one row per supernova under the header, numbers at full double precision, calibrator as 1 or 0', () => {
    const lines = hubbleDiagramCsv(diagram, ['nearby', 'deep']).split('\n');
    expect(lines[0]).toBe('id,sample,z,mu_obs,sigma_mu,mu_model,residual,calibrator');
    expect(lines[1]).toBe('sn2011fe,nearby,0.0008,29.04,0.05,29.1,-0.06,1');
    expect(lines.at(-1)).toBe('');
  });

  it('quotes a field with a comma (RFC 4180)', () => {
    expect(hubbleDiagramCsv(diagram, ['nearby', 'deep']).split('\n')[2]).toBe('"bin,7",deep,0.5,42.27,0.1,42.3,-0.03,0');
  });

  it('leaves non-finite numbers empty (how a blinded run hides mu_obs and mu_model, docs/blinding.md)', () => {
    const hidden = Float64Array.of(Number.NaN, Number.NaN);
    const csv = hubbleDiagramCsv({ ...diagram, distanceModulusMag: hidden, modelDistanceModulusMag: hidden }, ['nearby', 'deep']);
    expect(csv.split('\n')[1]).toBe('sn2011fe,nearby,0.0008,,0.05,,-0.06,1');
  });
});
