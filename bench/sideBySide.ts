/**
 * Side-by-side benchmark: the wall time of `candela fit` on a configuration
 * with three models (configs/pantheon2018-binned.yaml: flat and curved
 * LambdaCDM and flat wCDM on the Pantheon 2018 binned Hubble diagram, to
 * their own targets, figures included) with a budget of 2 worker threads,
 * fitted in turn (--in-turn: each model with both threads) and side by side
 * (two models at once with one thread each, the third when one ends). Each
 * run is the real command in a process of its own; the repeats alternate
 * (in turn, side by side, then again), so that a busy machine slows both
 * alike; medians are reported, and the chains of both ways are compared byte
 * for byte. Keys are documented in bench/README.md.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { quantileOfDraws } from '../src/math/index.js';
import type { BenchSuite } from './suite.js';

const COMMAND = fileURLToPath(new URL('../src/cli/main.js', import.meta.url));
const CONFIG = fileURLToPath(new URL('../../configs/pantheon2018-binned.yaml', import.meta.url));
const MODELS = ['flat_lcdm', 'curved_lcdm', 'flat_wcdm'];
/** The thread budget: this project's machine has 2 cores. */
const WORKERS = 2;
/** Runs of each way, alternated. */
const REPEATS = 2;
const WAYS = [
  { label: 'in_turn', extra: ['--in-turn'] },
  { label: 'side_by_side', extra: [] },
] as const;

/** Runs `candela fit` once into `out`; resolves with the wall seconds. */
function timedFit(out: string, extra: readonly string[]): Promise<number> {
  const started = process.hrtime.bigint();
  return new Promise((resolve, reject) => {
    execFile(process.execPath, [COMMAND, 'fit', CONFIG, '--out', out, '--force', '--quiet', '--workers', String(WORKERS), ...extra], { maxBuffer: 64 * 1024 * 1024 }, (error, _stdout, stderr) => {
      if (error) reject(new Error(`candela fit ${extra.join(' ')} failed: ${error.message}\n${stderr}`));
      else resolve(Number(process.hrtime.bigint() - started) / 1e9);
    });
  });
}

const median = (values: number[]) => quantileOfDraws(values, 0.5);

export const suite: BenchSuite = {
  name: 'side_by_side',
  async run() {
    const scratch = mkdtempSync(join(tmpdir(), 'candela-bench-side-by-side-'));
    try {
      const seconds: Record<string, number[]> = { in_turn: [], side_by_side: [] };
      for (let repeat = 0; repeat < REPEATS; repeat++) {
        for (const way of WAYS) {
          process.stdout.write(`  side_by_side ${way.label} ${repeat + 1}/${REPEATS}\n`);
          seconds[way.label].push(await timedFit(join(scratch, way.label), way.extra));
        }
      }
      const identical = MODELS.every((label) => ['chains.csv', 'chain-record.bin'].every((file) =>
        readFileSync(join(scratch, 'in_turn', label, file)).equals(readFileSync(join(scratch, 'side_by_side', label, file)))));
      const out: Record<string, number | string> = {
        configuration: 'configs/pantheon2018-binned.yaml (3 models, 4 x 32 walkers, bulk ESS >= 2000, R-hat <= 1.01, figures)',
        workers: WORKERS, cores: availableParallelism(), repeats: REPEATS,
      };
      for (const way of WAYS) {
        out[`${way.label}_wall_s`] = Number(median(seconds[way.label]).toFixed(2));
        out[`${way.label}_min_s`] = Number(Math.min(...seconds[way.label]).toFixed(2));
        out[`${way.label}_max_s`] = Number(Math.max(...seconds[way.label]).toFixed(2));
      }
      out.ratio_in_turn_over_side_by_side = Number((median(seconds.in_turn) / median(seconds.side_by_side)).toFixed(3));
      out.chains_identical = identical ? 'yes' : 'no';
      return out;
    } finally {
      rmSync(scratch, { recursive: true, force: true });
    }
  },
};
