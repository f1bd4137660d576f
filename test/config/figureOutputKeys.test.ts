// The figure keys of `output` and of each data set (figure width, font, PDF, PNG
// resolution, triangle parameters, truth file, sample names, binned rows), the
// nested-sampling stopping key, and the resolved copy reading back.
import { describe, expect, it } from 'vitest';
import { parseConfigText, resolvedConfigToYaml } from '../../src/config/index.js';
import { VALID_MAGNITUDES, errorsOf } from './configTextHelpers.js';

function parsed(text: string) {
  const result = parseConfigText(text, '/data/kestrel/run.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => issue.message).join('; '));
  return result.value;
}

const WITH_FIGURE_KEYS = `${VALID_MAGNITUDES.replace('      magnitude_err: dmb\n', '      magnitude_err: dmb\n    sample_names: { 1: nearby, 2: wide, 3: deep }\n    binned: true\n')}output:
  figure_width: 5.5
  font: serif
  pdf: true
  png_dpi: 300
  triangle_parameters: [omega_m]
  truth_file: mock/truth.json
`;

describe('figure keys of the configuration', () => {
  it('defaults to the screen width, sans text, no PDF, fixed-width PNGs, an automatic triangle, no truth, unbinned rows', () => {
    const config = parsed(VALID_MAGNITUDES);
    expect(config.output).toMatchObject({ figureWidth: 'screen', font: 'sans', pdf: false, pngDpi: null, triangleParameters: 'auto', truthFile: null });
    expect(config.supernovae[0]).toMatchObject({ sampleNames: {}, binned: false });
  });

  it('reads every key, a width in inches and a truth file resolved against the configuration folder', () => {
    const config = parsed(WITH_FIGURE_KEYS);
    expect(config.output).toMatchObject({ figureWidth: { inches: 5.5 }, font: 'serif', pdf: true, pngDpi: 300, triangleParameters: ['omega_m'] });
    expect(config.output.truthFile).toEqual({ written: 'mock/truth.json', resolved: '/data/kestrel/mock/truth.json' });
    expect(config.supernovae[0]).toMatchObject({ sampleNames: { 1: 'nearby', 2: 'wide', 3: 'deep' }, binned: true });
    expect(parsed(`${VALID_MAGNITUDES}output: { figure_width: double }\n`).output.figureWidth).toBe('double');
  });

  it('writes the keys back so that the resolved copy reads to the same configuration', () => {
    const config = parsed(WITH_FIGURE_KEYS);
    const again = parsed(resolvedConfigToYaml(config));
    // The copy writes resolved paths: the resolved paths are the same, the written ones become them.
    const resolvedOnly = (output: typeof config.output) => ({ ...output, dir: output.dir.resolved, truthFile: output.truthFile?.resolved });
    expect(resolvedOnly(again.output)).toEqual(resolvedOnly(config.output));
    expect(again.supernovae[0].sampleNames).toEqual(config.supernovae[0].sampleNames);
    expect(again.supernovae[0].binned).toBe(true);
  });

  it('rejects a width of no size, an unknown font and an empty triangle list, each at its key', () => {
    const paths = (text: string) => errorsOf(text).map((issue) => issue.path);
    expect(paths(`${VALID_MAGNITUDES}output: { figure_width: 0 }\n`)).toEqual(['output.figure_width']);
    expect(paths(`${VALID_MAGNITUDES}output: { figure_width: wide }\n`)).toEqual(['output.figure_width']);
    expect(paths(`${VALID_MAGNITUDES}output: { font: comic }\n`)).toEqual(['output.font']);
    expect(paths(`${VALID_MAGNITUDES}output: { triangle_parameters: [] }\n`)).toEqual(['output.triangle_parameters']);
  });
});

describe('the nested-sampling stopping key', () => {
  it('is max_unexplored_ln_z (nats), default 0.1', () => {
    expect(parsed(VALID_MAGNITUDES).sampler.nested.maxUnexploredLnZ).toBe(0.1);
    expect(parsed(`${VALID_MAGNITUDES}sampler: { method: nested, nested: { max_unexplored_ln_z: 0.05 } }\n`).sampler.nested.maxUnexploredLnZ).toBe(0.05);
  });

  it('has no alias: the old name is an unknown key', () => {
    const issues = errorsOf(`${VALID_MAGNITUDES}sampler: { method: nested, nested: { dlogz: 0.05 } }\n`);
    expect(issues.map((issue) => [issue.code, issue.path])).toEqual([['config.unknown_key', 'sampler.nested.dlogz']]);
  });
});
