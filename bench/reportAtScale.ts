/**
 * `candela report` at scale: the peak memory and wall time of summarizing
 * an ensemble run whose chain record is 1 GB and 10 GB (synthetic steps in
 * the layout of a real run, bench/support/syntheticChainRecord.ts; the
 * template is a short fit of the Pantheon 2018 binned Hubble diagram,
 * ../shared/data-real/pantheon2018), each report in its own process, under
 * the default chain budget (output.chain_memory_mb unset: 1,024 MB). The
 * naive baseline is the 1 GB run read whole (`--chain-memory` far above its
 * size), which is what every run cost before the budget; a 10 GB run read
 * whole would need about 25 GB. CANDELA_BENCH_RECORD_GB (e.g. "1,4")
 * replaces the sizes. Keys are documented in bench/README.md.
 */
import { execFile } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { runFit } from '../src/pipeline/index.js';
import { recordStepBytesOf, syntheticAcceptance, writeSyntheticRecordRun } from './support/syntheticChainRecord.js';
import type { BenchSuite } from './suite.js';
import { pantheonBinnedConfig } from '../test/support/pantheonBinnedConfig.js';

const SCRATCH = resolve('out', 'bench-report-at-scale');
/** Record sizes measured, GB (2^30 bytes). */
const SIZES_GB = (process.env.CANDELA_BENCH_RECORD_GB ?? '1,10').split(',').map(Number).filter((gb) => gb > 0);
/** --chain-memory of the naive baseline, MB: above any table the 1 GB run gives, so every step is read. */
const WHOLE_READ_MB = 64 * 1024;

function templateConfig(dir: string): string {
  return pantheonBinnedConfig({
    title: 'report at scale: template', seed: 5,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 32, ensembles: 4, max_steps: 400, check_every: 200, checkpoint_every: 200, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${dir}, figures: [], png: false }`,
  });
}

/** `candela report DIR [...]` in its own process: wall seconds and peak RSS (getrusage ru_maxrss), MB. */
function reportInChild(dir: string, extra: string[]): Promise<{ wallS: number; peakRssMb: number }> {
  const mainUrl = pathToFileURL(resolve('dist/src/cli/main.js')).href;
  const script = `const { main } = await import(${JSON.stringify(mainUrl)}); const code = await main(${JSON.stringify(['report', dir, ...extra])}); process.stderr.write('\\npeak-rss-kb ' + process.resourceUsage().maxRSS + '\\n'); process.exitCode = code;`;
  const started = process.hrtime.bigint();
  return new Promise((done, fail) => {
    execFile(process.execPath, ['--input-type=module', '-e', script], { maxBuffer: 64 * 1024 * 1024 }, (error, _stdout, stderr) => {
      if (error) { fail(new Error(`report on ${dir} failed: ${stderr}`)); return; }
      done({ wallS: Number(process.hrtime.bigint() - started) / 1e9, peakRssMb: Number(/peak-rss-kb (\d+)/.exec(stderr)?.[1]) / 1024 });
    });
  });
}

export const suite: BenchSuite = {
  name: 'report_at_scale',
  async run() {
    rmSync(SCRATCH, { recursive: true, force: true });
    mkdirSync(SCRATCH, { recursive: true });
    const configPath = join(SCRATCH, 'template.yaml');
    writeFileSync(configPath, templateConfig(join(SCRATCH, 'template')));
    const [template] = await runFit({ configPath, onLine: () => undefined });
    const stepBytes = recordStepBytesOf(template.runDir);
    const out: Record<string, number | string> = { template: 'flat wCDM on Pantheon 2018 binned, 4 ensembles x 32 walkers', step_bytes: stepBytes };
    const measure = async (label: string, gb: number, extra: string[]) => {
      const steps = Math.floor((gb * 2 ** 30) / stepBytes);
      const dir = join(SCRATCH, label);
      process.stdout.write(`  ${label}: writing a ${gb} GB chain record (${steps} steps)\n`);
      writeSyntheticRecordRun(template.runDir, dir, steps, null);
      const { wallS, peakRssMb } = await reportInChild(dir, extra);
      const summary = JSON.parse(readFileSync(join(dir, 'summary.json'), 'utf8')) as { convergence: { acceptance_mean: number }; warnings: Array<{ code: string; numbers?: Record<string, number> }> };
      const stride = summary.warnings.find((w) => w.code === 'chains_thinned_to_fit_memory')?.numbers?.step_stride ?? 1;
      out[`${label}_steps`] = steps;
      out[`${label}_wall_s`] = Number(wallS.toFixed(1));
      out[`${label}_peak_rss_mb`] = Math.round(peakRssMb);
      out[`${label}_step_stride`] = stride;
      out[`${label}_acceptance_exact`] = Math.abs(summary.convergence.acceptance_mean - syntheticAcceptance(steps)) < 1e-12 ? 'yes' : 'no';
      rmSync(dir, { recursive: true, force: true });
      return peakRssMb;
    };
    const naive = await measure('whole_read_1gb', 1, ['--chain-memory', String(WHOLE_READ_MB)]);
    for (const gb of SIZES_GB) {
      const peak = await measure(`budget_${gb}gb`, gb, []);
      if (gb === 1) out.whole_over_budget_peak_rss_ratio = Number((naive / peak).toFixed(2));
    }
    rmSync(SCRATCH, { recursive: true, force: true });
    return out;
  },
};
