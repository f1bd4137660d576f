import { existsSync, mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runNestedSampling } from '../../../src/sampler/index.js';
import { isRunInterrupted } from '../../../src/pipeline/fit/interruptibleEvaluator.js';
import { runNestedInSlices } from '../../../src/pipeline/fit/runNestedInSlices.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { CANDELA_COMMAND, runAndSignal } from '../../support/signalledRun.js';

// Nested sampling under SIGINT and SIGTERM. The run is sliced so that the event loop turns about every 100 ms, which
// must change nothing in its result; a real `candela fit` process (the built command, dist/) in its own process
// group, as a terminal or a batch scheduler signals it, must stop sampling within a second, exit 130, say that nested
// sampling cannot resume, and leave no file that could pass for a finished run. Data: the Pantheon 2018 binned
// Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018).
const scratch = resolve('.candela-tmp/nested-signals');
/** Longest wait from the signal to the "stopped on the signal" line, s: the requirement on interrupts. */
const STOP_DELAY_SECONDS = 1;
/** Longest wait from the signal to the exit, s (nothing is written; the allowance is for a loaded machine, as in fitSignals.test.ts). */
const EXIT_DELAY_SECONDS = 5;
/** Wait after the line that announces the nested sampling before the signal, ms: well inside a run of about 10 s of CPU
 * (10,000 live points; with 2,000 an idle machine finished the run, 2.3 s, before the signal came). */
const SIGNAL_AFTER_MS = 1500;

/** A one-dimensional Gaussian likelihood in a uniform box (the example of runNestedSampling's documentation). */
const problem = {
  dimension: 1,
  priorTransform: (unit: Float64Array, out: Float64Array) => { out[0] = 20 * unit[0] - 10; },
  logLikelihood: (theta: Float64Array) => -0.5 * theta[0] ** 2 - 0.5 * Math.log(2 * Math.PI),
};
const options = { livePoints: 300, maxUnexploredLnZ: 0.01, maxIterations: 1_000_000, seed: 'slices' };

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('runNestedInSlices', () => {
  it('gives the result of runNestedSampling bit for bit, with slices of a tenth of a millisecond', async () => {
    const whole = runNestedSampling(problem, options);
    const sliced = await runNestedInSlices(problem, options, undefined, 0.1);
    expect([sliced.logZ, sliced.iterations, sliced.likelihoodCalls]).toEqual([whole.logZ, whole.iterations, whole.likelihoodCalls]);
    expect(Buffer.from(sliced.samples.buffer).equals(Buffer.from(whole.samples.buffer))).toBe(true);
  });

  it('rejects with RunInterrupted once its signal is aborted, within a slice', async () => {
    const controller = new AbortController();
    const slow = { ...problem, logLikelihood: (theta: Float64Array) => { const until = performance.now() + 0.5; /* about 2.5 s for the whole run: far beyond the 200 ms wait */ while (performance.now() < until); return problem.logLikelihood(theta); } };
    const running = runNestedInSlices(slow, options, controller.signal, 20);
    await new Promise((done) => setTimeout(done, 200));
    const abortedAt = performance.now();
    controller.abort();
    const error = await running.then(() => null, (reason: unknown) => reason);
    expect(isRunInterrupted(error)).toBe(true);
    expect(performance.now() - abortedAt).toBeLessThan(1000);
  });
});

/** Ready for the signal SIGNAL_AFTER_MS after the fit announced its nested sampling (the run then lasts seconds more). */
function nestedSamplingUnderway(): (stderr: string) => boolean {
  let announcedAt: number | null = null;
  return (stderr) => {
    if (announcedAt === null && stderr.includes('nested sampling with')) announcedAt = Date.now();
    return announcedAt !== null && Date.now() - announcedAt >= SIGNAL_AFTER_MS;
  };
}

describe('candela fit with nested sampling under SIGINT and SIGTERM', () => {
  it.each(['SIGINT', 'SIGTERM'] as const)('%s: stops within a second, exits 130, says it cannot resume and leaves no run files', async (signal) => {
    if (!existsSync(CANDELA_COMMAND)) throw new Error(`build first (npm run build): ${CANDELA_COMMAND} is missing`);
    const runDir = join(scratch, signal);
    const config = join(scratch, `${signal}.yaml`);
    writeFileSync(config, pantheonBinnedConfig({
      title: 'nested signal test', seed: 3,
      models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
      parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
      sampler: '{ method: nested, nested: { live_points: 10000, max_unexplored_ln_z: 0.01 } }',
      output: `{ dir: ${runDir}, figures: [], png: false }`,
    }));
    const finished = await runAndSignal(['fit', config], [signal], nestedSamplingUnderway());
    expect(finished.killedBy, finished.stderr).toBeNull();
    expect(finished.code, finished.stderr).toBe(130);
    expect(finished.secondsToStop, finished.stderr).not.toBeNull();
    expect(finished.secondsToStop as number).toBeLessThan(STOP_DELAY_SECONDS);
    expect(finished.secondsAfterSignal as number).toBeLessThan(EXIT_DELAY_SECONDS);
    console.info(`nested ${signal}: sampling stopped ${(finished.secondsToStop as number).toFixed(2)} s and the process exited ${(finished.secondsAfterSignal as number).toFixed(2)} s after the signal`);
    expect(finished.stderr).toMatch(/cannot resume/);
    expect(finished.stderr).not.toMatch(/internal error/);
    expect(existsSync(runDir) ? readdirSync(runDir) : []).toEqual([]);
  }, 120_000);
});
