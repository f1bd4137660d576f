import { mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { createRandomStream } from '../../../src/math/index.js';
import { EnsembleSampler, createInProcessEvaluator } from '../../../src/sampler/index.js';
import { appendChainRecord } from '../../../src/output/run/chainRecordFile.js';
import { writeChainsFile, type EnsembleDraws } from '../../../src/output/run/chainsFile.js';
import { bestStoredDraw, drawsAfterBurnIn, drawsFromChainRecord, drawsInMemory, forEachStoredBlock, shiftedDraws, STORED_DRAWS_BLOCK_STEPS } from '../../../src/output/run/storedDraws.js';
import { createGaussianTarget } from '../../sampler/fixtures/gaussianTarget.mjs';

// Reading a run's stored steps a block at a time must give the numbers the sampler stored, bit for bit, so that
// chains.csv and the best fit written from the record equal those written from the draws in memory. Identity
// checks of candela's own file format (common practice for streamed readers: compare with the whole read).
const scratch = resolve('.candela-tmp/stored-draws');
const target = createGaussianTarget({ mean: [0, 0], covariance: [1, 0.3, 0.3, 1] });
const WALKERS = 6;
/** More steps than one block, and not a multiple of it, so blocks cross and end short. */
const STEPS = STORED_DRAWS_BLOCK_STEPS * 2 + 37;
let inMemory: EnsembleDraws[];

const bytes = (array: Float64Array) => Buffer.from(array.buffer, array.byteOffset, array.byteLength);

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  const rng = createRandomStream('stored-start');
  const starts = [0, 1, 2].map(() => Float64Array.from({ length: WALKERS * 2 }, () => rng.normal()));
  const sampler = await EnsembleSampler.start({ dimension: 2, walkers: WALKERS, ensembles: 3, seed: 'stored' }, createInProcessEvaluator(target), starts);
  await sampler.advance(STEPS);
  inMemory = [0, 1, 2].map((k) => ({ ...sampler.chain(k) }));
  appendChainRecord(scratch, sampler.snapshot(), { sync: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('drawsFromChainRecord', () => {
  it('gives every block of every ensemble bit for bit as the sampler stored it', () => {
    const source = drawsFromChainRecord(scratch, { ensembles: 3, walkers: WALKERS, dimension: 2, blobCount: inMemory[0].blobCount }, STEPS);
    expect([source.ensembles, source.steps, source.walkers, source.dimension]).toEqual([3, STEPS, WALKERS, 2]);
    let blocks = 0;
    forEachStoredBlock(source, (k, first, block) => {
      blocks++;
      const whole = drawsInMemory(inMemory).block(k, first, first + block.steps);
      expect(bytes(block.positions).equals(bytes(whole.positions))).toBe(true);
      expect(bytes(block.logProb).equals(bytes(whole.logProb))).toBe(true);
      expect(bytes(block.blobs).equals(bytes(whole.blobs))).toBe(true);
    });
    expect(blocks).toBe(3 * Math.ceil(STEPS / STORED_DRAWS_BLOCK_STEPS));
    const single = source.block(2, 400, 401);
    expect(Array.from(single.positions)).toEqual(Array.from(inMemory[2].positions.subarray(400 * WALKERS * 2, 401 * WALKERS * 2)));
  });

  it('refuses a record shorter than the run, naming the file', () => {
    const shape = { ensembles: 3, walkers: WALKERS, dimension: 2, blobCount: inMemory[0].blobCount };
    try {
      drawsFromChainRecord(scratch, shape, STEPS + 1);
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].code).toBe('run.bad_checkpoint');
      expect(String((error as Error).message)).toContain('chain-record.bin');
    }
  });
});

describe('writeChainsFile from stored draws', () => {
  const shape = () => ({ ensembles: 3, walkers: WALKERS, dimension: 2, blobCount: inMemory[0].blobCount });
  const columns = { parameters: ['x', 'y'], derived: [] };
  for (const selection of [undefined, { first_step: 100, every_steps: 3, steps: 150 }, { first_step: 10, every_steps: 300, steps: 2 }]) {
    it(`writes the same bytes from the record as from the draws in memory (selection ${JSON.stringify(selection ?? 'every step')})`, () => {
      writeChainsFile(join(scratch, 'memory.csv'), columns, inMemory, 50, undefined, selection);
      writeChainsFile(join(scratch, 'record.csv'), columns, drawsFromChainRecord(scratch, shape(), STEPS), 50, undefined, selection);
      const text = readFileSync(join(scratch, 'record.csv'), 'utf8');
      expect(text).toBe(readFileSync(join(scratch, 'memory.csv'), 'utf8'));
      expect(text.trimEnd().split('\n').length).toBe(1 + 3 * WALKERS * (selection?.steps ?? STEPS));
    });
  }
});

describe('drawsAfterBurnIn', () => {
  it('counts the draws after the burn-in and gives each in chains.csv order (ensemble, step, walker)', () => {
    const draws = drawsAfterBurnIn(drawsFromChainRecord(scratch, { ensembles: 3, walkers: WALKERS, dimension: 2, blobCount: inMemory[0].blobCount }, STEPS), 40);
    expect(draws.count).toBe(3 * (STEPS - 40) * WALKERS);
    const perEnsemble = (STEPS - 40) * WALKERS;
    for (const pick of [0, 1, WALKERS, perEnsemble - 1, perEnsemble, draws.count - 1]) {
      const ensemble = Math.floor(pick / perEnsemble);
      const row = 40 * WALKERS + (pick % perEnsemble);
      expect(Array.from(draws.at(pick))).toEqual(Array.from(inMemory[ensemble].positions.subarray(row * 2, row * 2 + 2)));
    }
  });
});

describe('bestStoredDraw and shiftedDraws', () => {
  it('finds the highest log posterior after the burn-in, the first of equals in ensemble, step, walker order', () => {
    let expected = { value: -Infinity, ensemble: -1, row: -1 };
    inMemory.forEach((draws, k) => {
      for (let row = 20 * WALKERS; row < draws.steps * WALKERS; row++) if (draws.logProb[row] > expected.value) expected = { value: draws.logProb[row], ensemble: k, row };
    });
    const best = bestStoredDraw(drawsFromChainRecord(scratch, { ensembles: 3, walkers: WALKERS, dimension: 2, blobCount: inMemory[0].blobCount }, STEPS), 20);
    expect(best.logProb).toBe(expected.value);
    expect([best.ensemble, best.step * WALKERS + best.walker]).toEqual([expected.ensemble, expected.row]);
    expect(Array.from(best.theta)).toEqual(Array.from(inMemory[expected.ensemble].positions.subarray(expected.row * 2, expected.row * 2 + 2)));
    expect(best.logLikelihood).toBe(inMemory[expected.ensemble].blobs[expected.row * inMemory[0].blobCount + 1]);
  });

  it('adds each offset to its parameter of every position and leaves the source untouched', () => {
    const source = drawsInMemory(inMemory);
    const shown = shiftedDraws(source, [0, 0.25]).block(1, 3, 4);
    const original = source.block(1, 3, 4);
    for (let w = 0; w < WALKERS; w++) {
      expect(shown.positions[w * 2]).toBe(original.positions[w * 2]);
      expect(shown.positions[w * 2 + 1]).toBe(original.positions[w * 2 + 1] + 0.25);
    }
    expect(Array.from(shown.logProb)).toEqual(Array.from(original.logProb));
    expect(source.block(1, 3, 4).positions[1]).toBe(inMemory[1].positions[3 * WALKERS * 2 + 1]);
  });
});
