import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { standardizeTable } from '../../../src/pipeline/standardize/standardizeTable.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';

// `candela standardize` names the closest model label and parameter for a
// misspelt --model or --at. Data: the Pantheon 2018 binned Hubble diagram
// (Scolnic et al. 2018, ApJ 859, 101); nothing is fitted.
const scratch = useScratchFolder('standardize-suggestions');

function configPath(): string {
  const path = join(scratch, 'two-models.yaml');
  writeFileSync(path, pantheonBinnedConfig({
    seed: 2, models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }\n  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }', sampler: '{ walkers: 8 }', output: `{ dir: ${join(scratch, 'out')} }`,
  }));
  return path;
}

async function issuesOf(run: () => Promise<unknown>) {
  try {
    await run();
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

describe('standardizeTable suggestions', () => {
  it('suggests the closest model label for --model', async () => {
    const [issue] = await issuesOf(() => standardizeTable(configPath(), {}, 'flat_wcmd'));
    expect(issue).toMatchObject({ code: 'standardize.unknown_model', path: '--model', fix: 'did you mean --model flat_wcdm?' });
  });

  it('suggests the closest sampled parameter for --at', async () => {
    const [issue] = await issuesOf(() => standardizeTable(configPath(), { omega_mm: 0.3 }, 'flat_lcdm'));
    expect(issue).toMatchObject({ code: 'standardize.unknown_parameter', path: '--at omega_mm', fix: 'did you mean --at omega_m=...?' });
  });
});
