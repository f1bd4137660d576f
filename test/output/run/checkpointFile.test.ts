import { appendFileSync, copyFileSync, mkdirSync, rmSync, statSync, truncateSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { createRandomStream } from '../../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator } from '../../../src/sampler/index.js';
import type { SamplerSnapshot } from '../../../src/sampler/index.js';
import { encodeBinaryState } from '../../../src/output/run/binaryState.js';
import { readCheckpoint, writeCheckpoint } from '../../../src/output/run/checkpointFile.js';
import { createGaussianTarget } from '../../sampler/fixtures/gaussianTarget.mjs';

// A checkpoint is the sampler state plus an append-only chain record: what is read back must be the snapshot bit
// for bit (the condition for a resumed run to equal an uninterrupted one; common practice for restartable
// samplers), a checkpoint must write only the steps since the previous one, and steps the record holds past the
// checkpoint (a kill between the two writes) or a step cut short (a full disk) must not count.
const scratch = resolve('.candela-tmp/checkpoint-file');
const target = createGaussianTarget({ mean: [0, 0, 0], covariance: [1, 0, 0, 0, 1, 0, 0, 0, 1] });
const WALKERS = 8;
/** Bytes of one step of the record: 2 ensembles x 8 walkers x (3 coordinates + 1 log posterior + 2 blobs) doubles. */
const STEP_BYTES = 2 * WALKERS * (3 + 1 + 2) * 8;
const HEADER_BYTES = 32;

async function startSampler(): Promise<EnsembleSampler> {
  const rng = createRandomStream('checkpoint-start');
  const starts = [0, 1].map(() => Float64Array.from({ length: WALKERS * 3 }, () => rng.normal()));
  return EnsembleSampler.start({ dimension: 3, walkers: WALKERS, ensembles: 2, seed: 'checkpoint' }, createInProcessEvaluator(target), starts);
}

function expectSameSnapshot(found: SamplerSnapshot, expected: SamplerSnapshot): void {
  expect(found.stepCount).toBe(expected.stepCount);
  expected.ensembles.forEach((ensemble, k) => {
    for (const field of ['positions', 'logProb', 'blobs', 'acceptedCounts', 'chainPositions', 'chainLogProb', 'chainBlobs'] as const) {
      expect(Array.from(found.ensembles[k][field]), `${k}.${field}`).toEqual(Array.from(ensemble[field]));
    }
    expect(found.ensembles[k].randomState).toEqual(ensemble.randomState);
  });
}

const folder = (name: string) => { const dir = join(scratch, name); mkdirSync(dir, { recursive: true }); return dir; };

/** A fresh sampler advanced `steps` steps, with its checkpoint written into a new folder `name`. */
async function checkpointed(name: string, steps: number): Promise<{ dir: string; sampler: EnsembleSampler }> {
  const dir = folder(name);
  const sampler = await startSampler();
  await sampler.advance(steps);
  writeCheckpoint(dir, sampler.snapshot(), { wallSeconds: 1, evaluations: 1 });
  return { dir, sampler };
}

beforeEach(() => rmSync(scratch, { recursive: true, force: true }));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('writeCheckpoint and readCheckpoint', () => {
  it('read back the snapshot bit for bit, keep the state file small and append only the new steps to the record', async () => {
    const dir = folder('append');
    const sampler = await startSampler();
    await sampler.advance(30);
    writeCheckpoint(dir, sampler.snapshot(), { wallSeconds: 1.5, evaluations: 960 });
    expect(statSync(join(dir, 'chain-record.bin')).size).toBe(HEADER_BYTES + 30 * STEP_BYTES);
    const stateBytes = statSync(join(dir, 'checkpoint.bin')).size;
    expect(stateBytes).toBeLessThan(8192);
    await sampler.advance(20);
    writeCheckpoint(dir, sampler.snapshot(), { wallSeconds: 2.5, evaluations: 1600 });
    expect(statSync(join(dir, 'chain-record.bin')).size).toBe(HEADER_BYTES + 50 * STEP_BYTES);
    expect(statSync(join(dir, 'checkpoint.bin')).size).toBe(stateBytes); // the state does not grow with the chain
    const read = readCheckpoint(dir);
    expect([read.wallSeconds, read.evaluations]).toEqual([2.5, 1600]);
    expectSameSnapshot(read.snapshot, sampler.snapshot());
  });

  it('ignore steps past the checkpoint and a step cut short, and the next checkpoint continues the uninterrupted chain', async () => {
    const { dir, sampler: straight } = await checkpointed('killed', 30);
    copyFileSync(join(dir, 'checkpoint.bin'), join(scratch, 'checkpoint-30.bin'));
    await straight.advance(20);
    writeCheckpoint(dir, straight.snapshot(), { wallSeconds: 2, evaluations: 2 });
    // A run killed after appending steps 30-49 but before replacing checkpoint.bin, with half a step written after them.
    copyFileSync(join(scratch, 'checkpoint-30.bin'), join(dir, 'checkpoint.bin'));
    appendFileSync(join(dir, 'chain-record.bin'), Buffer.alloc(STEP_BYTES / 2, 7));
    const resumed = readCheckpoint(dir);
    expect(resumed.snapshot.stepCount).toBe(30);
    const restored = await EnsembleSampler.restore(resumed.snapshot, createInProcessEvaluator(target));
    await restored.advance(25);
    writeCheckpoint(dir, restored.snapshot(), { wallSeconds: 3, evaluations: 3 });
    expect(statSync(join(dir, 'chain-record.bin')).size).toBe(HEADER_BYTES + 55 * STEP_BYTES);
    await straight.advance(5);
    expectSameSnapshot(readCheckpoint(dir).snapshot, straight.snapshot());
  });

  it('reads a checkpoint that holds its chains itself (the format before the chain record)', async () => {
    const dir = folder('inline');
    const sampler = await startSampler();
    await sampler.advance(12);
    writeFileSync(join(dir, 'checkpoint.bin'), encodeBinaryState({ snapshot: sampler.snapshot(), wallSeconds: 4, evaluations: 5 }));
    const read = readCheckpoint(dir);
    expect([read.wallSeconds, read.evaluations]).toEqual([4, 5]);
    expectSameSnapshot(read.snapshot, sampler.snapshot());
  });

  it('refuses a chain record shorter than its checkpoint, or one of another shape', async () => {
    const { dir } = await checkpointed('short', 10);
    truncateSync(join(dir, 'chain-record.bin'), HEADER_BYTES + 9 * STEP_BYTES);
    const codeOf = (action: () => unknown) => { try { action(); return null; } catch (error) { return isCandelaError(error) ? error.issues[0].code : String(error); } };
    expect(codeOf(() => readCheckpoint(dir))).toBe('run.bad_checkpoint');
    const other = await EnsembleSampler.start({ dimension: 3, walkers: WALKERS, ensembles: 1, seed: 'x' }, createInProcessEvaluator(target), [Float64Array.from({ length: WALKERS * 3 }, createRandomStream('other').normal)]);
    expect(codeOf(() => writeCheckpoint(dir, other.snapshot(), { wallSeconds: 0, evaluations: 0 }))).toBe('run.bad_checkpoint');
  });
});
