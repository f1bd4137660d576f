import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// The README promises that `candela init` writes a starter that passes `candela check`. That must hold
// outside the repository too: the built command (dist/, `npm run build`) runs here from a fresh folder
// under the system's temporary directory, far from the repository and from ../shared.
const command = resolve('dist/src/cli/main.js');
const away = mkdtempSync(join(tmpdir(), 'candela-init-'));
afterAll(() => rmSync(away, { recursive: true, force: true }));

function candela(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [command, ...args], { cwd: away, encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('candela init outside the repository', () => {
  it('writes a starter that candela check accepts, from the folder it was written in and from elsewhere', () => {
    expect(candela(['init', 'run.yaml']).status).toBe(0);
    expect(existsSync(join(away, 'kestrel-supernovae.csv'))).toBe(true);
    const here = candela(['check', 'run.yaml']);
    expect(here.stderr).toBe('');
    expect(here.status).toBe(0);
    expect(candela(['init', join('deeper', 'nested', 'run.yaml')]).status).toBe(0);
    const fromAbove = candela(['check', join(away, 'deeper', 'nested', 'run.yaml')]);
    expect(fromAbove.stderr).toBe('');
    expect(fromAbove.status).toBe(0);
  }, 120_000);

  it('leaves an existing starter alone without --force', () => {
    const again = candela(['init', 'run.yaml']);
    expect(again.status).toBe(2);
    expect(again.stderr).toContain('--force');
  });
});
