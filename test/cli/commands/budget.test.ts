import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

// `candela budget` as a user runs it (the built command, dist/: `npm run build` first). The budget itself is
// tested in test/pipeline/budget and test/math/reweighting; here the command line: help and bad input.
const command = resolve('dist/src/cli/main.js');
const scratch = mkdtempSync(join(tmpdir(), 'candela-budget-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

function candela(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [command, ...args], { encoding: 'utf8', timeout: 60_000 });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

describe('candela budget', () => {
  it('is listed with its argument and options', () => {
    const help = candela(['budget', '--help']);
    expect(help.status).toBe(0);
    for (const text of ['<runDir>', '--parameters <names>', '--draws <n>', '--min-effective <n>', '--full', '--no-report', 'candela budget out/demo']) {
      expect(help.stdout).toContain(text);
    }
  });

  it('refuses a folder without a run record and a draw count that is not a number, with exit code 2 and the fix', () => {
    const empty = candela(['budget', scratch]);
    expect(empty.status).toBe(2);
    expect(empty.stderr).toContain('this folder holds no readable run record');
    const draws = candela(['budget', scratch, '--draws', 'many']);
    expect(draws.status).toBe(2);
    expect(draws.stderr).toContain('--draws takes a whole number');
    expect(draws.stderr).toContain('fix:');
  });
});
