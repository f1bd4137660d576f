// configs/demo-blinded.yaml end to end, with short chains (its data and models as written, its sampler cut to
// 200 steps so the test takes seconds; the full run is measured in docs/blinding.md): the fit writes blinded
// outputs, and candela unblind turns them into true ones. Invented demo data (data-demo/, the Kestrel survey):
// this checks the wiring of the demo configuration, not a correctness reference.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runFit, unblindRun } from '../../../src/pipeline/index.js';

const scratch = resolve('.candela-tmp/demo-blinded');
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('configs/demo-blinded.yaml', () => {
  it('fits blinded (omega_m, w0, wa; h0 is fixed) and unblinds', async () => {
    mkdirSync(scratch, { recursive: true });
    const text = readFileSync('configs/demo-blinded.yaml', 'utf8')
      .replaceAll('../data-demo/', `${resolve('data-demo')}/`)
      .replace(/^sampler:\n(?: {2}.*\n)+/m, 'sampler: { walkers: 16, ensembles: 2, max_steps: 200, check_every: 100, target_ess: 1000000, workers: 1 }\n');
    expect(text).toContain('blinding:\n  parameters: [w0, wa, omega_m, h0]');
    const path = join(scratch, 'demo-blinded.yaml');
    writeFileSync(path, text);
    const lines: string[] = [];
    const [outcome] = await runFit({ configPath: path, outDir: join(scratch, 'run'), onLine: (line) => lines.push(line) });
    expect(lines).toContain('blinding: h0 is not sampled by model flat_w0wa: not blinded (a fixed value is in the configuration)');
    const record = JSON.parse(readFileSync(join(outcome.runDir, 'run.json'), 'utf8'));
    expect(record.blinding).toMatchObject({ state: 'blinded', parameters: ['omega_m', 'w0', 'wa'] });
    expect(readFileSync(join(outcome.runDir, 'summary.md'), 'utf8').startsWith('> BLINDED: omega_m, w0, wa are shown')).toBe(true);
    expect(existsSync(join(outcome.runDir, 'blinding.key'))).toBe(true);
    const unblinded = unblindRun(outcome.runDir);
    expect(unblinded.parameters).toEqual(['omega_m', 'w0', 'wa']);
    expect(readFileSync(join(outcome.runDir, 'summary.md'), 'utf8')).not.toContain('BLINDED');
    expect(existsSync(join(outcome.runDir, 'blinding.key'))).toBe(false);
    expect(existsSync(join(outcome.runDir, 'hubble_model.csv'))).toBe(true);
    expect(readFileSync(join(outcome.runDir, 'chains.csv'), 'utf8').split('\n', 1)[0]).toContain('q0');
  }, 180_000);
});
