/**
 * Fit benchmark: the wall time of a full flat w0waCDM fit (Omega_m, w0, wa;
 * offset marginalized) of the dense 1,829-supernova sample until bulk ESS
 * >= 2,000 for every parameter (R-hat reported), each variant in its own
 * process (bench/cases/fitCase.ts): the stretch move alone in process, and
 * with a differential-evolution share of 0.2 in process and with 2 workers
 * (this thread and one worker thread sharing every batch). The wall time is split into set-up, walker start, evaluation,
 * sampler overhead and diagnostics. Keys are documented in bench/README.md.
 */
import { runChildCase } from './support/childCase.js';
import type { BenchSuite } from './suite.js';

const CASE_SCRIPT = new URL('./cases/fitCase.js', import.meta.url);
/** Steps between convergence checks: the pipeline's default (src/config/defaults.ts). */
const CHECK_EVERY = 500;
/** Differential-evolution share of the tuned variants (sampler.differential_evolution_weight; ter Braak 2006). */
const DIFFERENTIAL_EVOLUTION_WEIGHT = 0.2;
const VARIANTS: Array<{ label: string; workers: number; de: number }> = [
  { label: 'stretch_in_process', workers: 0, de: 0 },
  { label: 'de_in_process', workers: 0, de: DIFFERENTIAL_EVOLUTION_WEIGHT },
  { label: 'de_two_workers', workers: 1, de: DIFFERENTIAL_EVOLUTION_WEIGHT },
];
/** Target of the task (bench/RESULTS.md). */
const TARGET_WALL_S = 30;
const KEYS = [
  'reached', 'wall_s', 'setup_s', 'walker_start_s', 'evaluation_s', 'sampler_overhead_s', 'diagnostics_s', 'steps', 'burn_in_steps',
  'calls', 'checks', 'min_bulk_ess', 'max_rhat', 'max_tau_steps', 'mean_acceptance', 'peak_rss_mb',
];

export const suite: BenchSuite = {
  name: 'fit',
  async run() {
    const out: Record<string, number | string> = { model: 'flat w0waCDM, 1,829 supernovae, dense C, offset marginalized (compressed path), 4 x 32 walkers', check_every: CHECK_EVERY };
    for (const { label, workers, de } of VARIANTS) {
      process.stdout.write(`  fit ${label}\n`);
      const local = workers > 0 ? ['--local', '1'] : []; // as the pipeline runs --workers 2: this thread + 1 worker thread
      const report = await runChildCase(CASE_SCRIPT, ['--workers', String(workers), ...local, '--check-every', String(CHECK_EVERY), '--stop', 'ess', '--de', String(de)]);
      for (const key of KEYS) {
        const value = report[key];
        if (typeof value === 'number' || typeof value === 'string') out[`${label}_${key}`] = value;
      }
    }
    const summary = VARIANTS.map(({ label }) => {
      const seconds = Number(out[`${label}_wall_s`]);
      const met = out[`${label}_reached`] === 'yes' && seconds <= TARGET_WALL_S;
      return `${label} ${met ? 'met' : 'not met'} (${seconds.toFixed(1)} s)`;
    });
    out.target_fit_30_s = summary.join('; ');
    return out;
  },
};
