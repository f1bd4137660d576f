// The figure settings of a run folder, read from the configuration stored in run.json.
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { figureSettings, TRUTH_LABEL } from '../../../src/pipeline/report/figureSettings.js';
import type { RunOnDisk } from '../../../src/pipeline/run/runFiles.js';

const scratch = resolve('.candela-tmp/figure-settings');

/** A run folder read back, reduced to what figureSettings reads (the stored configuration). */
function runWith(configuration: unknown): RunOnDisk {
  return { dir: scratch, record: { configuration } } as unknown as RunOnDisk;
}

beforeAll(() => {
  mkdirSync(scratch, { recursive: true });
  // The layout `candela simulate` writes (docs/simulate.md): numbers under "truth", words beside them.
  writeFileSync(join(scratch, 'truth.json'), JSON.stringify({ about: 'mock truth', truth: { dark_energy: 'cpl', omega_m: 0.315, w0: -0.95, wa: 0.15 } }));
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('figureSettings', () => {
  it('gives the defaults for a run stored before the figure keys existed', () => {
    const settings = figureSettings(runWith({ output: {} }));
    expect(settings).toMatchObject({ figures: ['triangle', 'hubble', 'trace'], png: true, width: undefined, fontFace: 'sans', pdf: false, pngDpi: null, triangleParameters: 'auto', truth: null, dataAreBinned: false });
  });

  it('maps the stored keys to the figure options and reads the numbers of the truth file', () => {
    const settings = figureSettings(runWith({
      output: { figure_width: 3.3, font: 'serif', pdf: true, png_dpi: 300, triangle_parameters: ['w0', 'wa'], truth_file: join(scratch, 'truth.json') },
      supernovae: [{ sample_names: { 1: 'nearby' }, binned: true }, { sample_names: { 2: 'deep' }, binned: true }],
    }));
    expect(settings).toMatchObject({ width: { inches: 3.3 }, fontFace: 'serif', pdf: true, pngDpi: 300, triangleParameters: ['w0', 'wa'], dataAreBinned: true });
    expect(settings.truth).toEqual({ omega_m: 0.315, w0: -0.95, wa: 0.15 });
    expect(settings.sampleNames).toEqual({ 1: 'nearby', 2: 'deep' });
    expect(TRUTH_LABEL).toBe('truth (mock input)');
  });

  it('turns an unreadable truth file into a warning, not a failure', () => {
    const settings = figureSettings(runWith({ output: { truth_file: join(scratch, 'missing.json') }, supernovae: [{ binned: true }, {}] }));
    expect(settings.truth).toBeNull();
    expect(settings.dataAreBinned).toBe(false);
    expect(settings.warnings.map((w) => w.code)).toEqual(['truth_file_unreadable']);
  });
});
