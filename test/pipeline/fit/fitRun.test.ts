import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildRunOutputs, runFit } from '../../../src/pipeline/index.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { isCandelaError } from '../../../src/errors.js';

// End-to-end runs of `candela fit` on the Pantheon 2018 binned Hubble diagram
// (../shared/data-real/pantheon2018, Scolnic et al. 2018) with short chains:
// they check run control (determinism across worker counts, resume, refusal
// to overwrite, report reproducibility), not the posterior itself.
const scratch = resolve('.candela-tmp/fit-run');

function writeConfig(name: string, extra: { maxSteps: number; workers: number }): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'run-control test', seed: 11,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: `{ walkers: 8, ensembles: 2, max_steps: ${extra.maxSteps}, check_every: 50, checkpoint_every: 50, target_ess: 1000000, workers: ${extra.workers} }`,
    output: `{ dir: ${join(scratch, name)}, figures: [triangle, hubble, trace], png: false }`,
  }));
  return path;
}

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('runFit', () => {
  it('writes byte-identical chains with 1, 2 and 3 workers for the same seed', async () => {
    const [one] = await runFit({ configPath: writeConfig('one', { maxSteps: 150, workers: 1 }) });
    const [two] = await runFit({ configPath: writeConfig('two', { maxSteps: 150, workers: 2 }) });
    const [three] = await runFit({ configPath: writeConfig('three', { maxSteps: 150, workers: 3 }) });
    const a = readFileSync(join(one.runDir, 'chains.csv'));
    expect(a.length).toBeGreaterThan(1000);
    expect(a.equals(readFileSync(join(two.runDir, 'chains.csv')))).toBe(true); // this thread + 1 worker thread
    expect(a.equals(readFileSync(join(three.runDir, 'chains.csv')))).toBe(true); // this thread + 2 (more threads than cores here)
    expect(one.record.run.stop_reason).toBe('max_steps');
    for (const file of ['summary.json', 'summary.md', 'table.tex', 'report.html', 'figures/triangle.svg', 'figures/hubble.svg', 'figures/trace.svg', 'contours/omega_m__w0.geojson', 'marginals/w0.csv']) {
      expect(existsSync(join(one.runDir, file)), file).toBe(true);
    }
  });

  it('resumes an interrupted run into exactly the chains of an uninterrupted one', async () => {
    const straight = writeConfig('straight', { maxSteps: 200, workers: 1 });
    await runFit({ configPath: straight });
    const interruptedPath = writeConfig('interrupted', { maxSteps: 200, workers: 1 });
    const controller = new AbortController();
    await runFit({ configPath: interruptedPath, signal: controller.signal, onProgress: (p) => { if (p.step >= 100) controller.abort(); } });
    const partial = readFileSync(join(scratch, 'interrupted', 'chains.csv'), 'utf8').trim().split('\n').length - 1;
    expect(partial).toBeLessThan(200 * 16);
    await runFit({ configPath: interruptedPath, resume: true });
    const a = readFileSync(join(scratch, 'straight', 'chains.csv'));
    const b = readFileSync(join(scratch, 'interrupted', 'chains.csv'));
    expect(a.equals(b)).toBe(true);
  });

  it('refuses to overwrite an existing run folder without --force and leaves it untouched', async () => {
    const path = writeConfig('one', { maxSteps: 150, workers: 1 });
    const before = readdirSync(join(scratch, 'one')).sort();
    const chains = readFileSync(join(scratch, 'one', 'chains.csv'));
    await expect(runFit({ configPath: path })).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues[0].code === 'run.folder_not_empty' && /--force/.test(error.issues[0].fix ?? ''));
    expect(readdirSync(join(scratch, 'one')).sort()).toEqual(before);
    expect(readFileSync(join(scratch, 'one', 'chains.csv')).equals(chains)).toBe(true);
  });

  it('rebuilds every output of a finished run byte for byte with report', () => {
    const runDir = join(scratch, 'one');
    const files = ['summary.json', 'summary.md', 'table.tex', 'report.html', 'figures/triangle.svg', 'figures/hubble.svg', 'contours/omega_m__w0.grid.csv', 'contours/omega_m__w0.geojson', 'marginals/omega_m.csv'];
    const before = files.map((file) => readFileSync(join(runDir, file)));
    const copy = join(scratch, 'rebuilt');
    buildRunOutputs([runDir], copy);
    files.forEach((file, k) => expect(readFileSync(join(copy, file)).equals(before[k]), file).toBe(true));
  });

  it('stops on bad input before touching an existing output folder', async () => {
    const path = writeConfig('one', { maxSteps: 150, workers: 1 });
    const broken = readFileSync(path, 'utf8').replace('magnitude_err: dmb', 'magnitude_err: dmb_missing');
    writeFileSync(path, broken);
    const chains = readFileSync(join(scratch, 'one', 'chains.csv'));
    await expect(runFit({ configPath: path, force: true })).rejects.toSatisfy((error: unknown) => isCandelaError(error) && error.issues.some((issue) => /dmb_missing/.test(issue.message + (issue.found ?? ''))));
    expect(readFileSync(join(scratch, 'one', 'chains.csv')).equals(chains)).toBe(true);
  });
});
