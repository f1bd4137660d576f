import { describe, expect, it } from 'vitest';
import type { SupernovaTable } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';
import { createHubbleFlowModuli } from '../../src/likelihood/hubbleFlowModuli.js';

const C_KM_PER_S = 299792.458;

function table(redshift: number[], calibratorMu?: number[]): SupernovaTable {
  const n = redshift.length;
  return {
    kind: 'magnitudes', count: n, ids: redshift.map((_, i) => `sn${i}`), samples: new Array(n).fill('a'), sampleNames: ['a'], sampleIndex: new Int32Array(n),
    redshift: Float64Array.from(redshift), redshiftHelio: Float64Array.from(redshift), redshiftErr: new Float64Array(n),
    magnitude: new Float64Array(n), magnitudeErr: new Float64Array(n).fill(0.1),
    ...(calibratorMu ? { calibratorMu: Float64Array.from(calibratorMu) } : {}),
    sourceLine: Int32Array.from(redshift, (_, i) => i + 2), sourceFile: 'test.csv',
  };
}

const family = { darkEnergy: 'lambda' as const, flat: true, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 };

describe('createHubbleFlowModuli', () => {
  it('gives the Einstein-de Sitter distance modulus in closed form and the external modulus of a calibrator', () => {
    // Flat, Omega_m = 1: D_M = (2c/H0) (1 - 1/sqrt(1+z)) (Weinberg 1972, closed form); mu = 5 log10[(1+z) D_M / Mpc] + 25.
    const z = [1.0, 0.1, 0.5, 0.02];
    const model = createHubbleFlowModuli(table(z, [NaN, NaN, NaN, 34.7]), family, { omegaDarkEnergy: false, w0: false, wa: false, h0: true });
    const out = new Float64Array(4);
    expect(model.moduli({ omega_m: 1, h0: 67 }, out)).toBeNull();
    for (const i of [0, 1, 2]) {
      const distanceMpc = (2 * C_KM_PER_S / 67) * (1 - 1 / Math.sqrt(1 + z[i]));
      expect(out[i]).toBeCloseTo(5 * Math.log10((1 + z[i]) * distanceMpc) + 25, 9);
    }
    expect(out[3]).toBe(34.7);
    expect(Array.from(model.flowRows)).toEqual([1, 2, 0]); // sorted by redshift, calibrator left out
  });

  it('uses the nominal 70 km/s/Mpc when it does not read h0, and rejects a non-positive h0 with a reason', () => {
    const model = createHubbleFlowModuli(table([0.5]), family, { omegaDarkEnergy: false, w0: false, wa: false, h0: false });
    expect(model.h0At({ omega_m: 0.3, h0: 55 })).toBe(70);
    const reading = createHubbleFlowModuli(table([0.5]), family, { omegaDarkEnergy: false, w0: false, wa: false, h0: true });
    expect(reading.moduli({ omega_m: 0.3, h0: -1 }, new Float64Array(1))).toMatch(/h0/);
  });

  it('names the file and line of a Hubble-flow row with z <= 0', () => {
    try {
      createHubbleFlowModuli(table([0.3, -0.01]), family, { omegaDarkEnergy: false, w0: false, wa: false, h0: false });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0]).toMatchObject({ code: 'likelihood.bad_redshift', file: 'test.csv', line: 3 });
    }
  });
});
