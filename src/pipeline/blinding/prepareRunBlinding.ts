import { randomBytes } from 'node:crypto';
import { existsSync, linkSync, readFileSync, unlinkSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import type { CandelaConfig } from '../../config/index.js';
import { createRandomStream, deriveSeed } from '../../math/index.js';
import { blindingRunIdentity, drawBlindingOffsets, sealBlindingKey, unsealBlindingKey, writeFileAtomic } from '../../output/index.js';
import { BLINDING_KEY_FILE, BLINDING_SALT_FILE } from './runBlinding.js';

/** The blinding of one model's run: which parameters, their secret offsets and widths. */
export interface RunBlinding {
  parameters: string[];
  offsets: Record<string, number>;
  widths: Record<string, number>;
}

/** Bytes of the random salt (128 bits: no one guesses it, so the offsets cannot be recomputed from seed and configuration). */
const SALT_BYTES = 16;

/**
 * Decides what one model's run blinds and holds its secret offsets: the
 * parameters of `blinding.parameters` that the model samples (a fixed one
 * is not blinded: its value is in the configuration). The offsets of every
 * listed parameter are drawn, in the listed order, from the seeded stream
 * deriveSeed(seed, 'blinding', salt), the salt being 128 random bits, so
 * that nobody can recompute them from the configuration; the model's are
 * sealed into the run folder's key file. The models of one configuration
 * share the salt (sealed in BLINDING_SALT_FILE beside their folders), so a
 * parameter gets the same offset in every model and their blinded
 * posteriors can be compared with each other. A run that is resumed keeps
 * the key it has.
 * Cost: one small file read or write.
 * @param config the configuration (its `blinding` block).
 * @param modelLabel the model's label.
 * @param sampled the model's sampled parameter names, in theta order.
 * @param runDir the run folder (the key goes there).
 * @param salt the salt (hex) instead of 128 random bits: only for tests, where a known salt makes the offsets repeatable.
 * @returns the blinding (null when nothing is blinded) and lines to print (never a value).
 * @throws CandelaError from unsealBlindingKey when an existing key is damaged or belongs to another run.
 * @example prepareRunBlinding(config, 'flat_w0wa', ['omega_m', 'w0', 'wa', 'abs_mag'], 'out/demo-blinded').blinding?.parameters // ['omega_m', 'w0', 'wa']
 */
export function prepareRunBlinding(config: CandelaConfig, modelLabel: string, sampled: readonly string[], runDir: string, salt?: string): { blinding: RunBlinding | null; lines: string[] } {
  if (!config.blinding) return { blinding: null, lines: [] };
  const listed = config.blinding.parameters;
  const parameters = sampled.filter((name) => listed.includes(name));
  const notSampled = listed.filter((name) => !sampled.includes(name));
  const lines = notSampled.length ? [`blinding: ${notSampled.join(', ')} ${notSampled.length === 1 ? 'is' : 'are'} not sampled by model ${modelLabel}: not blinded (a fixed value is in the configuration)`] : [];
  if (parameters.length === 0) return { blinding: null, lines: [...lines, `blinding: model ${modelLabel} samples none of ${listed.join(', ')}: its outputs are not blinded`] };
  const widths = Object.fromEntries(parameters.map((name) => [name, config.blinding!.offsetWidths[name]]));
  const identity = blindingRunIdentity(String(config.seed), modelLabel, parameters);
  const keyPath = join(runDir, BLINDING_KEY_FILE);
  if (existsSync(keyPath)) {
    const key = unsealBlindingKey(readFileSync(keyPath, 'utf8'), keyPath, identity);
    lines.push(`blinding: ${parameters.join(', ')} shown as true value + the secret offsets of ${keyPath}`);
    return { blinding: { parameters, offsets: key.offsets, widths: key.widths }, lines };
  }
  const secret = salt ?? (config.models.length > 1 ? sharedSalt(config, dirname(runDir)) : randomBytes(SALT_BYTES).toString('hex'));
  const every = drawBlindingOffsets(config.blinding.offsetWidths, createRandomStream(deriveSeed(config.seed, 'blinding', secret)));
  const offsets = Object.fromEntries(parameters.map((name) => [name, every[name]]));
  writeFileAtomic(keyPath, sealBlindingKey({ identity, offsets, widths, salt: secret }));
  lines.push(`blinding: ${parameters.join(', ')} shown as true value + secret offsets, sealed in ${keyPath}; candela unblind ${runDir} shows the true values`);
  return { blinding: { parameters, offsets, widths }, lines };
}

/**
 * The salt every model of a configuration with several models shares, kept
 * sealed in BLINDING_SALT_FILE beside their run folders. The models may start
 * at once (fitted side by side, in separate processes): the first to arrive
 * publishes its salt by a hard link (atomic; a later one finds the file
 * complete), the others read it. A file sealed for another seed or list of
 * parameters is replaced.
 */
function sharedSalt(config: CandelaConfig, baseDir: string): string {
  const path = join(baseDir, BLINDING_SALT_FILE);
  const identity = blindingRunIdentity(String(config.seed), '', config.blinding?.parameters ?? []);
  const sealed = () => sealBlindingKey({ identity, offsets: {}, widths: {}, salt: randomBytes(SALT_BYTES).toString('hex') });
  if (!existsSync(path)) {
    const temporary = `${path}.${process.pid}.tmp`;
    writeFileSync(temporary, sealed());
    try {
      linkSync(temporary, path);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
    } finally {
      unlinkSync(temporary);
    }
  }
  try {
    return unsealBlindingKey(readFileSync(path, 'utf8'), path, identity).salt;
  } catch {
    writeFileAtomic(path, sealed());
    return unsealBlindingKey(readFileSync(path, 'utf8'), path, identity).salt;
  }
}
