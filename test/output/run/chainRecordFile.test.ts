import { mkdirSync, rmSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { createRandomStream } from '../../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator } from '../../../src/sampler/index.js';
import { appendChainRecord, readChainRecordDraws, recordShapeOf } from '../../../src/output/run/chainRecordFile.js';
import { readCheckpoint, readCheckpointState, writeCheckpoint } from '../../../src/output/run/checkpointFile.js';
import { createGaussianTarget } from '../../sampler/fixtures/gaussianTarget.mjs';

// A fit appends its steps to the chain record after every slice and releases them from memory; the record must then
// hold every step bit for bit, a checkpoint must read back without loading the chain, and a sampler restored from it
// (its traces rebuilt from the record) must continue exactly like an uninterrupted one (common practice for
// restartable samplers). Identity checks of candela's own file format.
const scratch = resolve('.candela-tmp/chain-record-file');
const target = createGaussianTarget({ mean: [0, 0, 0], covariance: [1, 0, 0, 0, 1, 0, 0, 0, 1] });
const WALKERS = 8;
/** Bytes of one step of the record: 2 ensembles x 8 walkers x (3 coordinates + 1 log posterior + 2 blobs) doubles. */
const STEP_BYTES = 2 * WALKERS * (3 + 1 + 2) * 8;
const HEADER_BYTES = 32;
/** A small trace capacity, so that the 100-step runs below halve their traces several times. */
const storage = { traceCapacitySteps: 10 };

async function startSampler(): Promise<EnsembleSampler> {
  const rng = createRandomStream('record-start');
  const starts = [0, 1].map(() => Float64Array.from({ length: WALKERS * 3 }, () => rng.normal()));
  return EnsembleSampler.start({ dimension: 3, walkers: WALKERS, ensembles: 2, seed: 'record' }, createInProcessEvaluator(target), starts, storage);
}

const bytes = (array: Float64Array) => Buffer.from(array.buffer, array.byteOffset, array.byteLength);

beforeEach(() => { rmSync(scratch, { recursive: true, force: true }); mkdirSync(scratch, { recursive: true }); });
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('appendChainRecord with released steps, and readCheckpointState', () => {
  it('records every step of a sampler that releases them, and a restore from the light checkpoint continues exactly', async () => {
    const straight = await startSampler();
    await straight.advance(100);

    const sampler = await startSampler();
    for (let slice = 0; slice < 6; slice++) {
      await sampler.advance(7);
      appendChainRecord(scratch, sampler.snapshot(), { sync: false });
      sampler.releaseStoredSteps(sampler.stepCount);
      expect(sampler.chain(0).steps).toBe(0);
    }
    await sampler.advance(3); // held in memory until the checkpoint appends them
    writeCheckpoint(scratch, sampler.snapshot(), { wallSeconds: 2, evaluations: 720 });
    expect(statSync(join(scratch, 'chain-record.bin')).size).toBe(HEADER_BYTES + 45 * STEP_BYTES);

    const saved = readCheckpointState(scratch);
    expect([saved.snapshot.stepCount, saved.snapshot.chainFirstStep, saved.snapshot.ensembles[1].chainLogProb.length]).toEqual([45, 45, 0]);
    const resumed = await EnsembleSampler.restore(saved.snapshot, createInProcessEvaluator(target), { ...storage, earlierSteps: saved.earlierSteps });
    await resumed.advance(55);
    writeCheckpoint(scratch, resumed.snapshot(), { wallSeconds: 3, evaluations: 1600 });

    const draws = readChainRecordDraws(scratch, recordShapeOf(resumed.snapshot()), 100);
    for (let k = 0; k < 2; k++) {
      const whole = straight.chain(k);
      expect(bytes(draws[k].positions).equals(bytes(whole.positions))).toBe(true);
      expect(bytes(draws[k].logProb).equals(bytes(whole.logProb))).toBe(true);
      expect(bytes(draws[k].blobs).equals(bytes(whole.blobs))).toBe(true);
      expect(bytes(resumed.trace(k).positions).equals(bytes(straight.trace(k).positions))).toBe(true);
    }
    // The full read (candela merge) gives the whole chain from step 0.
    const full = readCheckpoint(scratch).snapshot;
    expect(full.chainFirstStep).toBe(0);
    expect(bytes(Float64Array.from(full.ensembles[0].chainPositions)).equals(bytes(straight.chain(0).positions))).toBe(true);
  });

  it('refuses to append after steps were released that the record does not hold', async () => {
    const sampler = await startSampler();
    await sampler.advance(5);
    sampler.releaseStoredSteps(5); // released without being recorded
    await sampler.advance(2);
    let code = '';
    try { appendChainRecord(scratch, sampler.snapshot(), { sync: false }); } catch (error) { code = isCandelaError(error) ? error.issues[0].code : String(error); }
    expect(code).toBe('run.bad_checkpoint');
  });
});
