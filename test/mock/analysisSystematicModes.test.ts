import { describe, expect, it } from 'vitest';
import { analysisSystematicModes } from '../../src/mock/analysisSystematicModes.js';

const INPUT = { redshift: Float64Array.of(0.02, 0.05, 0.5), hostLogMass: Float64Array.of(10.1, 9.5, 10.3), massStepMag: 0.06, splitLogMass: 10 };

describe('analysisSystematicModes', () => {
  it('moves the hosts just above the split by minus the step (they change class)', () => {
    const modes = analysisSystematicModes(INPUT, { hostMassSplitDex: 0.25, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 });
    expect(modes.names).toEqual(['host_mass_split']);
    expect(Array.from(modes.values)).toEqual([-0.06, 0, 0]);
  });

  it('gives a coherent velocity of 100 km/s the shift (5 / ln 10)(v / c) / z below the redshift limit', () => {
    const modes = analysisSystematicModes(INPUT, { hostMassSplitDex: 0, coherentVelocityKmPerS: 100, coherentVelocityMaxRedshift: 0.1 });
    // By hand: 5 / ln 10 = 2.1715, v / c = 100 / 299792.458; at z = 0.02: 0.036216 mag, at z = 0.05: 0.014486 mag.
    expect(modes.values[0]).toBeCloseTo(0.036216, 5);
    expect(modes.values[1]).toBeCloseTo(0.014486, 5);
    expect(modes.values[2]).toBe(0);
  });

  it('places both modes side by side, split first, and none when both are off', () => {
    const both = analysisSystematicModes(INPUT, { hostMassSplitDex: 0.25, coherentVelocityKmPerS: 100, coherentVelocityMaxRedshift: 0.1 });
    expect(both.names).toEqual(['host_mass_split', 'coherent_velocity']);
    expect(both.values.length).toBe(6);
    expect(both.values[0]).toBe(-0.06);
    expect(analysisSystematicModes(INPUT, { hostMassSplitDex: 0, coherentVelocityKmPerS: 0, coherentVelocityMaxRedshift: 0.1 }).names).toEqual([]);
  });
});
