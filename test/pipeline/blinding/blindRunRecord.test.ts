import { describe, expect, it } from 'vitest';
import { blindRunRecord } from '../../../src/pipeline/blinding/blindRunRecord.js';
import type { RunRecord } from '../../../src/pipeline/run/runRecord.js';

const record = {
  title: 't', best_fit: { parameters: { omega_m: 0.3, w0: -1, alpha: 0.14 }, chi_square: 40.5, abs_mag: -19.3, n_data: 40 },
} as unknown as RunRecord;

describe('blindRunRecord', () => {
  it('shifts the best-fit values of the blinded parameters only, keeps every other number, and appends the blinding section', () => {
    const blinded = blindRunRecord(record, { parameters: ['omega_m', 'w0'], offsets: { omega_m: 0.05, w0: -0.2 }, widths: { omega_m: 0.1, w0: 0.3 } });
    expect(blinded.best_fit.parameters).toEqual({ omega_m: 0.3 + 0.05, w0: -1.2, alpha: 0.14 });
    expect(blinded.best_fit.chi_square).toBe(40.5);
    expect(blinded.best_fit.abs_mag).toBe(-19.3);
    expect(Object.keys(blinded).at(-1)).toBe('blinding');
    expect(blinded.blinding).toMatchObject({ state: 'blinded', parameters: ['omega_m', 'w0'], offset_widths: { omega_m: 0.1, w0: 0.3 }, key_file: 'blinding.key', unblinded_at: null });
    expect(record.best_fit.parameters.w0).toBe(-1);
  });

  it('shifts the best-fit absolute magnitude when abs_mag is blinded', () => {
    expect(blindRunRecord(record, { parameters: ['abs_mag'], offsets: { abs_mag: 0.1 }, widths: { abs_mag: 0.2 } }).best_fit.abs_mag).toBeCloseTo(-19.2, 12);
  });
});
