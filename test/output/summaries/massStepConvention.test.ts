// The host-mass step's sign, as the tables state it, agrees with the standardization code.
import { describe, expect, it } from 'vitest';
import type { SupernovaTable } from '../../../src/data/index.js';
import type { ParameterSummary } from '../../../src/output/index.js';
import { massStepConvention } from '../../../src/output/summaries/massStepConvention.js';
import { trippCorrectedMagnitudes } from '../../../src/standardize/index.js';

/** Two supernovae at one redshift with the same stretch and colour, one host on each side of 10^10 M_sun; the high-mass one brighter by `brighterMag`. */
function pair(brighterMag: number): SupernovaTable {
  const count = 2;
  return {
    kind: 'light_curves', count, ids: ['low', 'high'], samples: ['all', 'all'], sampleNames: ['all'], sampleIndex: new Int32Array(count),
    redshift: Float64Array.of(0.1, 0.1), redshiftHelio: Float64Array.of(0.1, 0.1), redshiftErr: new Float64Array(count),
    peakMag: Float64Array.of(19, 19 - brighterMag), peakMagErr: Float64Array.of(0.1, 0.1),
    stretch: new Float64Array(count), stretchErr: Float64Array.of(0.1, 0.1), color: new Float64Array(count), colorErr: Float64Array.of(0.02, 0.02),
    covPeakMagStretch: new Float64Array(count), covPeakMagColor: new Float64Array(count), covStretchColor: new Float64Array(count),
    hostLogMass: Float64Array.of(9.5, 10.5), biasCorrectionMag: new Float64Array(count), sourceLine: Int32Array.of(2, 3), sourceFile: 'pair',
  };
}

describe('massStepConvention', () => {
  it('says a positive step means brighter supernovae above the split, which is what a positive step corrects', () => {
    const rows = [{ name: 'mass_step' }, { name: 'mass_step_deep' }, { name: 'alpha' }] as ParameterSummary[];
    massStepConvention(rows, 10);
    expect(rows.map((row) => row.note)).toEqual(['> 0: hosts above 10^10 M_sun brighter', '> 0: hosts above 10^10 M_sun brighter', undefined]);
    // Supernovae in massive hosts brighter by 0.06 mag are standardized to the same magnitude by a step of +0.06.
    const step = { enabled: true, splitLogMass: 10, shape: 'sharp' as const, widthDex: 0 };
    const corrected = trippCorrectedMagnitudes(pair(0.06), { alpha: 0.14, beta: 3.1, massStepMag: 0.06 }, step, new Float64Array(2));
    expect(corrected[1] - corrected[0]).toBeCloseTo(0, 12);
    const wrongSign = trippCorrectedMagnitudes(pair(0.06), { alpha: 0.14, beta: 3.1, massStepMag: -0.06 }, step, new Float64Array(2));
    expect(Math.abs(wrongSign[1] - wrongSign[0])).toBeCloseTo(0.12, 12);
  });
});
