import { blindValues, type EnsembleDraws } from '../../output/index.js';
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

/**
 * The draws as a blinded chains.csv holds them: each blinded parameter's
 * positions plus its offset (copies; log posteriors and blobs are shared).
 * Cost: O(stored values).
 * @param ensembles the sampler's draws (true values).
 * @param parameterNames sampled names in theta order.
 * @param offsets offset per blinded parameter.
 * @returns the shown draws.
 * @throws nothing.
 * @example blindEnsembleDraws(ensembles, ['omega_m', 'w0'], { w0: 0.2 })[0].positions[1] // ensembles[0].positions[1] + 0.2
 */
export function blindEnsembleDraws(ensembles: readonly EnsembleDraws[], parameterNames: readonly string[], offsets: Readonly<Record<string, number>>): EnsembleDraws[] {
  const shifts = parameterNames.map((name) => offsets[name] ?? 0);
  return ensembles.map((draws) => {
    const positions = Float64Array.from(draws.positions);
    for (let i = 0; i < positions.length; i++) positions[i] += shifts[i % draws.dimension];
    return { ...draws, positions };
  });
}
