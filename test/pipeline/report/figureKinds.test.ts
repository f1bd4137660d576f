import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { FIGURE_KINDS } from '../../../src/config/readOutput.js';
import { integratedAutocorrelationTime } from '../../../src/diagnostics/index.js';
import { runFit, type FitOutcome } from '../../../src/pipeline/index.js';
import { readRunFolder } from '../../../src/pipeline/run/runFiles.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// Every figure kind the configuration accepts draws its own file. A short
// flat LambdaCDM fit of the Pantheon 2018 binned Hubble diagram (Scolnic et
// al. 2018, ApJ 859, 101; ../shared/data-real/pantheon2018/Binned_data) asks
// for all of them. Short chains: the test checks what is drawn, not a
// converged posterior.
const scratch = useScratchFolder('figure-kinds');
let outcome: FitOutcome;

beforeAll(async () => {
  writeFileSync(join(scratch, 'figures.yaml'), pantheonBinnedConfig({
    title: 'figure kinds', seed: 9, models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 300, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'fits')}, figures: [${FIGURE_KINDS.join(', ')}], png: false }`,
  }));
  [outcome] = await runFit({ configPath: join(scratch, 'figures.yaml') });
}, 120_000);

describe('output.figures', () => {
  it('writes one SVG per accepted figure kind, each named after its kind', () => {
    for (const kind of FIGURE_KINDS) expect(existsSync(join(outcome.runDir, 'figures', `${kind}.svg`)), kind).toBe(true);
  });

  it('residuals: one marker per supernova (40 bins), zero line and binned means', () => {
    const svg = readFileSync(join(outcome.runDir, 'figures', 'residuals.svg'), 'utf8');
    const markers = svg.match(/class="markers"[^>]*d="([^"]*)"/)?.[1] ?? '';
    expect(markers.match(/M/g)?.length).toBe(40);
    expect(svg).toContain('class="model-curve"');
    expect(svg).toContain('class="binned-markers"');
  });

  it('autocorrelation: one curve per sampled parameter, tau marked at the value summary.json reports', () => {
    const svg = readFileSync(join(outcome.runDir, 'figures', 'autocorrelation.svg'), 'utf8');
    const summary = JSON.parse(readFileSync(join(outcome.runDir, 'summary.json'), 'utf8'));
    const sampled = Object.keys(summary.parameters).filter((name) => !summary.parameters[name].derived);
    expect(sampled.length).toBeGreaterThan(0);
    expect(svg.match(/class="autocorrelation"/g)?.length).toBe(sampled.length);
    const run = readRunFolder(outcome.runDir);
    for (const name of sampled) {
      // The tau in the legend is the one of summary.json; recomputed from chains.csv the same way (every walker of every ensemble a series, whole chain).
      const { steps, walkers, ensembles } = run.record.run;
      const column = run.chains.columns[name];
      const series = Array.from({ length: ensembles * walkers }, (_, index) => {
        const k = Math.floor(index / walkers);
        const w = index % walkers;
        return Float64Array.from({ length: steps }, (_, s) => column[(k * steps + s) * walkers + w]);
      });
      const tau = integratedAutocorrelationTime(series).tauSteps;
      expect(summary.diagnostics[name].tau).toBeCloseTo(tau, 9);
      expect(svg).toContain(`τ = ${tau.toFixed(1)} steps`);
    }
    expect(svg.match(/class="tau-marker"/g)?.length).toBe(sampled.length);
  });
});
