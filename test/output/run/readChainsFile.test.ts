import { spawnSync } from 'node:child_process';
import { closeSync, copyFileSync, mkdirSync, openSync, readFileSync, rmSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runFit } from '../../../src/pipeline/index.js';
import { readChainsFile } from '../../../src/output/run/chainsFile.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';

// Reading chains.csv back: a damaged file is refused (never summarized as if whole), and a file far larger than
// one JavaScript string (about 512 MB in Node.js) is read as a stream. The run folder comes from a short fit of the
// Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018).
const scratch = resolve('.candela-tmp/read-chains');
let runDir = '';
let chainsText = '';

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  const config = join(scratch, 'fit.yaml');
  writeFileSync(config, pantheonBinnedConfig({
    title: 'chains reader test', seed: 8,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 200, check_every: 100, checkpoint_every: 100, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'run')}, figures: [], png: false, chains: { keep: all } }`, // every step: the file whose damage is tested
  }));
  const [outcome] = await runFit({ configPath: config });
  runDir = outcome.runDir;
  chainsText = readFileSync(join(runDir, 'chains.csv'), 'utf8');
}, 120_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** A copy of the run folder whose chains.csv is `text`. */
function damagedCopy(name: string, text: string): string {
  const dir = join(scratch, name);
  mkdirSync(dir, { recursive: true });
  for (const file of ['run.json', 'config.resolved.yaml', 'hubble_diagram.csv', 'hubble_model.csv']) copyFileSync(join(runDir, file), join(dir, file));
  writeFileSync(join(dir, 'chains.csv'), text);
  return dir;
}

describe('readChainsFile and the run-folder check', () => {
  it('reads every row and value of a whole file exactly (each cell parses back to the written double)', () => {
    const table = readChainsFile(join(runDir, 'chains.csv'));
    const lines = chainsText.trimEnd().split('\n');
    expect(table.rows).toBe(lines.length - 1);
    expect(table.rows).toBe(2 * 8 * 200);
    const last = lines[lines.length - 1].split(',');
    const omegaIndex = table.header.indexOf('omega_m');
    expect(table.columns.omega_m[table.rows - 1]).toBe(Number(last[omegaIndex]));
    expect(String(table.columns.log_posterior[table.rows - 1])).toBe(last[table.header.indexOf('log_posterior')]);
  });

  // A file cut short must not be summarized as the whole run (common practice: a summary states its sample count).
  it('report refuses a file cut at a row boundary: the rows do not cover the steps run.json counts', async () => {
    const lines = chainsText.split('\n');
    const dir = damagedCopy('cut-at-row', `${lines.slice(0, Math.floor(lines.length / 2)).join('\n')}\n`);
    const result = await runCommandLine(['report', dir]);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/does not hold every stored step/);
    expect(result.stderr).toMatch(/3200 rows \(2 ensembles x 200 steps x 8 walkers/);
  });

  it('report refuses a file cut just after a comma, naming the line', async () => {
    const cut = chainsText.indexOf(',', Math.floor(chainsText.length / 2));
    const dir = damagedCopy('cut-after-comma', chainsText.slice(0, cut + 1));
    const result = await runCommandLine(['report', dir]);
    expect(result.code).toBe(2);
    const line = chainsText.slice(0, cut + 1).split('\n').length;
    expect(result.stderr).toContain(`chains.csv:${line}: error: the chains file ends inside a row`);
  });

  it('report refuses a file with a row missing in the middle, and one with a number cut into text', async () => {
    const lines = chainsText.split('\n');
    const missing = damagedCopy('row-missing', [...lines.slice(0, 500), ...lines.slice(501)].join('\n'));
    const gap = await runCommandLine(['report', missing]);
    expect(gap.code).toBe(2);
    expect(gap.stderr).toMatch(/does not hold every stored step/);
    const garbled = [...lines];
    const cells = garbled[700].split(',');
    cells[3] = `x${cells[3]}`; // the omega_m cell
    garbled[700] = cells.join(',');
    const text = await runCommandLine(['report', damagedCopy('not-a-number', garbled.join('\n'))]);
    expect(text.code).toBe(2);
    expect(text.stderr).toMatch(/chains\.csv:701: error: the omega_m cell "x[-\d.e]+" is not a number/);
  });
});

/** A minimal seeded generator (Marsaglia 2003, xorshift32) for the synthetic chains: reproducible, no dependency. */
function xorshift(seed: number): () => number {
  let state = seed >>> 0 || 1;
  return () => {
    state ^= state << 13; state >>>= 0;
    state ^= state >>> 17;
    state ^= state << 5; state >>>= 0;
    return state / 4294967296;
  };
}

/**
 * Writes a synthetic chains.csv of `steps` steps in the layout of the run folder (2 ensembles x 8 walkers, the same
 * columns). The values of every walker follow an AR(1) process with coefficient 0.9 and uniform innovations around
 * the posterior of the short fit, drawn for a block of BLOCK_STEPS steps and repeated with the true step numbers
 * (formatting numbers dominates the cost); the first tenth of the steps is flagged as burn-in. Written in pieces of
 * about 4 MB; nothing holds the whole file.
 */
function writeSyntheticChains(path: string, header: string[], steps: number): void {
  const BLOCK_STEPS = 4096;
  const random = xorshift(20261204);
  const valueCount = header.length - 4;
  const centres = [0.3, -1.0, -0.55, 0.65, 13.5, -0.8, 78.0, 77.2];
  const widths = [0.02, 0.1, 0.05, 0.08, 0.2, 0.3, 1.0, 1.0];
  const block: string[][] = [0, 1].map(() => []);
  for (let ensemble = 0; ensemble < 2; ensemble++) {
    const state = Array.from({ length: 8 }, () => new Float64Array(valueCount));
    for (let step = 0; step < BLOCK_STEPS; step++) {
      for (let walker = 0; walker < 8; walker++) {
        const cells: string[] = [];
        for (let k = 0; k < valueCount; k++) {
          state[walker][k] = 0.9 * state[walker][k] + Math.sqrt(3 * (1 - 0.81)) * (2 * random() - 1);
          cells.push(String(centres[k % centres.length] + widths[k % widths.length] * state[walker][k]));
        }
        block[ensemble].push(cells.join(','));
      }
    }
  }
  const descriptor = openSync(path, 'w');
  try {
    writeSync(descriptor, `${header.join(',')}\n`);
    const burnIn = Math.floor(steps / 10);
    let piece: string[] = [];
    for (let ensemble = 0; ensemble < 2; ensemble++) {
      for (let step = 0; step < steps; step++) {
        const flag = step < burnIn ? '1' : '0';
        for (let walker = 0; walker < 8; walker++) piece.push(`${ensemble},${walker},${step},${block[ensemble][(step % BLOCK_STEPS) * 8 + walker]},${flag}`);
        if (piece.length >= 24_000) { writeSync(descriptor, `${piece.join('\n')}\n`); piece = []; }
      }
    }
    if (piece.length) writeSync(descriptor, `${piece.join('\n')}\n`);
  } finally {
    closeSync(descriptor);
  }
}

/** Runs `candela report` (the built command) in its own process, so that its peak resident set (getrusage ru_maxrss, kB on Linux) is its own. */
function reportInChild(dir: string, out: string, extra: string[], heapMb: number): { seconds: number; peakMb: number } {
  const mainUrl = pathToFileURL(resolve('dist/src/cli/main.js')).href;
  const args = JSON.stringify(['report', dir, '--out', out, ...extra]);
  const script = `const { main } = await import(${JSON.stringify(mainUrl)}); const code = await main(${args}); process.stderr.write('\\npeak-rss-kb ' + process.resourceUsage().maxRSS + '\\n'); process.exitCode = code;`;
  const started = Date.now();
  // A JavaScript heap far smaller than the file: text (strings live on that heap) is only ever held a chunk at a
  // time; the columns are typed arrays, whose memory is outside it and counted in the peak resident set.
  const child = spawnSync(process.execPath, [`--max-old-space-size=${heapMb}`, '--input-type=module', '-e', script], { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  expect(child.status, child.stderr).toBe(0);
  return { seconds: (Date.now() - started) / 1000, peakMb: Number(/peak-rss-kb (\d+)/.exec(child.stderr)?.[1]) / 1024 };
}

type LargeSummary = { parameters: Record<string, { samples: number; mean: number }>; diagnostics: Record<string, { tau: number | null }>; warnings: Array<{ code: string; numbers?: Record<string, number> }> };

describe('report on a chains file larger than one string can hold', () => {
  /** Peak resident memory allowed for summarizing the 600+ MB file with every step, MB: the columns as doubles (8 bytes per value, ~0.5 of the text) plus the copies the summaries make and the Node.js runtime; measured 755-832 MB for 630 MB of text on this project's machine. */
  const PEAK_RSS_LIMIT_MB = 1200;
  /** The same file read within a 64 MB chain budget (every k-th step): the table shrinks k-fold, the runtime and the figures stay; measured 276 MB (this project's machine). */
  const BUDGET_MB = 64;
  const BUDGET_PEAK_RSS_LIMIT_MB = 450;
  /** The child's JavaScript heap limit (--max-old-space-size), MB: less than a third of the file. */
  const HEAP_LIMIT_MB = 192;

  it('summarizes a synthetic 600+ MB chains.csv streamed from disk with a 192 MB JavaScript heap, within the stated peak resident memory, and within a smaller one under a chain budget', async () => {
    const dir = join(scratch, 'large');
    mkdirSync(dir, { recursive: true });
    const record = JSON.parse(readFileSync(join(runDir, 'run.json'), 'utf8')) as { run: { steps: number; burn_in_steps: number } };
    const steps = 250_000;
    record.run.steps = steps;
    record.run.burn_in_steps = Math.floor(steps / 10);
    writeFileSync(join(dir, 'run.json'), JSON.stringify(record));
    for (const file of ['config.resolved.yaml', 'hubble_diagram.csv', 'hubble_model.csv']) copyFileSync(join(runDir, file), join(dir, file));
    const header = chainsText.slice(0, chainsText.indexOf('\n')).split(',');
    writeSyntheticChains(join(dir, 'chains.csv'), header, steps);
    const bytes = statSync(join(dir, 'chains.csv')).size;
    expect(bytes).toBeGreaterThan(600 * 1024 * 1024);

    const whole = reportInChild(dir, join(scratch, 'large-report'), [], HEAP_LIMIT_MB);
    console.info(`report on a ${(bytes / 2 ** 20).toFixed(0)} MB chains.csv (${(2 * 8 * steps).toLocaleString('en')} rows): ${whole.seconds.toFixed(1)} s, peak RSS ${whole.peakMb.toFixed(0)} MB`);
    expect(whole.peakMb).toBeLessThan(PEAK_RSS_LIMIT_MB);
    const summary = JSON.parse(readFileSync(join(scratch, 'large-report', 'summary.json'), 'utf8')) as LargeSummary;
    expect(summary.parameters.omega_m.samples).toBe(2 * 8 * (steps - Math.floor(steps / 10)));
    expect(summary.parameters.omega_m.mean).toBeCloseTo(0.3, 2);
    expect(summary.warnings.map((w) => w.code)).not.toContain('chains_thinned_to_fit_memory');

    // The same file under a 64 MB chain budget: every k-th step is kept, k the smallest stride that fits the table
    // (4,000,000 rows x (8 bytes per value + 13 for the layout columns)); the numbers agree with the whole read and memory drops.
    const budget = reportInChild(dir, join(scratch, 'large-report-budget'), ['--chain-memory', String(BUDGET_MB)], HEAP_LIMIT_MB);
    console.info(`the same with --chain-memory ${BUDGET_MB}: ${budget.seconds.toFixed(1)} s, peak RSS ${budget.peakMb.toFixed(0)} MB`);
    expect(budget.peakMb).toBeLessThan(BUDGET_PEAK_RSS_LIMIT_MB);
    const thinned = JSON.parse(readFileSync(join(scratch, 'large-report-budget', 'summary.json'), 'utf8')) as LargeSummary;
    const warning = thinned.warnings.find((w) => w.code === 'chains_thinned_to_fit_memory');
    const stride = warning?.numbers?.step_stride ?? 0;
    const tableBytes = 2 * 8 * steps * ((header.length - 4) * 8 + 13);
    expect(stride).toBe(Math.ceil(tableBytes / (BUDGET_MB * 2 ** 20)));
    expect(stride).toBeGreaterThan(3);
    expect(thinned.parameters.omega_m.samples).toBe(2 * 8 * (Math.ceil(steps / stride) - Math.ceil(Math.floor(steps / 10) / stride)));
    // The synthetic walkers repeat blocks of 4,096 AR(1) steps (coefficient 0.9, tau = 19 steps): the thinned mean
    // differs from the whole one by far less than the posterior width 0.02 (a kept sixth of a repeated sequence).
    expect(Math.abs(thinned.parameters.omega_m.mean - summary.parameters.omega_m.mean)).toBeLessThan(0.002);
    const [tauWhole, tauThinned] = [summary, thinned].map((s) => s.diagnostics.omega_m.tau as number);
    // tau in steps of the run either way: AR(1) with coefficient 0.9 has tau = (1 + 0.9) / (1 - 0.9) = 19 steps (Sokal 1997).
    expect(tauWhole).toBeGreaterThan(15);
    expect(Math.abs(tauThinned - tauWhole) / tauWhole).toBeLessThan(0.25);
    rmSync(dir, { recursive: true, force: true });
  }, 900_000);
});
