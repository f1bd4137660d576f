import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runFit } from '../../../src/pipeline/index.js';
import { analyzeRun } from '../../../src/pipeline/report/analyzeRun.js';
import { chainStepStride, readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { recordStepBytesOf, syntheticAcceptance, writeSyntheticRecordRun } from '../../../bench/support/syntheticChainRecord.js';

// readRunFolder keeps a run's chains within a memory budget: a run whose every step would take more is read
// every k-th step (the acceptance still over every step). Checked on a short fit of the Pantheon 2018 binned
// Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018) read whole and thinned, and on synthetic
// chain records of two sizes written in the layout of that run (bench/support/syntheticChainRecord.ts), whose peak
// memory must not follow the file size.
const scratch = resolve('.candela-tmp/run-files');
let runDir = '';

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  const config = join(scratch, 'fit.yaml');
  writeFileSync(config, pantheonBinnedConfig({
    title: 'run files test', seed: 12,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 1200, check_every: 100, checkpoint_every: 400, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'run')}, figures: [], png: false }`,
  }));
  const [outcome] = await runFit({ configPath: config });
  runDir = outcome.runDir;
}, 180_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('chainStepStride', () => {
  it('is 1 while every step fits, else the smallest stride that fits (8 bytes per value, 13 per row)', () => {
    const record = readRunFolder(runDir).record;
    const values = record.parameters.sampled.length + record.parameters.derived.length + 3;
    const bytes = 2 * 8 * 1200 * (values * 8 + 13);
    expect(chainStepStride(record, 1024)).toBe(1);
    expect(chainStepStride(record, bytes / 2 ** 20)).toBe(1);
    expect(chainStepStride(record, bytes / 2 ** 20 / 3)).toBe(3);
    expect(chainStepStride(record, bytes / 2 ** 20 / 3 * 0.99)).toBe(4);
  });
});

describe('readRunFolder within a chain budget', () => {
  it('keeps every k-th step of every walker bit for bit, and counts the acceptance over every step', () => {
    const whole = readRunFolder(runDir);
    const budget = whole.chains.rows * (whole.chains.header.length - 4 + 13 / 8) * 8 / 2 ** 20 / 5;
    const thinned = readRunFolder(runDir, { chainMemoryMb: budget });
    expect(thinned.chains.stepStride).toBe(5);
    // Runs read together (compare) share the budget: five runs each get a fifth.
    expect(readRunFolder(runDir, { chainMemoryMb: budget * 5, sharedBy: 5 }).chains.stepStride).toBe(5);
    expect(thinned.chains.rows).toBe(2 * 8 * 240);
    for (let r = 0; r < thinned.chains.rows; r += 37) {
      const step = thinned.chains.step[r];
      expect(step % 5).toBe(0);
      const source = (thinned.chains.ensemble[r] * 1200 + step) * 8 + thinned.chains.walker[r];
      for (const name of ['omega_m', 'log_posterior']) expect(thinned.chains.columns[name][r]).toBe(whole.chains.columns[name][source]);
    }
    const a = analyzeRun(whole);
    const b = analyzeRun(thinned);
    expect(b.acceptanceMean).toBe(a.acceptanceMean);
    expect([b.steps, b.storedSteps, b.stepStride, b.burnInSteps]).toEqual([1200, 240, 5, a.burnInSteps]);
    expect(b.warnings.find((w) => w.code === 'chains_thinned_to_fit_memory')?.numbers).toEqual({ step_stride: 5, stored_steps: 240 });
    // A fifth of the draws after the burn-in, of a chain with tau of tens of steps: means agree within a few MC errors
    // (sd / sqrt(ESS), ESS >= 100 here), and tau, in steps of the run, within its own estimation error (~20%; Sokal 1997).
    const mean = (analysis: typeof a) => analysis.summary.parameters.find((p) => p.name === 'omega_m')!.stats;
    expect(Math.abs(mean(b).mean - mean(a).mean)).toBeLessThan(4 * mean(a).sd / Math.sqrt(100));
    expect(Math.abs((b.diagnostics.omega_m.tau as number) / (a.diagnostics.omega_m.tau as number) - 1)).toBeLessThan(0.3);
  });
});

/** `candela report` in its own process; its peak resident set (getrusage ru_maxrss), MB. */
function reportPeakMb(dir: string): number {
  const mainUrl = pathToFileURL(resolve('dist/src/cli/main.js')).href;
  const script = `const { main } = await import(${JSON.stringify(mainUrl)}); const code = await main(['report', ${JSON.stringify(dir)}]); process.stderr.write('\\npeak-rss-kb ' + process.resourceUsage().maxRSS + '\\n'); process.exitCode = code;`;
  const child = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  expect(child.status, child.stderr).toBe(0);
  return Number(/peak-rss-kb (\d+)/.exec(child.stderr)?.[1]) / 1024;
}

describe('report on chain records of 170 MB and 700 MB under one chain budget', () => {
  /** The chain budget of both runs, MB. */
  const BUDGET_MB = 32;
  /** Peak resident memory allowed, MB: the 32 MB table, the copies the summaries make, the Node.js runtime and the figures. */
  const PEAK_RSS_LIMIT_MB = 400;
  /** The larger record may cost at most this much more peak memory than the smaller, MB: memory follows the budget, not the file. */
  const GROWTH_LIMIT_MB = 60;

  it('summarizes both within the same bounded memory, with every walker\'s acceptance exact over every step', () => {
    const stepBytes = recordStepBytesOf(runDir);
    const peaks = [170, 700].map((mb) => {
      const steps = Math.floor((mb * 2 ** 20) / stepBytes);
      const dir = join(scratch, `record-${mb}`);
      writeSyntheticRecordRun(runDir, dir, steps, BUDGET_MB);
      const peak = reportPeakMb(dir);
      const summary = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8'));
      console.info(`report on a ${mb} MB chain record (${steps.toLocaleString('en')} steps) under a ${BUDGET_MB} MB chain budget: peak RSS ${peak.toFixed(0)} MB`);
      // Every synthetic walker moves on 3 of every 10 steps, so its acceptance is known exactly.
      expect(summary.convergence.acceptance_mean).toBeCloseTo(syntheticAcceptance(steps), 12);
      expect(summary.warnings.some((w: { code: string }) => w.code === 'chains_thinned_to_fit_memory')).toBe(true);
      rmSync(join(dir, 'chain-record.bin'));
      return peak;
    });
    expect(Math.max(...peaks)).toBeLessThan(PEAK_RSS_LIMIT_MB);
    expect(peaks[1] - peaks[0]).toBeLessThan(GROWTH_LIMIT_MB);
  }, 600_000);
});
