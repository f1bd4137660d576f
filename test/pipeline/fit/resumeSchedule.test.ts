import { copyFileSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runFit } from '../../../src/pipeline/index.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// `kill -9` then `--resume` for a run that stops at convergence: the resumed run must check convergence on the
// same every-check_every schedule as an uninterrupted one, so it stops at the same step with the same chains.
// Emulated by copying the step-1,400 checkpoint (checkpoint.bin and chain-record.bin) of an uninterrupted run (what a
// killed process leaves) into a new folder and resuming there. Data: the Pantheon 2018 binned Hubble diagram
// (../shared/data-real/pantheon2018, Scolnic et al. 2018); the loose ESS and R-hat targets leave the chain length
// of 50 tau (about 1,350 steps here) as the condition that decides, so a check at step 1,400 already passes and a
// resume that checked at once would stop early.
const scratch = useScratchFolder('resume-schedule');

function writeConfig(name: string, checkEvery: number): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'resume schedule test', seed: 5,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: `{ walkers: 8, ensembles: 2, max_steps: 4000, check_every: ${checkEvery}, checkpoint_every: 50, target_ess: 20, max_rhat: 1.5, workers: 1 }`,
    output: `{ dir: ${join(scratch, name)}, figures: [], png: false }`,
  }));
  return path;
}

describe('runFit resumed from a checkpoint between two convergence checks', () => {
  it('stops where the uninterrupted run stops, with the same chains', async () => {
    // Checked every 1,400 steps, the same seed converges at the first check: the targets are met at step 1,400.
    const [early] = await runFit({ configPath: writeConfig('every-1400', 1400) });
    expect([early.record.run.stop_reason, early.record.run.steps]).toEqual(['converged', 1400]);
    // Checked every 2,800 steps it converges at 2,800; keep its step-1,400 checkpoint as a killed run would have left it.
    const saved = join(scratch, 'checkpoint-1400');
    mkdirSync(saved);
    const straightConfig = writeConfig('every-2800', 2800);
    const [straight] = await runFit({
      configPath: straightConfig,
      onProgress: (progress) => {
        if (progress.step !== 1400) return;
        for (const file of ['checkpoint.bin', 'chain-record.bin']) copyFileSync(join(scratch, 'every-2800', file), join(saved, file));
      },
    });
    expect([straight.record.run.stop_reason, straight.record.run.steps]).toEqual(['converged', 2800]);
    const resumedConfig = writeConfig('killed', 2800);
    mkdirSync(join(scratch, 'killed'));
    for (const file of ['checkpoint.bin', 'chain-record.bin']) copyFileSync(join(saved, file), join(scratch, 'killed', file));
    const [resumed] = await runFit({ configPath: resumedConfig, resume: true });
    expect([resumed.record.run.stop_reason, resumed.record.run.steps]).toEqual(['converged', 2800]);
    expect(readFileSync(join(scratch, 'killed', 'chains.csv')).equals(readFileSync(join(scratch, 'every-2800', 'chains.csv')))).toBe(true);
  }, 120_000);
});
