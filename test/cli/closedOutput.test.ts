import { spawn } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { pantheonBinnedConfig } from '../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../support/scratchFolder.js';

// A reader that leaves early (`candela standardize CONFIG | head`) closes the pipe; the next write
// fails with EPIPE (POSIX write(2)). Command-line filters then end quietly (common practice), so the
// built command (dist/, `npm run build`) must exit 0 without a stack trace. The data are the
// Pantheon 2018 binned Hubble diagram (Scolnic et al. 2018, ../shared/data-real/pantheon2018).
const command = resolve('dist/src/cli/main.js');
const scratch = useScratchFolder('cli-closed-output');

/** Runs the built command with its standard output closed at once; resolves with the exit code and what it wrote to stderr. */
function runWithClosedOutput(args: string[]): Promise<{ code: number | null; stderr: string }> {
  return new Promise((done) => {
    const child = spawn(process.execPath, [command, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout.destroy(); // the reader is gone before candela writes its first byte
    let stderr = '';
    child.stderr.on('data', (chunk) => { stderr += String(chunk); });
    child.on('close', (code) => done({ code, stderr }));
  });
}

describe('a closed standard output', () => {
  it('ends `candela standardize` quietly with exit code 0', async () => {
    const config = join(scratch, 'bins.yaml');
    writeFileSync(config, pantheonBinnedConfig({
      seed: 1, models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }', sampler: '{ walkers: 8 }', output: `{ dir: ${join(scratch, 'out')} }`,
    }));
    const { code, stderr } = await runWithClosedOutput(['standardize', config]);
    expect(stderr).not.toMatch(/EPIPE|Error|at .*\.js:\d+/);
    expect(code).toBe(0);
  }, 60_000);

  it('ends `candela distances` with many rows quietly with exit code 0', async () => {
    const z = Array.from({ length: 2000 }, (_, k) => ((k + 1) / 1000).toFixed(3)).join(',');
    const { code, stderr } = await runWithClosedOutput(['distances', '--dark-energy', 'lambda', '--omega-m', '0.3', '--z', z, '--csv']);
    expect(stderr).not.toMatch(/EPIPE|Error/);
    expect(code).toBe(0);
  }, 60_000);
});
