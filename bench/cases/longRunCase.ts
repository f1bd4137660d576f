/**
 * Long-run memory case, run in its own process by bench/longRun.ts:
 *
 *   node dist/bench/cases/longRunCase.js --steps 200000 --keep bounded|all
 *
 * 4 ensembles of 32 walkers on a model that costs almost nothing (a 3-D
 * standard normal, bench/support/trivialModel.ts), advanced in slices of 25
 * steps as `candela fit` does. `bounded`: after every slice the steps are
 * appended to a chain record on disk (the layout of chain-record.bin: per
 * step, per ensemble, positions, log posteriors, blobs) and released from
 * memory, and every 1,000 steps the autocorrelation time is estimated from
 * the sampler's thinned traces (what the stopping rule reads). `all`: every
 * step stays in memory, as before the release existed; the autocorrelation
 * time is estimated once at the end from the whole chain and from the traces.
 * Reports the peak resident set, the wall time, the traces' stride and both
 * tau estimates.
 */
import { closeSync, openSync, rmSync, statSync, writeSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { integratedAutocorrelationTime } from '../../src/diagnostics/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { createInProcessEvaluator, EnsembleSampler } from '../../src/sampler/index.js';
import { caseArguments, reportCase, runCaseMain } from '../support/childCase.js';
import { createTrivialModel } from '../support/trivialModel.js';

const WALKERS = 32;
const ENSEMBLES = 4;
const DIMENSION = 3;
const SLICE_STEPS = 25;
const CHECK_EVERY = 1000;

const since = (start: bigint): number => Number(process.hrtime.bigint() - start) / 1e6;

/** Largest tau (steps) over the parameters, every walker of every ensemble a series, from step-major positions with `stride` steps between rows. */
function largestTau(views: Array<{ positions: Float64Array; steps: number }>, stride: number): number {
  let largest = 0;
  for (let d = 0; d < DIMENSION; d++) {
    const series: Float64Array[] = [];
    for (const { positions, steps } of views) {
      for (let w = 0; w < WALKERS; w++) series.push(Float64Array.from({ length: steps }, (_, s) => positions[(s * WALKERS + w) * DIMENSION + d]));
    }
    largest = Math.max(largest, integratedAutocorrelationTime(series).tauSteps * stride);
  }
  return largest;
}

/** Appends the held steps of every ensemble to the record, step after step. */
function appendHeld(descriptor: number, sampler: EnsembleSampler): void {
  const views = Array.from({ length: ENSEMBLES }, (_, k) => sampler.chain(k));
  const blobCount = views[0].blobCount;
  for (let j = 0; j < views[0].steps; j++) {
    for (const view of views) {
      const parts = [
        view.positions.subarray(j * WALKERS * DIMENSION, (j + 1) * WALKERS * DIMENSION),
        view.logProb.subarray(j * WALKERS, (j + 1) * WALKERS),
        view.blobs.subarray(j * WALKERS * blobCount, (j + 1) * WALKERS * blobCount),
      ];
      for (const part of parts) writeSync(descriptor, Buffer.from(part.buffer, part.byteOffset, part.byteLength));
    }
  }
}

runCaseMain(async () => {
  const args = caseArguments();
  const steps = Number(args.steps ?? 200_000);
  const bounded = (args.keep ?? 'bounded') === 'bounded';
  const rng = createRandomStream('long-run-start');
  const starts = Array.from({ length: ENSEMBLES }, () => Float64Array.from({ length: WALKERS * DIMENSION }, () => 0.1 * rng.normal()));
  const evaluator = createInProcessEvaluator(createTrivialModel());
  const folder = mkdtempSync(join(tmpdir(), 'candela-long-run-'));
  const recordPath = join(folder, 'chain-record.bin');
  const descriptor = openSync(recordPath, 'w');
  try {
    const started = process.hrtime.bigint();
    const sampler = await EnsembleSampler.start({ dimension: DIMENSION, walkers: WALKERS, ensembles: ENSEMBLES, seed: 'long-run' }, evaluator, starts);
    let diagnosticsMs = 0;
    let traceTau = Number.NaN;
    while (sampler.stepCount < steps) {
      await sampler.advance(Math.min(SLICE_STEPS, steps - sampler.stepCount));
      if (bounded) {
        appendHeld(descriptor, sampler);
        sampler.releaseStoredSteps(sampler.stepCount);
        if (sampler.stepCount % CHECK_EVERY === 0) {
          const start = process.hrtime.bigint();
          const traces = Array.from({ length: ENSEMBLES }, (_, k) => sampler.trace(k));
          traceTau = largestTau(traces, traces[0].stride);
          diagnosticsMs += since(start);
        }
      }
    }
    const wallMs = since(started);
    const traces = Array.from({ length: ENSEMBLES }, (_, k) => sampler.trace(k));
    if (!bounded) traceTau = largestTau(traces, traces[0].stride);
    const wholeTau = bounded ? null : largestTau(Array.from({ length: ENSEMBLES }, (_, k) => sampler.chain(k)), 1);
    reportCase({
      keep: bounded ? 'bounded' : 'all', steps, walkers: WALKERS, ensembles: ENSEMBLES, dimension: DIMENSION,
      wall_s: wallMs / 1000, diagnostics_ms_total: diagnosticsMs, checks: bounded ? Math.floor(steps / CHECK_EVERY) : 0,
      trace_steps: traces[0].steps, trace_stride: traces[0].stride, max_tau_from_trace_steps: traceTau, max_tau_from_whole_chain_steps: wholeTau,
      record_mb: bounded ? statSync(recordPath).size / 2 ** 20 : 0, held_steps_at_end: sampler.chain(0).steps,
    });
  } finally {
    closeSync(descriptor);
    rmSync(folder, { recursive: true, force: true });
    await evaluator.close();
  }
});
