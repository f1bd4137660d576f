import { blindValues } from '../../output/index.js';
import type { RunRecord } from '../run/runRecord.js';
import type { RunBlinding } from './prepareRunBlinding.js';
import { BLINDING_KEY_FILE, WITHHELD_WHILE_BLINDED, type RunBlindingSection } from './runBlinding.js';

/**
 * run.json of a blinded run: the true record with the best-fit values of
 * the blinded parameters shown as true value + offset (abs_mag's too when it
 * is blinded), and a `blinding` section appended last. Every other number
 * (chi-square, log likelihood, counts) is kept: none is a parameter value.
 * Cost: O(parameters).
 * @param record the record as an unblinded run writes it.
 * @param blinding the run's blinding.
 * @returns the record to write.
 * @throws nothing.
 * @example blindRunRecord(record, blinding).blinding.state // 'blinded'
 */
export function blindRunRecord<T extends RunRecord>(record: T, blinding: RunBlinding): T & { blinding: RunBlindingSection } {
  const absMag = record.best_fit.abs_mag;
  return {
    ...record,
    best_fit: {
      ...record.best_fit,
      parameters: blindValues(record.best_fit.parameters, blinding.offsets),
      abs_mag: absMag !== null && blinding.offsets.abs_mag !== undefined ? absMag + blinding.offsets.abs_mag : absMag,
    },
    blinding: {
      state: 'blinded', parameters: [...blinding.parameters], offset_widths: { ...blinding.widths }, key_file: BLINDING_KEY_FILE,
      withheld: [...WITHHELD_WHILE_BLINDED], unblinded_at: null,
    },
  };
}
