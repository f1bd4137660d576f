import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { parse as parseYaml } from 'yaml';
import { readCheckpoint } from '../../../src/output/run/checkpointFile.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';

// `candela fit` writing into a disk that fills up (a tmpfs of a few hundred kilobytes to a few megabytes, mounted
// for the test) and into a read-only file system: a clear error naming the file and the cause, exit 2, no
// temporary file left, every file already there whole, and `--resume` finishing the run once there is space. The
// data are the Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018, Scolnic et al. 2018). Mounting
// needs root (as on this project's machines and CI); where `mount` is refused the tests are skipped and say why.
const scratch = resolve('.candela-tmp/full-disk');
const mountPoint = join(scratch, 'disk');

function tryMount(options: string): string | null {
  try {
    mkdirSync(mountPoint, { recursive: true });
    execFileSync('mount', ['-t', 'tmpfs', '-o', options, 'tmpfs', mountPoint], { stdio: 'pipe' });
    return null;
  } catch (error) {
    return (error as Error).message;
  }
}

function unmount(): void {
  try { execFileSync('umount', [mountPoint], { stdio: 'pipe' }); } catch { /* not mounted */ }
}

const mountProblem = (() => {
  if (process.platform !== 'linux') return 'tmpfs mounts need Linux';
  rmSync(scratch, { recursive: true, force: true });
  const problem = tryMount('size=64k');
  unmount();
  return problem;
})();
if (mountProblem) console.warn(`full-disk tests skipped: cannot mount a tmpfs here (${mountProblem.split('\n')[0]})`);

const config = join(scratch, 'fit.yaml');
const referenceDir = join(scratch, 'reference');
/**
 * Files whose bytes depend on the wall clock (run time in seconds) or on where the run folder is (the resolved
 * configuration's paths are relative to it); they are checked for being whole, not for their bytes.
 */
const TIMED_FILES = new Set(['checkpoint.bin', 'run.json', 'summary.json', 'report.html', 'config.resolved.yaml']);

function filesBelow(dir: string): string[] {
  return readdirSync(dir, { recursive: true }).map(String).filter((name) => statSync(join(dir, name)).isFile()).sort();
}

/** A file present after a failure is either the reference file byte for byte or, for timed files, a whole file that parses. */
function expectWhole(dir: string, name: string): void {
  const bytes = readFileSync(join(dir, name));
  const base = name.split('/').pop() as string;
  if (base === 'chain-record.bin') {
    // Append-only and the same for the same seed: what a failed run left is the start of the finished run's record.
    const whole = readFileSync(join(referenceDir, name));
    expect(bytes.length, name).toBeLessThanOrEqual(whole.length);
    expect(whole.subarray(0, bytes.length).equals(bytes), name).toBe(true);
  } else if (!TIMED_FILES.has(base)) {
    expect(bytes.equals(readFileSync(join(referenceDir, name))), name).toBe(true);
  } else if (base === 'checkpoint.bin') {
    expect(() => readCheckpoint(dir), name).not.toThrow();
  } else if (base.endsWith('.json')) {
    expect(() => JSON.parse(bytes.toString('utf8')), name).not.toThrow();
  } else if (base.endsWith('.yaml')) {
    expect(parseYaml(bytes.toString('utf8')), name).toMatchObject({ seed: expect.anything() });
  } else {
    expect(bytes.toString('utf8').trimEnd().endsWith('</html>'), name).toBe(true);
  }
}

beforeAll(async () => {
  if (mountProblem) return;
  mkdirSync(scratch, { recursive: true });
  writeFileSync(config, pantheonBinnedConfig({
    title: 'full-disk test', seed: 3,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 300, check_every: 100, checkpoint_every: 50, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'unused')}, figures: [triangle], png: false }`,
  }));
  const result = await runCommandLine(['fit', config, '--out', referenceDir, '--quiet']);
  expect(result.code, result.stderr).toBe(0);
}, 120_000);
afterEach(() => unmount());
afterAll(() => {
  unmount();
  rmSync(scratch, { recursive: true, force: true });
});

describe.skipIf(Boolean(mountProblem))('candela fit on a full or read-only disk', () => {
  // The run writes about 2.2 MB (chains.csv 0.8 MB, the 2-D density grid 0.9 MB, the checkpoint 0.3 MB, twice while
  // it is replaced). Disks of these fractions of what the finished run folder takes (in 4 KiB pages) fill up during
  // the checkpoints, the chains, the Hubble files and each group of outputs in turn.
  const fractions = [0.02, 0.15, 0.35, 0.5, 0.65, 0.8, 0.95];
  it.each(fractions)('on a disk of %s of the run folder: exit 2 with a clear message, no temporary file, whole files, and --resume finishes', async (fraction) => {
    const pages = filesBelow(referenceDir).reduce((sum, name) => sum + Math.ceil(statSync(join(referenceDir, name)).size / 4096), 0);
    expect(tryMount(`size=${Math.max(4, Math.floor(fraction * pages)) * 4}k`)).toBeNull();
    const runDir = join(mountPoint, 'run');
    const failed = await runCommandLine(['fit', config, '--out', runDir, '--quiet']);
    expect(failed.code, failed.stderr).toBe(2);
    expect(failed.stderr).toMatch(/the disk is full \(ENOSPC\)/);
    expect(failed.stderr).toMatch(/free space/);
    expect(failed.stderr).not.toMatch(/internal error|\n\s+at /);
    const present = existsSync(runDir) ? filesBelow(runDir) : [];
    expect(present.filter((name) => /\.tmp$|\.tmp-\d+$/.test(name))).toEqual([]);
    for (const name of present) expectWhole(runDir, name);
    if (!present.includes('checkpoint.bin')) return; // filled before the first checkpoint: nothing to resume
    execFileSync('mount', ['-o', 'remount,size=8m', mountPoint]);
    const resumed = await runCommandLine(['fit', config, '--out', runDir, '--resume', '--quiet']);
    expect(resumed.code, resumed.stderr).toBe(0);
    for (const name of filesBelow(referenceDir)) expectWhole(runDir, name);
  }, 120_000);

  it('refuses an output folder on a read-only file system before sampling, with exit 2 and no stack trace', async () => {
    expect(tryMount('size=1m')).toBeNull();
    mkdirSync(join(mountPoint, 'existing'));
    execFileSync('mount', ['-o', 'remount,ro', mountPoint]);
    for (const runDir of [join(mountPoint, 'new', 'run'), join(mountPoint, 'existing')]) {
      const result = await runCommandLine(['fit', config, '--out', runDir, '--quiet']);
      expect(result.code, result.stderr).toBe(2);
      expect(result.stderr).toMatch(/cannot (create|write into) the output folder: the file system is read-only \(EROFS\)/);
      expect(result.stderr).toMatch(/writable output folder/);
      expect(result.stderr).not.toMatch(/internal error|\n\s+at /);
    }
  }, 60_000);
});
