import { NestedRun, type NestedOptions, type NestedProblem, type NestedResult } from '../../sampler/index.js';
import { EVENT_LOOP_SLICE_MS, RunInterrupted, turnOfEventLoop } from './interruptibleEvaluator.js';

/** Likelihood calls of the first slice, before the time per call is known (a few ms for a cosmology likelihood). */
const FIRST_SLICE_CALLS = 20;
/** Most likelihood calls in one slice, whatever the measured speed (a cheap model's slices stay short too). */
const MOST_SLICE_CALLS = 100_000;

/**
 * Runs nested sampling (NestedRun, the same result as runNestedSampling bit
 * for bit) in slices of likelihood calls sized from the time per call
 * measured so far so that each lasts about `sliceMs`, letting the event loop
 * turn between slices: a SIGINT or SIGTERM handler then runs within about a
 * slice, and once `signal` is aborted the run stops there and rejects with
 * RunInterrupted. Nested sampling keeps no checkpoint, so an interrupted run
 * leaves nothing to continue from; the caller says so.
 * Cost: the nested run, plus one event-loop turn (microseconds) and two clock reads per slice.
 * @param problem dimension, prior transform, log-likelihood (nats).
 * @param options live points, unexplored-ln Z bound, iteration cap, seed, enlargement.
 * @param signal aborted on an interrupt (optional).
 * @param sliceMs target duration of a slice, ms (default EVENT_LOOP_SLICE_MS).
 * @returns the nested-sampling result.
 * @throws (rejects) RunInterrupted once `signal` is aborted; the CandelaErrors of NestedRun.
 * @example const result = await runNestedInSlices(problem, options, controller.signal)
 */
export async function runNestedInSlices(problem: NestedProblem, options: NestedOptions, signal?: AbortSignal, sliceMs = EVENT_LOOP_SLICE_MS): Promise<NestedResult> {
  const run = new NestedRun(problem, options);
  let calls = FIRST_SLICE_CALLS;
  for (;;) {
    if (signal?.aborted) throw new RunInterrupted();
    const before = run.likelihoodCalls;
    const started = performance.now();
    if (run.advance(calls)) return run.result();
    const msPerCall = (performance.now() - started) / Math.max(1, run.likelihoodCalls - before);
    calls = Math.max(1, Math.min(MOST_SLICE_CALLS, Math.floor(sliceMs / Math.max(msPerCall, 1e-6))));
    await turnOfEventLoop();
  }
}
