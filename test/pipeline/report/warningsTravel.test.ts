// Warnings travel: every warning `candela fit` prints on the terminal is in the
// run's summary.json and report.html, and a fit of several models gets an
// index page and a models table. Data: the Pantheon 2018 binned Hubble diagram
// (../shared/data-real/pantheon2018, Scolnic et al. 2018), with a prior on
// Omega_m cut at 0.4, above the published 0.298 +- 0.022 (from memory), so
// that the posterior piles against the prior's lower edge.
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';

const scratch = resolve('.candela-tmp/warnings-travel');
const LABELS = ['flat_lcdm', 'flat_wcdm'];

interface SummaryWarning { code: string; parameter: string | null; message: string; numbers: Record<string, number> }
const summaryOf = (label: string) => JSON.parse(readFileSync(join(scratch, 'out', label, 'summary.json'), 'utf8')) as {
  warnings: SummaryWarning[]; parameters: Record<string, { one_sided_limit: { side: string } | null; note?: string }>; fit: { p_value: number | null };
};
/** Text as the report page writes it (XML 1.0 character escapes). */
const escapeHtml = (text: string) => text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

let printed = '';
beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  const text = pantheonBinnedConfig({
    title: 'warnings travel', seed: 5,
    models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }\n  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  omega_m: { prior: uniform, min: 0.4, max: 0.9 }\n  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: '{ walkers: 8, ensembles: 2, max_steps: 300, check_every: 100, checkpoint_every: 0, target_ess: 1000000, workers: 1 }',
    output: `{ dir: ${join(scratch, 'out')}, figures: [triangle, hubble, trace], png: false, pdf: true, figure_width: single, font: serif }`,
  }).replace('    covariances:', '    binned: true\n    covariances:');
  writeFileSync(join(scratch, 'fit.yaml'), text);
  const result = await runCommandLine(['fit', join(scratch, 'fit.yaml')]);
  expect(result.code, result.stderr).toBe(0);
  printed = `${result.stdout}\n${result.stderr}`;
}, 300_000);
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('warnings of a fit', () => {
  it('every warning printed on the terminal is in summary.json and report.html', () => {
    const lines = printed.split('\n').filter((line) => /\bwarning\b/.test(line) && !line.startsWith('  fix:'));
    expect(lines.length).toBeGreaterThan(0);
    const runs = LABELS.map((label) => ({ summary: summaryOf(label), report: readFileSync(join(scratch, 'out', label, 'report.html'), 'utf8') }));
    for (const line of lines) {
      const holders = runs.filter((run) => run.summary.warnings.some((warning) => line.includes(warning.message)));
      expect(holders.length, `printed but in no summary.json: ${line}`).toBeGreaterThan(0);
      for (const run of holders) {
        const warning = run.summary.warnings.find((w) => line.includes(w.message))!;
        expect(run.report, `not in report.html: ${line}`).toContain(escapeHtml(warning.message));
      }
    }
  });

  it('flags Omega_m against its prior edge and quotes a one-sided limit', () => {
    for (const label of LABELS) {
      const summary = summaryOf(label);
      expect(summary.warnings.some((w) => w.code === 'prior_edge' && w.parameter === 'omega_m' && w.numbers.edge === 0.4), label).toBe(true);
      expect(summary.parameters.omega_m.one_sided_limit?.side).toBe('upper');
      expect(summary.fit.p_value).toBeGreaterThan(0);
    }
  });

  it('says beside the age that it is computed at the fixed H0', () => {
    const summary = summaryOf('flat_lcdm');
    expect(summary.parameters.age_gyr.note).toBe('at fixed H0 = 70 km/s/Mpc');
    expect(summary.warnings.some((w) => w.code === 'fixed_parameter' && w.numbers.h0_km_s_mpc === 70)).toBe(true);
    expect(readFileSync(join(scratch, 'out', 'flat_lcdm', 'summary.md'), 'utf8')).toContain('at fixed H0 = 70 km/s/Mpc');
  });

  it('writes PDF figures and an index page whose links resolve, and a models table', () => {
    expect(existsSync(join(scratch, 'out', 'flat_lcdm', 'figures', 'triangle.pdf'))).toBe(true);
    expect(readFileSync(join(scratch, 'out', 'flat_lcdm', 'figures', 'hubble.pdf')).subarray(0, 5).toString()).toBe('%PDF-');
    const index = readFileSync(join(scratch, 'out', 'index.html'), 'utf8');
    const links = [...index.matchAll(/href="([^"]+)"/g)].map((match) => match[1]);
    expect(new Set(links)).toEqual(new Set(LABELS.map((label) => `${label}/report.html`)));
    for (const link of links) expect(existsSync(join(scratch, 'out', link)), link).toBe(true);
    const table = readFileSync(join(scratch, 'out', 'models.tex'), 'utf8');
    expect(table).toContain('Parameter & flat\\_lcdm & flat\\_wcdm \\\\');
    expect(table).toMatch(/^AIC & /m);
    expect(dirname(join(scratch, 'out', links[0]))).toBe(join(scratch, 'out', 'flat_lcdm'));
  });

  it('candela report with several run folders writes the index page elsewhere, its links relative to it', async () => {
    const elsewhere = join(scratch, 'overlay');
    const result = await runCommandLine(['report', ...LABELS.map((label) => join(scratch, 'out', label)), '--out', elsewhere]);
    expect(result.code, result.stderr).toBe(0);
    const links = [...readFileSync(join(elsewhere, 'index.html'), 'utf8').matchAll(/href="([^"]+)"/g)].map((match) => match[1]);
    expect(new Set(links)).toEqual(new Set(LABELS.map((label) => `../out/${label}/report.html`)));
    for (const link of links) expect(existsSync(join(elsewhere, link)), link).toBe(true);
    expect(existsSync(join(elsewhere, 'models.tex'))).toBe(true);
  });
});

describe('warnings of a nested-sampling fit stopped by its iteration cap', () => {
  it('every warning printed on the terminal is in summary.json and report.html', async () => {
    const dir = join(scratch, 'nested');
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'fit.yaml'), pantheonBinnedConfig({
      title: 'nested cap', seed: 3,
      models: '  - { label: flat_lcdm, dark_energy: lambda, curvature: flat }',
      sampler: '{ method: nested, nested: { live_points: 40, max_iterations: 60, max_unexplored_ln_z: 0.01 } }',
      output: `{ dir: ${join(dir, 'out')}, figures: [triangle], png: false }`,
    }));
    const result = await runCommandLine(['fit', join(dir, 'fit.yaml')]);
    expect(result.code, result.stderr).toBe(0);
    const lines = `${result.stdout}\n${result.stderr}`.split('\n').filter((line) => /\bwarning\b/.test(line) && !line.startsWith('  fix:'));
    const summary = JSON.parse(readFileSync(join(dir, 'out', 'summary.json'), 'utf8')) as { warnings: SummaryWarning[] };
    const report = readFileSync(join(dir, 'out', 'report.html'), 'utf8');
    expect(lines.some((line) => line.includes('iteration cap'))).toBe(true);
    for (const line of lines) {
      const warning = summary.warnings.find((w) => line.includes(w.message));
      expect(warning, `printed but not in summary.json: ${line}`).toBeDefined();
      expect(report).toContain(escapeHtml(warning!.message));
    }
  }, 300_000);
});
