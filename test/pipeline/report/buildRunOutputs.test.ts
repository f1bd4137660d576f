import { cpSync, existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { buildRunOutputs, writeRunOutputsUnlessStopped } from '../../../src/pipeline/report/buildRunOutputs.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// The outputs a fit writes as it ends, with the event loop turned between the summaries and each figure so that a
// Ctrl-C after the sampling is seen while the figures are drawn. Data: the Pantheon 2018 binned Hubble diagram
// (Scolnic et al. 2018, ../shared/data-real/pantheon2018); short chains, the test checks which files are written.
const scratch = useScratchFolder('run-outputs-unless-stopped');
let outcome: FitOutcome;

beforeAll(async () => {
  writeFileSync(join(scratch, 'fit.yaml'), pantheonBinnedConfig({
    title: 'outputs unless stopped', seed: 4, models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 300, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'fit')}, figures: [triangle, hubble, trace], png: false }`,
  }));
  [outcome] = await runFit({ configPath: join(scratch, 'fit.yaml') });
}, 120_000);

/** Every file of a folder, by path relative to it. */
function filesOf(dir: string, prefix = ''): string[] {
  return readdirSync(join(dir, prefix), { withFileTypes: true }).flatMap((entry) => (entry.isDirectory() ? filesOf(dir, join(prefix, entry.name)) : [join(prefix, entry.name)])).sort();
}

describe('writeRunOutputsUnlessStopped', () => {
  it('without a stop writes what buildRunOutputs writes, byte for byte', async () => {
    const copy = join(scratch, 'copy');
    cpSync(outcome.runDir, copy, { recursive: true });
    expect(await writeRunOutputsUnlessStopped(copy, new AbortController().signal)).toBe(true);
    buildRunOutputs([outcome.runDir], outcome.runDir);
    const files = filesOf(outcome.runDir);
    expect(filesOf(copy)).toEqual(files);
    for (const file of files) expect(readFileSync(join(copy, file)).equals(readFileSync(join(outcome.runDir, file))), file).toBe(true);
  });

  it('once stopped writes the summaries and leaves the figures still to draw and report.html out', async () => {
    const stopped = join(scratch, 'stopped');
    cpSync(outcome.runDir, stopped, { recursive: true, filter: (path) => !/report\.html$|[/\\]figures[/\\]/.test(path) });
    const controller = new AbortController();
    controller.abort();
    expect(await writeRunOutputsUnlessStopped(stopped, controller.signal)).toBe(false);
    expect(existsSync(join(stopped, 'summary.json'))).toBe(true);
    expect(existsSync(join(stopped, 'report.html'))).toBe(false);
    expect(readdirSync(join(stopped, 'figures'))).toEqual([]);
    // null: the run itself was interrupted, so the summaries only, without drawing anything.
    expect(await writeRunOutputsUnlessStopped(stopped, null)).toBe(false);
    expect(existsSync(join(stopped, 'report.html'))).toBe(false);
  });
});
