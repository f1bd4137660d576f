import { spawnSync } from 'node:child_process';
import { closeSync, copyFileSync, mkdirSync, openSync, readFileSync, rmSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runFit } from '../../../src/pipeline/index.js';
import { analyzeRun } from '../../../src/pipeline/report/analyzeRun.js';
import { chainStepStride, readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';

// readRunFolder keeps a run's chains within a memory budget: a run whose every step would take more is read
// every k-th step (the acceptance still over every step). Checked on a short fit of the Pantheon 2018 binned
// Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018) read whole and thinned, and on synthetic
// chain records of two sizes written in the layout of that run, whose peak memory must not follow the file size.
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

/**
 * A copy of the run folder whose chain record holds `steps` synthetic steps in the record layout (header copied):
 * every walker's coordinates follow an AR(1) process (coefficient 0.9) and stay put on a refused move (probability
 * 0.7, a fixed pattern of 10 steps), so that each walker's acceptance is exactly 3 / 10 of its moves. The stored
 * configuration sets `output.chain_memory_mb`.
 */
function syntheticRecordRun(name: string, steps: number, memoryMb: number): string {
  const dir = join(scratch, name);
  mkdirSync(dir, { recursive: true });
  const record = JSON.parse(readFileSync(join(runDir, 'run.json'), 'utf8'));
  record.run.steps = steps;
  record.run.burn_in_steps = Math.floor(steps / 10);
  record.chains_csv = { keep: 'after_burn_in', first_step: record.run.burn_in_steps, every_steps: 1000, steps: 1 };
  record.configuration.output.chain_memory_mb = memoryMb;
  writeFileSync(join(dir, 'run.json'), JSON.stringify(record));
  for (const file of ['config.resolved.yaml', 'hubble_diagram.csv', 'hubble_model.csv', 'chains.csv']) copyFileSync(join(runDir, file), join(dir, file));
  const header = readFileSync(join(runDir, 'chain-record.bin')).subarray(0, 32);
  const [ensembles, walkers, dimension, blobCount] = [0, 1, 2, 3].map((k) => header.readUInt32LE(8 + 4 * k));
  const perWalker = dimension + 1 + blobCount;
  const BLOCK = 4096;
  const state = new Float64Array(ensembles * walkers * perWalker);
  let seed = 987654321;
  const uniform = () => { seed ^= seed << 13; seed >>>= 0; seed ^= seed >>> 17; seed ^= seed << 5; seed >>>= 0; return seed / 4294967296; }; // xorshift32 (Marsaglia 2003)
  const descriptor = openSync(join(dir, 'chain-record.bin'), 'w');
  try {
    writeSync(descriptor, header);
    for (let from = 0; from < steps; from += BLOCK) {
      const count = Math.min(BLOCK, steps - from);
      const block = new Float64Array(count * ensembles * walkers * perWalker);
      for (let s = 0; s < count; s++) {
        const moved = [1, 4, 8].includes((from + s) % 10);
        for (let k = 0; k < ensembles; k++) {
          for (let w = 0; w < walkers; w++) {
            const slot = k * walkers + w;
            if (moved || from + s === 0) {
              for (let d = 0; d < perWalker; d++) state[slot * perWalker + d] = 0.9 * state[slot * perWalker + d] + 0.75 * (2 * uniform() - 1);
            }
            const base = (s * ensembles + k) * walkers * perWalker;
            for (let d = 0; d < dimension; d++) block[base + w * dimension + d] = 0.3 + 0.02 * state[slot * perWalker + d];
            block[base + walkers * dimension + w] = -10 + state[slot * perWalker + dimension];
            for (let b = 0; b < blobCount; b++) block[base + walkers * (dimension + 1) + w * blobCount + b] = -5 + state[slot * perWalker + dimension + 1 + b];
          }
        }
      }
      writeSync(descriptor, Buffer.from(block.buffer));
    }
  } finally {
    closeSync(descriptor);
  }
  return dir;
}

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
    const shapeBytes = statSync(join(runDir, 'chain-record.bin')).size - 32;
    const stepBytes = shapeBytes / 1200;
    const peaks = [170, 700].map((mb) => {
      const steps = Math.floor((mb * 2 ** 20) / stepBytes);
      const dir = syntheticRecordRun(`record-${mb}`, steps, BUDGET_MB);
      const peak = reportPeakMb(dir);
      const summary = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8'));
      console.info(`report on a ${mb} MB chain record (${steps.toLocaleString('en')} steps) under a ${BUDGET_MB} MB chain budget: peak RSS ${peak.toFixed(0)} MB`);
      // Steps 1..steps-1 of every walker: a move on 3 of every 10 (steps 1, 4, 8 mod 10), counted exactly.
      let moves = 0;
      for (let s = 1; s < steps; s++) if ([1, 4, 8].includes(s % 10)) moves++;
      expect(summary.convergence.acceptance_mean).toBeCloseTo(moves / (steps - 1), 12);
      expect(summary.warnings.some((w: { code: string }) => w.code === 'chains_thinned_to_fit_memory')).toBe(true);
      rmSync(join(dir, 'chain-record.bin'));
      return peak;
    });
    expect(Math.max(...peaks)).toBeLessThan(PEAK_RSS_LIMIT_MB);
    expect(peaks[1] - peaks[0]).toBeLessThan(GROWTH_LIMIT_MB);
  }, 600_000);
});
