/**
 * Sampler benchmark: log-posterior calls per second and bulk ESS per second
 * for flat w0waCDM on the dense 1,829-supernova sample (compressed path),
 * evaluated in process, by a pool of 1 and of 2 worker threads, and as the
 * pipeline runs `--workers 2` (this thread and 1 worker thread sharing every
 * batch); each in its own process (bench/cases/samplerCase.ts). The sampler overhead
 * per step is the wall time of `advance` minus the time inside the
 * evaluator, compared with the evaluator time (the compressed path's
 * likelihood and prior). The messaging cost of the pool is measured apart,
 * with a model that costs nothing (bench/cases/poolRoundTripCase.ts).
 * Keys are documented in bench/README.md.
 */
import { runChildCase, type CaseReport } from './support/childCase.js';
import type { BenchSuite } from './suite.js';

const CASE_SCRIPT = new URL('./cases/samplerCase.js', import.meta.url);
const ROUND_TRIP_SCRIPT = new URL('./cases/poolRoundTripCase.js', import.meta.url);
/** Points per batch: the sampler evaluates half of the 32 walkers of each of the 4 ensembles at once. */
const BATCH_POINTS = 64;
const VARIANTS: Array<{ label: string; workers: number; local: boolean }> = [
  { label: 'in_process', workers: 0, local: false },
  { label: 'pool1', workers: 1, local: false },
  { label: 'pool2', workers: 2, local: false },
  { label: 'two_workers', workers: 1, local: true },
];
const BURN_STEPS = 200;
const TIMED_STEPS = 1000;
/** Repeats of each variant; medians are reported (the machine is shared). */
const REPEATS = 3;
/** Targets of the task (bench/RESULTS.md). */
const TARGET_TWO_WORKER_RATIO = 1.7;
const TARGET_OVERHEAD_SHARE = 0.05;

const KEYS = ['calls_per_second', 'min_bulk_ess', 'min_bulk_ess_per_second', 'ms_per_call_in_evaluator', 'sampler_overhead_ms_per_step', 'sampler_overhead_share_of_evaluation', 'setup_ms', 'peak_rss_mb'];

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

export const suite: BenchSuite = {
  name: 'sampler',
  async run() {
    const out: Record<string, number | string> = { model: 'flat w0waCDM, 1,829 supernovae, dense C, offset marginalized (compressed path), 4 x 32 walkers', burn_steps: BURN_STEPS, timed_steps: TIMED_STEPS, repeats: REPEATS };
    const medians: Record<string, Record<string, number>> = {};
    const reports = new Map<string, CaseReport[]>(VARIANTS.map(({ label }) => [label, []]));
    const argsOf = ({ workers, local }: { workers: number; local: boolean }): string[] => ['--workers', String(workers), ...(local ? ['--local', '1'] : [])];
    const timedArgs = ['--burn', String(BURN_STEPS), '--steps', String(TIMED_STEPS)];
    // Repeats interleave the variants, so that a slow phase of the shared machine hits every variant alike.
    const ceiling: number[] = [];
    for (let repeat = 0; repeat < REPEATS; repeat++) {
      for (const variant of VARIANTS) {
        process.stdout.write(`  sampler ${variant.label} (repeat ${repeat + 1} of ${REPEATS})\n`);
        reports.get(variant.label)!.push(await runChildCase(CASE_SCRIPT, [...argsOf(variant), ...timedArgs]));
      }
      // The machine's own ceiling for two busy threads: two independent in-process runs at once.
      process.stdout.write(`  sampler two independent processes (repeat ${repeat + 1} of ${REPEATS})\n`);
      const pair = await Promise.all([0, 1].map(() => runChildCase(CASE_SCRIPT, ['--workers', '0', ...timedArgs])));
      ceiling.push(pair.reduce((sum, report) => sum + Number(report.calls_per_second), 0));
    }
    for (const variant of VARIANTS) {
      const { label } = variant;
      const list = reports.get(label)!;
      medians[label] = {};
      for (const key of KEYS) {
        medians[label][key] = median(list.map((report) => Number(report[key])));
        out[`${label}_${key}`] = medians[label][key];
      }
      out[`${label}_calls_per_second_min`] = Math.min(...list.map((report) => Number(report.calls_per_second)));
      out[`${label}_calls_per_second_max`] = Math.max(...list.map((report) => Number(report.calls_per_second)));
      const roundTrip = await runChildCase(ROUND_TRIP_SCRIPT, [...argsOf(variant), '--batch', String(BATCH_POINTS)]);
      out[`${label}_round_trip_ms_per_batch`] = Number(roundTrip.ms_per_batch);
    }
    out.two_processes_calls_per_second = median(ceiling);
    out.ratio_two_processes_over_in_process = median(ceiling) / medians.in_process.calls_per_second;
    out.ratio_two_workers_over_two_processes = medians.two_workers.calls_per_second / median(ceiling);
    const twoOverOne = medians.two_workers.calls_per_second / medians.in_process.calls_per_second;
    out.ratio_two_workers_over_in_process = twoOverOne;
    out.ratio_pool2_over_in_process = medians.pool2.calls_per_second / medians.in_process.calls_per_second;
    out.ratio_pool2_over_pool1 = medians.pool2.calls_per_second / medians.pool1.calls_per_second;
    out.target_two_workers_1_7x = `${twoOverOne >= TARGET_TWO_WORKER_RATIO ? 'met' : 'not met'} (${twoOverOne.toFixed(2)}x over in process; ` +
      `2 threads ${Number(out.ratio_pool2_over_pool1).toFixed(2)}x over 1 thread)`;
    const share = medians.in_process.sampler_overhead_share_of_evaluation;
    out.target_overhead_5_percent = `${share < TARGET_OVERHEAD_SHARE ? 'met' : 'not met'} (${(100 * share).toFixed(1)}% of the compressed-path evaluation time)`;
    return out;
  },
};
