import { existsSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildRunOutputs, runFit } from '../../../src/pipeline/index.js';
import { chainsSelection } from '../../../src/output/run/chainsSelection.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';
import { runCommandLine } from '../../support/runCommandLine.js';

// chains.csv with only the thinned steps after the burn-in: the rows it keeps must be exactly the rows of the full
// file, and the summaries (computed from the chain record, which keeps every step) exactly those of the same run
// written in full. Data: the Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al.
// 2018), a short fit of the same seed twice.
const scratch = useScratchFolder('chains-selection');

function writeConfig(name: string, chains = ''): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'chains selection test', seed: 21,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 600, check_every: 100, checkpoint_every: 100, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, name)}, figures: [triangle, trace], png: false${chains} }`,
  }));
  return path;
}

describe('chainsSelection', () => {
  it('keeps every step, or the steps after the burn-in one in floor(fraction x tau)', () => {
    expect(chainsSelection({ keep: 'all', thinTauFraction: 0.5 }, 1000, 100, 30)).toEqual({ keep: 'all', first_step: 0, every_steps: 1, steps: 1000 });
    expect(chainsSelection({ keep: 'after_burn_in', thinTauFraction: 0.5 }, 1000, 100, 30)).toEqual({ keep: 'after_burn_in', first_step: 100, every_steps: 15, steps: 60 });
    expect(chainsSelection({ keep: 'after_burn_in', thinTauFraction: 0.5 }, 1000, 100, 1.2)).toEqual({ keep: 'after_burn_in', first_step: 100, every_steps: 1, steps: 900 });
    expect(chainsSelection({ keep: 'after_burn_in', thinTauFraction: 1 }, 101, 100, null)).toEqual({ keep: 'after_burn_in', first_step: 100, every_steps: 1, steps: 1 });
  });
});

describe('runFit with chains.csv after the burn-in, thinned', () => {
  it('writes exactly the kept rows of the full file, and the same summaries from the chain record', async () => {
    const [full] = await runFit({ configPath: writeConfig('full', ', chains: { keep: all }') });
    const [thin] = await runFit({ configPath: writeConfig('thin') }); // the default: output.chains { keep: after_burn_in, spacing_tau: 0.5 }
    const record = JSON.parse(readFileSync(join(thin.runDir, 'run.json'), 'utf8')) as { chains_csv: { first_step: number; every_steps: number; steps: number }; run: { burn_in_steps: number } };
    const { first_step: first, every_steps: every, steps } = record.chains_csv;
    expect(first).toBe(record.run.burn_in_steps);
    expect(every).toBeGreaterThan(1);
    const fullLines = readFileSync(join(full.runDir, 'chains.csv'), 'utf8').trimEnd().split('\n');
    const thinLines = readFileSync(join(thin.runDir, 'chains.csv'), 'utf8').trimEnd().split('\n');
    expect(thinLines[0]).toBe(fullLines[0]);
    expect(thinLines.length - 1).toBe(2 * 8 * steps);
    // Row (ensemble k, i-th kept step, walker w) is line (k x 600 + first + i x every) x 8 + w + 1 of the full file.
    for (let row = 0; row < thinLines.length - 1; row++) {
      const walker = row % 8;
      const index = Math.floor(row / 8) % steps;
      const ensemble = Math.floor(row / (8 * steps));
      expect(thinLines[row + 1], `row ${row}`).toBe(fullLines[(ensemble * 600 + first + index * every) * 8 + walker + 1]);
    }
    expect(statSync(join(thin.runDir, 'chains.csv')).size).toBeLessThan(statSync(join(full.runDir, 'chains.csv')).size / every);
    // The two runs differ only in their configuration file and folder (and wall time): every number is the same.
    const summaries = [full, thin].map((outcome) => JSON.parse(readFileSync(join(outcome.runDir, 'summary.json'), 'utf8')) as Record<string, unknown>);
    for (const key of ['parameters', 'diagnostics', 'correlation', 'fit', 'convergence']) expect(summaries[1][key], key).toEqual(summaries[0][key]);
    for (const file of ['contours/omega_m__w0.grid.csv', 'contours/omega_m__w0.geojson', 'marginals/w0.csv', 'figures/triangle.svg', 'figures/trace.svg']) {
      expect(readFileSync(join(thin.runDir, file)).equals(readFileSync(join(full.runDir, file))), file).toBe(true);
    }
    const rebuilt = join(scratch, 'thin-rebuilt');
    buildRunOutputs([thin.runDir], rebuilt);
    for (const file of ['summary.json', 'summary.md', 'figures/trace.svg']) expect(readFileSync(join(rebuilt, file)).equals(readFileSync(join(thin.runDir, file))), file).toBe(true);
  }, 120_000);

  it('report says the chain record is needed when chains.csv is thinned and the record is gone', async () => {
    const dir = join(scratch, 'thin');
    expect(existsSync(join(dir, 'chain-record.bin'))).toBe(true);
    rmSync(join(dir, 'chain-record.bin'));
    const result = await runCommandLine(['report', dir, '--out', join(scratch, 'thin-report')]);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/chain-record\.bin/);
    expect(result.stderr).toMatch(/every \d+th step after the burn-in/);
  });
});
