// `candela check` and `candela init` through the real command-line entry point.
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { checkConfiguration } from '../../src/pipeline/index.js';
import { runCommandLine } from '../support/runCommandLine.js';

mkdirSync('.candela-tmp', { recursive: true });
const scratch = mkdtempSync(join('.candela-tmp', 'config-commands-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const run = (...argv: string[]) => runCommandLine(argv);

afterEach(() => {
  process.exitCode = undefined;
});

describe('candela check', () => {
  it('prints the summary and exits 0 for a valid configuration', async () => {
    const { code, stdout } = await run('check', 'configs/jla.yaml');
    expect(code).toBe(0);
    expect(stdout).toContain('data set "jla" (light_curves)');
    expect(stdout).toContain('model "curved_lcdm"');
    expect(stdout).toContain('configs/jla.yaml: configuration is valid');
  });

  it('prints every problem with its line and fix and exits 2', async () => {
    const { code, stderr } = await run('check', 'test/fixtures/config/several-errors.yaml');
    expect(code).toBe(2);
    expect(stderr).toContain('test/fixtures/config/several-errors.yaml:14:12: error at sampler.walkers');
    expect(stderr).toContain('fix: did you mean "delimiter"?');
    expect(stderr).toMatch(/5 errors\n$/);
  });

  it('is backed by checkConfiguration, which returns the config and the summary lines', () => {
    const result = checkConfiguration('configs/pantheon2018-binned.yaml');
    expect(result.config.models.map((m) => m.label)).toEqual(['flat_lcdm', 'curved_lcdm', 'flat_wcdm']);
    expect(result.summaryLines[0]).toBe('title: Pantheon 2018, 40 redshift bins, statistical + systematic covariance (file configs/pantheon2018-binned.yaml)');
    // The configuration itself is clean; the only warning comes from the data file: the Pantheon header
    // names 19 columns for 18 fields (../shared/data-real/pantheon2018/SOURCE.md).
    expect(result.warnings.map((w) => w.code)).toEqual(['data.header_surplus_names']);
    expect(result.summaryLines.some((line) => /40 supernovae before cuts/.test(line))).toBe(true);
  });
});

describe('candela init', () => {
  it('writes a starter file and the demo table beside it, which candela check accepts', async () => {
    const file = join(scratch, 'nested', 'starter.yaml');
    const written = await run('init', file);
    expect(written.code).toBe(0);
    expect(readFileSync(file, 'utf8')).toContain('file: kestrel-supernovae.csv\n');
    expect(readFileSync(join(scratch, 'nested', 'kestrel-supernovae.csv'))).toEqual(readFileSync('data-demo/kestrel-supernovae.csv'));
    const checked = await run('check', file);
    expect(checked.stderr.trim()).toBe('');
    expect(checked.code).toBe(0);
  });

  it('refuses to overwrite an existing file without --force', async () => {
    const file = join(scratch, 'existing.yaml');
    writeFileSync(file, 'keep me\n');
    const refused = await run('init', file);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('--force');
    expect(readFileSync(file, 'utf8')).toBe('keep me\n');
    const forced = await run('init', file, '--force');
    expect(forced.code).toBe(0);
    expect(existsSync(file) && readFileSync(file, 'utf8').startsWith('# candela configuration')).toBe(true);
  });
});
