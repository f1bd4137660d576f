import { existsSync, readFileSync, rmSync, unlinkSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { loadConfigFile } from '../../config/index.js';
import { CandelaError } from '../../errors.js';
import { bestStoredDraw, blindingRunIdentity, drawsFromChainRecord, RUN_FILES, runJsonText, unsealBlindingKey, writeChainsFile, writeFileAtomic } from '../../output/index.js';
import { BLOB_FIRST_DERIVED, buildModel } from '../run/buildModel.js';
import { loadSupernovae } from '../run/loadSupernovae.js';
import { readRunRecord, type StoredRunRecord } from '../run/runFiles.js';
import { writeResolvedConfig } from '../run/writeResolvedConfig.js';
import { writeHubbleFiles } from '../report/hubbleFiles.js';
import { buildRunOutputs } from '../report/buildRunOutputs.js';
import { BLINDING_SALT_FILE, type BlindableRecord, type RunBlindingSection } from './runBlinding.js';

/** What `candela unblind` did. */
export interface UnblindOutcome {
  runDir: string;
  /** The parameters whose true values are now shown. */
  parameters: string[];
  /** When (ISO 8601, UTC), as run.json records it. */
  unblindedAt: string;
}

/**
 * `candela unblind`: the one way to see a blinded run's true values. Reads
 * the sealed key, then rewrites every output with true values from the
 * chain record (chain-record.bin): chains.csv (with the derived
 * quantities), the Hubble-diagram and probe files (the model is rebuilt from
 * config.resolved.yaml and its data), run.json (true best fit; `blinding`
 * says when it was unblinded and which offsets were applied), the stored
 * configuration without its blinding block, and every summary, table and
 * figure (buildRunOutputs). The folder is then what an unblinded fit of the
 * same configuration and seed writes, byte for byte, except run.json's
 * `blinding` section (and the wall time, which differs between any two runs).
 * The key file is removed last, and with it the salt the models of a
 * configuration share (BLINDING_SALT_FILE), which is no secret any more.
 * Cost: a model rebuild (the data read and the likelihood set up) plus buildRunOutputs.
 * @param runDir a run folder written by a blinded `candela fit`.
 * @param now the time to record (default the clock).
 * @returns what was unblinded.
 * @throws CandelaError `run.no_record`; `blinding.not_blinded` (never blinded, with the fix), `blinding.already_unblinded` (with its time);
 *   `blinding.missing_key`, `blinding.damaged_key`, `blinding.foreign_key`; the errors of loadConfigFile,
 *   loadSupernovae, buildModel and drawsFromChainRecord.
 * @example unblindRun('out/demo-blinded').parameters // ['omega_m', 'w0', 'wa']
 */
export function unblindRun(runDir: string, now: Date = new Date()): UnblindOutcome {
  const record = readRunRecord<StoredRunRecord & BlindableRecord>(runDir);
  const section = record.blinding;
  const runJson = join(runDir, RUN_FILES.run);
  if (!section) {
    throw new CandelaError({ code: 'blinding.not_blinded', file: runJson, message: 'this run was not blinded: its outputs already show the true values', fix: 'nothing to do; add a blinding block to the configuration to blind a new fit' });
  }
  if (section.state !== 'blinded') {
    throw new CandelaError({ code: 'blinding.already_unblinded', file: runJson, message: `this run was unblinded at ${section.unblinded_at}: its outputs show the true values`, fix: 'nothing to do; candela report rebuilds the outputs' });
  }
  const keyPath = join(runDir, section.key_file);
  if (!existsSync(keyPath)) {
    throw new CandelaError({ code: 'blinding.missing_key', file: keyPath, message: 'the sealed key of this blinded run is missing: the run cannot be unblinded', fix: 'restore blinding.key from a backup of the run folder, or refit without blinding' });
  }
  const key = unsealBlindingKey(readFileSync(keyPath, 'utf8'), keyPath, blindingRunIdentity(record.run.seed, record.model.label, section.parameters));
  const config = loadConfigFile(join(runDir, RUN_FILES.resolvedConfig));
  const modelIndex = config.models.findIndex((model) => model.label === record.model.label);
  const model = buildModel(config, modelIndex, loadSupernovae(config));
  const { steps, walkers, ensembles: ensembleCount } = record.run;
  const shape = { ensembles: ensembleCount, walkers, dimension: record.parameters.sampled.length, blobCount: BLOB_FIRST_DERIVED + record.parameters.derived.length };
  const ensembles = drawsFromChainRecord(runDir, shape, steps);
  const burnInSteps = record.run.burn_in_steps;
  const names = record.parameters.sampled.map((entry) => entry.name);
  const selection = record.chains_csv;
  writeChainsFile(join(runDir, RUN_FILES.chains), { parameters: names, derived: record.parameters.derived }, ensembles, burnInSteps, undefined, selection);
  const { theta } = bestStoredDraw(ensembles, burnInSteps); // the fit's search: its best fit bit for bit
  writeHubbleFiles(runDir, model, ensembles, burnInSteps, theta, record.run.seed);
  const trueBest = Object.fromEntries(names.map((name, d) => [name, theta[d]]));
  const restored = { ...record.best_fit.parameters };
  for (const name of section.parameters) restored[name] = trueBest[name];
  let absMag = record.best_fit.abs_mag;
  if (section.parameters.includes('abs_mag')) {
    const values = model.posterior.values(theta);
    const extras = model.supernovae?.bestFitExtras?.(values) ?? {};
    absMag = Number.isFinite(extras.abs_mag_best_fit) ? (extras.abs_mag_best_fit as number) : (values.abs_mag ?? null);
  }
  const { blinding: _configured, ...configuration } = record.configuration as Record<string, unknown>;
  const unblindedAt = now.toISOString();
  const blinding: RunBlindingSection = { ...section, state: 'unblinded', unblinded_at: unblindedAt, offsets: { ...key.offsets } };
  const { blinding: _section, ...rest } = record;
  writeFileAtomic(runJson, runJsonText({ ...rest, best_fit: { ...record.best_fit, parameters: restored, abs_mag: absMag }, configuration, blinding }));
  // The copy without its blinding block, still naming the file the fit read (run.json's first input).
  const fitSource = record.inputs[0]?.path ?? config.source.file.written;
  writeResolvedConfig(runDir, { ...config, blinding: null, source: { ...config.source, file: { ...config.source.file, written: fitSource } } });
  buildRunOutputs([runDir], runDir);
  unlinkSync(keyPath);
  // The models of the configuration share their offsets: once one is unblinded, their shared salt is no secret; a new fit draws another.
  if (config.models.length > 1) rmSync(join(dirname(runDir), BLINDING_SALT_FILE), { force: true });
  return { runDir, parameters: [...section.parameters], unblindedAt };
}
