import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { essErrorInflation } from '../../src/diagnostics/index.js';
import { sampleVarianceOf } from '../../src/math/index.js';
import { isCandelaError } from '../../src/errors.js';
import { DIAGNOSTICS_REFERENCE_DIR, readChainColumns, readRecords } from './readReferenceChains.js';

// Source: ../shared/reference/diagnostics/reference.csv (R package posterior 1.4.0, Vehtari et al. 2021):
// mcse_mean = sd / sqrt(ess_mean). The independent-draw error sd / sqrt(N) times essErrorInflation(N, ess_mean)
// must give it back. Tolerance 1e-9 relative: the reference is printed to 12 significant digits
// (as in posteriorReference.test.ts).
const RELATIVE_TOLERANCE = 1e-9;
const reference = readRecords(join(DIAGNOSTICS_REFERENCE_DIR, 'reference.csv'));

describe('essErrorInflation', () => {
  it.each(['iid_normal', 'ar1_phi0.9', 'ar1_phi0.99'])('turns the independent-draw error into the reference MCSE of the mean (%s)', (name) => {
    const row = reference.find((record) => record.case === name)!;
    const draws = Float64Array.from(readChainColumns(join(DIAGNOSTICS_REFERENCE_DIR, `chains_${name}.csv`)).flatMap((chain) => Array.from(chain)));
    const independentError = Math.sqrt(sampleVarianceOf(draws) / draws.length);
    const inflated = independentError * essErrorInflation(draws.length, Number(row.ess_mean));
    expect(Math.abs(inflated / Number(row.mcse_mean) - 1)).toBeLessThan(RELATIVE_TOLERANCE);
  });

  it('is sqrt(draws / ESS): 4000 draws worth 1000 double the error', () => {
    expect(essErrorInflation(4000, 1000)).toBe(2);
  });

  it('never falls below 1 (fewer draws than the ESS count as independent; common practice)', () => {
    expect(essErrorInflation(500, 2000)).toBe(1);
    expect(essErrorInflation(1000, 1000)).toBe(1);
  });

  it('rejects counts that are not positive finite numbers, naming the count', () => {
    for (const [draws, ess, named] of [[0, 100, 'draw count'], [100, 0, 'effective sample size'], [100, Number.NaN, 'effective sample size'], [Infinity, 100, 'draw count']] as const) {
      try {
        essErrorInflation(draws, ess);
        expect.unreachable(`${draws}, ${ess}`);
      } catch (error) {
        expect(isCandelaError(error) && error.issues[0].code).toBe('diagnostics.bad_effective_sample_size');
        expect((error as Error).message).toContain(named);
      }
    }
  });
});
