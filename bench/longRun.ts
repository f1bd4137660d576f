/**
 * Long-run memory benchmark: the peak resident set of 200,000 steps of 4 x 32
 * walkers in 3 parameters (a model that costs nothing, so the sampler's own
 * storage is what is measured), once with the steps written to a chain record
 * and released from memory every 25 steps (what `candela fit` does) and once
 * with every step kept in memory; each in its own process
 * (bench/cases/longRunCase.ts). Also the autocorrelation time from the
 * sampler's bounded, thinned traces against the one from the whole chain.
 * Keys are documented in bench/README.md.
 */
import { runChildCase } from './support/childCase.js';
import type { BenchSuite } from './suite.js';

const CASE_SCRIPT = new URL('./cases/longRunCase.js', import.meta.url);
const STEPS = 200_000;

export const suite: BenchSuite = {
  name: 'long_run',
  async run() {
    const out: Record<string, number | string> = { model: '3-D standard normal (costs nothing), 4 x 32 walkers', steps: STEPS };
    for (const keep of ['bounded', 'all']) {
      process.stdout.write(`  long run, steps kept: ${keep}\n`);
      const report = await runChildCase(CASE_SCRIPT, ['--steps', String(STEPS), '--keep', keep]);
      for (const key of ['peak_rss_mb', 'wall_s', 'diagnostics_ms_total', 'checks', 'trace_steps', 'trace_stride', 'max_tau_from_trace_steps', 'max_tau_from_whole_chain_steps', 'record_mb', 'held_steps_at_end']) {
        const value = report[key];
        if (typeof value === 'number') out[`${keep}_${key}`] = value;
      }
    }
    return out;
  },
};
