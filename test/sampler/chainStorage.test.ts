import { describe, expect, it } from 'vitest';
import { ChainStorage } from '../../src/sampler/chainStorage.js';

const stepOf = (s: number, size: number): Float64Array => Float64Array.from({ length: size }, (_, i) => s * 100 + i);

describe('ChainStorage', () => {
  it('after release holds only the later steps, at their true step numbers, and earlier views stay intact', () => {
    const store = new ChainStorage(2, 3, 1, 4);
    for (let s = 0; s < 10; s++) store.append(stepOf(s, 6), stepOf(s, 2), stepOf(s, 2));
    const before = store.view();
    store.release(7);
    const after = store.view();
    expect([after.firstStep, after.steps]).toEqual([7, 3]);
    expect(Array.from(after.positions.subarray(0, 6))).toEqual(Array.from(stepOf(7, 6)));
    expect(Array.from(after.logProb)).toEqual([...stepOf(7, 2), ...stepOf(8, 2), ...stepOf(9, 2)]);
    expect(before.steps).toBe(10);
    expect(Array.from(before.positions.subarray(54, 60))).toEqual(Array.from(stepOf(9, 6)));
    store.append(stepOf(10, 6), stepOf(10, 2), stepOf(10, 2));
    expect([store.firstStep, store.steps]).toEqual([7, 4]);
    expect(Array.from(store.view().blobs.subarray(6, 8))).toEqual(Array.from(stepOf(10, 2)));
  });

  it('releases nothing below its first step and everything at most, and gives back the capacity of a long run', () => {
    const store = new ChainStorage(1, 1, 0, 2);
    for (let s = 0; s < 1000; s++) store.append(Float64Array.of(s), Float64Array.of(s), new Float64Array(0));
    store.release(990);
    store.release(5);
    expect([store.firstStep, store.steps]).toEqual([990, 10]);
    expect(store.capacitySteps).toBeLessThan(100);
    store.release(5000);
    expect([store.firstStep, store.steps]).toEqual([1000, 0]);
  });
});
