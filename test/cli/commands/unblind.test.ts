import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// `candela unblind` as a user runs it (the built command, dist/: `npm run build` first). The unblinding
// itself is tested in test/pipeline/blinding/unblindRun.test.ts; here the command line: help, the exit code 2
// and the message of bad input.
const command = resolve('dist/src/cli/main.js');
const scratch = mkdtempSync(join(tmpdir(), 'candela-unblind-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

function candela(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [command, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('candela unblind', () => {
  it('is listed with its argument', () => {
    const help = candela(['unblind', '--help']);
    expect(help.status).toBe(0);
    expect(help.stdout).toContain('<runDir>');
    expect(help.stdout).toContain('candela unblind out/demo-blinded');
  });

  it('refuses a folder without a run record, and a run that was never blinded, with exit code 2 and the fix', () => {
    const empty = candela(['unblind', scratch]);
    expect(empty.status).toBe(2);
    expect(empty.stderr).toContain('this folder holds no readable run record');
    writeFileSync(join(scratch, 'run.json'), JSON.stringify({ run: { seed: '1' }, model: { label: 'm' } }));
    const plain = candela(['unblind', scratch]);
    expect(plain.status).toBe(2);
    expect(plain.stderr).toContain(`${join(scratch, 'run.json')}: error: this run was not blinded`);
    expect(plain.stderr).toContain('fix:');
  });
});
