/**
 * What run.json records about blinding, and the questions every command
 * asks of it: is this run blinded, which parameters, where is the key.
 */
import type { RunRecord } from '../run/runRecord.js';

/** The sealed key's file name in a blinded run folder (output/blinding/sealedKey.ts). */
export const BLINDING_KEY_FILE = 'blinding.key';

/**
 * The sealed salt the models of one configuration share, in the folder that
 * holds their run folders (configurations with several models only; removed
 * when one of them is unblinded, since their offsets are then known).
 */
export const BLINDING_SALT_FILE = 'blinding-salt.key';

/**
 * What a blinded run withholds (they would show the truth whatever the
 * offsets): every derived quantity, the model columns of the Hubble diagram
 * and its model curve, and the probes' data-versus-model files.
 */
export const WITHHELD_WHILE_BLINDED = [
  'derived quantities (computed from the true parameters)',
  'hubble_model.csv and the Hubble-diagram figure (the model curve at the true best fit)',
  'mu_obs and mu_model of hubble_diagram.csv (their difference is the residual; the model is the true best fit)',
  'the probes\' data-versus-model files and figures',
] as const;

/** run.json's `blinding` section (present only in runs configured with a blinding block). */
export interface RunBlindingSection {
  /** `blinded` until `candela unblind`, then `unblinded`. */
  state: 'blinded' | 'unblinded';
  /** The blinded parameters: those of `blinding.parameters` this model samples, in its order. */
  parameters: string[];
  /** Width each offset was drawn with, in the parameter's unit. */
  offset_widths: Record<string, number>;
  /** The sealed key, relative to the run folder (removed on unblinding). */
  key_file: string;
  /** What the blinded outputs leave out. */
  withheld: string[];
  /** When `candela unblind` showed the true values (ISO 8601, UTC); null while blinded. */
  unblinded_at: string | null;
  /** The offsets that were applied, written on unblinding (no longer secret). */
  offsets?: Record<string, number>;
}

/** A run record that may carry a blinding section. */
export type BlindableRecord = RunRecord & { blinding?: RunBlindingSection };

/**
 * The parameters a run's outputs show blinded: the section's list while its
 * state is `blinded`, else none.
 * Cost: O(1).
 * @param record run.json as read back.
 * @returns the blinded parameter names (empty for an unblinded or never blinded run).
 * @throws nothing.
 * @example blindedParametersOf(readRecord('out/demo-blinded')) // ['omega_m', 'w0', 'wa']
 */
export function blindedParametersOf(record: { blinding?: RunBlindingSection }): string[] {
  return record.blinding?.state === 'blinded' ? [...record.blinding.parameters] : [];
}
