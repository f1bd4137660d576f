/**
 * Hierarchical-likelihood benchmark: time per call of the hierarchical
 * (latent stretch and colour) supernova term with K = 20 systematic modes on
 * m_B through the Woodbury identity, beside the same term without modes and
 * beside the dense 3N x 3N path that takes the same U U^T as a matrix. The
 * dense path runs at N = 600 (3N = 1,800) only; at N = 10,000 its cost is
 * extrapolated as (3N)^3 from there, as the likelihood suite does for the
 * conventional general path. Each case in its own process
 * (bench/cases/hierarchicalCase.ts). Keys are documented in bench/README.md.
 */
import { runChildCase, type CaseReport } from './support/childCase.js';
import type { BenchSuite } from './suite.js';

const CASE_SCRIPT = new URL('./cases/hierarchicalCase.js', import.meta.url);
/** K of the target. */
const MODE_COUNT = 20;
/** Where the dense 3N x 3N path is measured (a 1,800 x 1,800 Cholesky per call), and the target size. */
const DENSE_COUNT = 600;
const TARGET_COUNT = 10_000;

type Results = Record<string, number | string>;

function maxRelativeDelta(a: CaseReport | undefined, b: CaseReport | undefined): number | string {
  const first = a?.log_likelihood_at_reference;
  const second = b?.log_likelihood_at_reference;
  if (!Array.isArray(first) || !Array.isArray(second)) return 'not run';
  return Math.max(...first.map((value, i) => Math.abs(Number(value) - Number(second[i])) / Math.abs(Number(second[i]))));
}

async function runCases(count: number, kinds: string[], out: Results): Promise<Map<string, CaseReport>> {
  const reports = new Map<string, CaseReport>();
  for (const kind of kinds) {
    process.stdout.write(`  hierarchical N = ${count}: ${kind}\n`);
    try {
      const report = await runChildCase(CASE_SCRIPT, ['--kind', kind, '--count', String(count), '--modes', String(MODE_COUNT)]);
      reports.set(kind, report);
      for (const key of ['ms_per_call', 'min_ms', 'repeats', 'first_call_ms', 'setup_ms', 'peak_rss_mb']) {
        const value = report[key];
        if (typeof value === 'number') out[`n${count}_${kind}_${key}`] = value;
      }
    } catch (error) {
      const reason = error instanceof Error ? error.message.split('\n').find((line) => /error|Error/.test(line)) ?? error.message : String(error);
      out[`n${count}_${kind}_status`] = `failed: ${reason.slice(0, 200)}`;
    }
  }
  return reports;
}

const ratio = (slow: CaseReport | undefined, fast: CaseReport | undefined): number | string =>
  typeof slow?.ms_per_call === 'number' && typeof fast?.ms_per_call === 'number' ? slow.ms_per_call / fast.ms_per_call : 'not run';

export const suite: BenchSuite = {
  name: 'hierarchical',
  async run() {
    const out: Results = { mode_count: MODE_COUNT };
    const small = await runCases(DENSE_COUNT, ['blocks', 'modes', 'dense'], out);
    out[`n${DENSE_COUNT}_max_relative_delta_log_likelihood_modes_vs_dense`] = maxRelativeDelta(small.get('modes'), small.get('dense'));
    out[`n${DENSE_COUNT}_ratio_dense_over_modes`] = ratio(small.get('dense'), small.get('modes'));
    const large = await runCases(TARGET_COUNT, ['blocks', 'modes', 'interleaved'], out);
    const pair = large.get('interleaved');
    for (const key of ['blocks_ms_per_call', 'blocks_min_ms', 'modes_ms_per_call', 'modes_min_ms']) {
      if (typeof pair?.[key] === 'number') out[`n${TARGET_COUNT}_interleaved_${key}`] = pair[key] as number;
    }
    out[`n${TARGET_COUNT}_ratio_modes_over_blocks`] = typeof pair?.modes_ms_per_call === 'number' && typeof pair.blocks_ms_per_call === 'number'
      ? pair.modes_ms_per_call / pair.blocks_ms_per_call : ratio(large.get('modes'), large.get('blocks'));
    const dense = small.get('dense')?.ms_per_call;
    if (typeof dense === 'number') {
      // Each dense call factorizes the 3N x 3N covariance: cost grows as (3N)^3 (memory 2 (3N)^2 doubles, 14 GB at N = 10,000).
      const extrapolated = dense * (TARGET_COUNT / DENSE_COUNT) ** 3;
      out[`n${TARGET_COUNT}_dense_ms_per_call_extrapolated`] = extrapolated;
      const modes = large.get('modes')?.ms_per_call;
      out[`n${TARGET_COUNT}_ratio_dense_extrapolated_over_modes`] = typeof modes === 'number' ? extrapolated / modes : 'not run';
    }
    return out;
  },
};
