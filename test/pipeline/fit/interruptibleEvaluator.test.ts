import { describe, expect, it } from 'vitest';
import { createInProcessEvaluator } from '../../../src/sampler/index.js';
import type { BatchEvaluator, LogProbabilityModel } from '../../../src/sampler/index.js';
import { createInterruptibleEvaluator, isRunInterrupted } from '../../../src/pipeline/fit/interruptibleEvaluator.js';

// Signal handlers run only on a turn of the event loop (Node.js process events), so a long batch must let the loop
// turn; the batch split must not change a single number (the points are independent; common practice).
/** A model that busy-waits `msPerPoint` per point and returns -|theta|^2 / 2 with the coordinate sum as a blob. */
function slowModel(msPerPoint: number): LogProbabilityModel {
  return {
    dimension: 2,
    blobCount: 1,
    evaluate(theta, blobs, offset) {
      const until = performance.now() + msPerPoint;
      while (performance.now() < until) { /* busy: a stand-in for an expensive likelihood */ }
      blobs[offset] = theta[0] + theta[1];
      return -(theta[0] * theta[0] + theta[1] * theta[1]) / 2;
    },
  };
}

const points = Float64Array.from({ length: 2 * 120 }, (_, i) => Math.sin(i) * 3);

describe('createInterruptibleEvaluator', () => {
  it('lets the event loop turn at least every slice during a long batch and gives the numbers of the plain evaluator', async () => {
    const model = slowModel(4);
    const plain = { logProb: new Float64Array(120), blobs: new Float64Array(120) };
    await createInProcessEvaluator(model).evaluate(points, 120, plain.logProb, plain.blobs);
    const wrapped = createInterruptibleEvaluator(createInProcessEvaluator(model), undefined, 50);
    const logProb = new Float64Array(120);
    const blobs = new Float64Array(120);
    let turns = 0;
    let longestGap = 0;
    let last = performance.now();
    const ticker = setInterval(() => { const now = performance.now(); longestGap = Math.max(longestGap, now - last); last = now; turns += 1; }, 5);
    try {
      await wrapped.evaluate(points, 120, logProb, blobs); // about 480 ms of work
    } finally {
      clearInterval(ticker);
    }
    expect(turns).toBeGreaterThanOrEqual(5);
    expect(longestGap).toBeLessThan(400); // one part is at most half a slice; the rest is this machine's scheduling
    expect(Array.from(logProb)).toEqual(Array.from(plain.logProb));
    expect(Array.from(blobs)).toEqual(Array.from(plain.blobs));
  });

  it('never splits a batch into parts smaller than the evaluating threads, however slow the model', async () => {
    const inner = createInProcessEvaluator(slowModel(30));
    const sizes: number[] = [];
    const recorder: BatchEvaluator = { ...inner, evaluate: (p, count, l, b) => { sizes.push(count); return inner.evaluate(p, count, l, b); } };
    const wrapped = createInterruptibleEvaluator(recorder, undefined, 50, 3);
    await wrapped.evaluate(points, 10, new Float64Array(10), new Float64Array(10));
    expect(sizes.reduce((sum, size) => sum + size, 0)).toBe(10);
    expect(sizes.slice(0, -1).every((size) => size === 3)).toBe(true); // 30 ms a point: half a slice holds none, so the floor rules
    expect(sizes[sizes.length - 1]).toBe(1);
  });

  it('rejects with RunInterrupted soon after the signal is aborted in the middle of a batch', async () => {
    const controller = new AbortController();
    const wrapped = createInterruptibleEvaluator(createInProcessEvaluator(slowModel(10)), controller.signal, 50);
    let abortedAt = 0;
    setTimeout(() => { abortedAt = performance.now(); controller.abort(); }, 100);
    const outcome = await wrapped.evaluate(points, 120, new Float64Array(120), new Float64Array(120)).then(() => null, (error: unknown) => error);
    expect(isRunInterrupted(outcome)).toBe(true);
    expect(performance.now() - abortedAt).toBeLessThan(500); // the whole batch would take 1.2 s
  });
});
