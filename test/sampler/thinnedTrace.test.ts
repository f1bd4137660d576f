import { describe, expect, it } from 'vitest';
import { ThinnedTrace, traceCapacitySteps, MINIMUM_TRACE_STEPS } from '../../src/sampler/thinnedTrace.js';

// The trace must hold exactly the steps a bounded thinning-by-halving store holds (common practice): step s is kept
// when s is a multiple of the stride, the stride being the smallest power of two for which those steps fit into the
// capacity. The expected content is computed here directly from that definition, not by replaying the class.
function expectedStride(steps: number, capacity: number): number {
  let stride = 1;
  while (Math.ceil(steps / stride) > capacity) stride *= 2;
  return stride;
}

/** Positions of step s, walker w, parameter d: a value that names all three, so a misplaced copy is seen. */
const value = (s: number, w: number, d: number): number => s * 1000 + w * 10 + d;

describe('ThinnedTrace', () => {
  it('keeps exactly the steps that are multiples of the smallest fitting power-of-two stride, for every run length', () => {
    const walkers = 3;
    const dimension = 2;
    for (const capacity of [2, 4, 6, 10]) {
      const trace = new ThinnedTrace(walkers, dimension, capacity);
      const step = new Float64Array(walkers * dimension);
      for (let s = 0; s < 200; s++) {
        for (let w = 0; w < walkers; w++) for (let d = 0; d < dimension; d++) step[w * dimension + d] = value(s, w, d);
        trace.append(step);
        const seen = s + 1;
        const stride = expectedStride(seen, capacity);
        const view = trace.view();
        expect([view.stride, view.steps], `capacity ${capacity}, ${seen} steps`).toEqual([stride, Math.ceil(seen / stride)]);
        for (let j = 0; j < view.steps; j++) {
          for (let w = 0; w < walkers; w++) for (let d = 0; d < dimension; d++) expect(view.positions[(j * walkers + w) * dimension + d]).toBe(value(j * stride, w, d));
        }
      }
    }
  });

  it('keeps the same steps when its buffer starts small and grows (capacity 200 over 1,000 steps)', () => {
    const trace = new ThinnedTrace(2, 1, 200);
    for (let s = 0; s < 1000; s++) {
      trace.append(Float64Array.of(value(s, 0, 0), value(s, 1, 0)));
      if (![63, 64, 127, 199, 200, 201, 999].includes(s)) continue;
      const stride = expectedStride(s + 1, 200);
      const view = trace.view();
      const expected = Array.from({ length: Math.ceil((s + 1) / stride) }, (_, j) => [value(j * stride, 0, 0), value(j * stride, 1, 0)]).flat();
      expect([view.stride, Array.from(view.positions)], `${s + 1} steps`).toEqual([stride, expected]);
    }
  });

  it('holds every step (stride 1) up to its capacity, so diagnostics then see the whole chain', () => {
    const trace = new ThinnedTrace(1, 1, 8);
    for (let s = 0; s < 8; s++) trace.append(Float64Array.of(s));
    expect(Array.from(trace.view().positions)).toEqual([0, 1, 2, 3, 4, 5, 6, 7]);
    trace.append(Float64Array.of(8));
    expect(Array.from(trace.view().positions)).toEqual([0, 2, 4, 6, 8]);
  });

  it('refuses an odd or tiny capacity', () => {
    expect(() => new ThinnedTrace(2, 2, 7)).toThrow(RangeError);
    expect(() => new ThinnedTrace(2, 2, 0)).toThrow(RangeError);
  });
});

describe('traceCapacitySteps', () => {
  it('divides the value budget among walkers, ensembles and parameters, rounded down to an even count, never below the minimum', () => {
    expect(traceCapacitySteps(32, 4, 3)).toBe(10922); // floor(2^22 / 384) = 10922.67 -> 10922
    expect(traceCapacitySteps(8, 2, 1, 100)).toBe(MINIMUM_TRACE_STEPS);
    expect(traceCapacitySteps(1, 1, 1, 1001)).toBe(1000);
  });
});
