/**
 * Synthetic run folders with a chain record of any length, in the layout of
 * a real run (for `candela report` at scale, in the benchmark and in tests).
 * The template is a run folder written by `candela fit`: its run.json,
 * resolved configuration, Hubble files, chains.csv and the 32-byte header of
 * its chain-record.bin are copied; run.json is given the new step count
 * (burn-in a tenth) and marks chains.csv as thinned, so that the summaries
 * read the record.
 *
 * Every walker's values follow an AR(1) process (coefficient 0.9, uniform
 * innovations, stationary sd about 1) around the template's best fit, each
 * parameter scaled by 0.02 x max(0.1, |best fit|) so that it stays inside
 * its prior, and stay put on a refused move: a walker moves on steps 1, 4
 * and 8 of every 10 (ACCEPTED_STEPS_MOD_10), so its acceptance is known
 * exactly. Written a block of steps at a time; nothing holds the file.
 */
import { closeSync, copyFileSync, mkdirSync, openSync, readFileSync, writeFileSync, writeSync } from 'node:fs';
import { join } from 'node:path';

/** Steps (mod 10) on which every synthetic walker moves. */
export const ACCEPTED_STEPS_MOD_10 = [1, 4, 8];
/** Steps generated per write. */
const BLOCK_STEPS = 4096;

/** Bytes of one step of the template's chain record (every ensemble and walker). */
export function recordStepBytesOf(templateDir: string): number {
  const header = readFileSync(join(templateDir, 'chain-record.bin')).subarray(0, 32);
  const [ensembles, walkers, dimension, blobCount] = [0, 1, 2, 3].map((k) => header.readUInt32LE(8 + 4 * k));
  return ensembles * walkers * (dimension + 1 + blobCount) * 8;
}

/**
 * Writes `dir` as a copy of the run folder `templateDir` whose chain record
 * holds `steps` synthetic steps.
 * @param templateDir a run folder written by `candela fit` (ensemble sampler).
 * @param dir the folder to write (created).
 * @param steps steps per walker.
 * @param chainMemoryMb written as the stored configuration's output.chain_memory_mb; null leaves the reader's default.
 */
export function writeSyntheticRecordRun(templateDir: string, dir: string, steps: number, chainMemoryMb: number | null): void {
  mkdirSync(dir, { recursive: true });
  const record = JSON.parse(readFileSync(join(templateDir, 'run.json'), 'utf8'));
  record.run.steps = steps;
  record.run.burn_in_steps = Math.floor(steps / 10);
  record.chains_csv = { keep: 'after_burn_in', first_step: record.run.burn_in_steps, every_steps: 1000, steps: 1 };
  if (chainMemoryMb === null) delete record.configuration.output.chain_memory_mb;
  else record.configuration.output.chain_memory_mb = chainMemoryMb;
  writeFileSync(join(dir, 'run.json'), JSON.stringify(record));
  for (const file of ['config.resolved.yaml', 'hubble_diagram.csv', 'hubble_model.csv', 'chains.csv']) copyFileSync(join(templateDir, file), join(dir, file));
  const header = readFileSync(join(templateDir, 'chain-record.bin')).subarray(0, 32);
  const [ensembles, walkers, dimension, blobCount] = [0, 1, 2, 3].map((k) => header.readUInt32LE(8 + 4 * k));
  const perWalker = dimension + 1 + blobCount;
  const centres = (record.parameters.sampled as Array<{ name: string }>).map((entry) => Number(record.best_fit.parameters[entry.name]));
  const widths = centres.map((centre) => 0.02 * Math.max(0.1, Math.abs(centre)));
  const state = new Float64Array(ensembles * walkers * perWalker);
  let seed = 987654321;
  // xorshift32 (Marsaglia 2003): reproducible, no dependency.
  const uniform = () => { seed ^= seed << 13; seed >>>= 0; seed ^= seed >>> 17; seed ^= seed << 5; seed >>>= 0; return seed / 4294967296; };
  const descriptor = openSync(join(dir, 'chain-record.bin'), 'w');
  try {
    writeSync(descriptor, header);
    const block = new Float64Array(BLOCK_STEPS * ensembles * walkers * perWalker);
    for (let from = 0; from < steps; from += BLOCK_STEPS) {
      const count = Math.min(BLOCK_STEPS, steps - from);
      for (let s = 0; s < count; s++) {
        const moved = from + s === 0 || ACCEPTED_STEPS_MOD_10.includes((from + s) % 10);
        for (let k = 0; k < ensembles; k++) {
          const base = (s * ensembles + k) * walkers * perWalker;
          for (let w = 0; w < walkers; w++) {
            const slot = (k * walkers + w) * perWalker;
            if (moved) for (let d = 0; d < perWalker; d++) state[slot + d] = 0.9 * state[slot + d] + 0.75 * (2 * uniform() - 1);
            for (let d = 0; d < dimension; d++) block[base + w * dimension + d] = centres[d] + widths[d] * state[slot + d];
            block[base + walkers * dimension + w] = -10 + state[slot + dimension];
            for (let b = 0; b < blobCount; b++) block[base + walkers * (dimension + 1) + w * blobCount + b] = -5 + state[slot + dimension + 1 + b];
          }
        }
      }
      writeSync(descriptor, Buffer.from(block.buffer, 0, count * ensembles * walkers * perWalker * 8));
    }
  } finally {
    closeSync(descriptor);
  }
}

/** The exact acceptance fraction of every synthetic walker over `steps` steps (moves on steps 1 .. steps - 1). */
export function syntheticAcceptance(steps: number): number {
  let moves = 0;
  for (let s = 1; s < steps; s++) if (ACCEPTED_STEPS_MOD_10.includes(s % 10)) moves++;
  return moves / (steps - 1);
}
