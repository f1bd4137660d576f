import { describe, expect, it } from 'vitest';
import { parseProbeDiagramJson, probeDiagramFileName, probeDiagramJson, probeDiagramKey, type ProbeDiagramDocument } from '../../../src/output/index.js';

const diagram: ProbeDiagramDocument = {
  title: 'BAO distances over a reference',
  xLabel: 'redshift z',
  yLabel: 'ratio to the reference',
  referenceLabel: 'reference',
  groups: [{
    label: 'D_M / r_d',
    points: { x: [0.51, 0.706], y: [1.01, 0.99], error: [0.012, 0.011] },
    curve: { x: [0.02, 1], best: [1, 1.002], low68: [0.99, 0.995], high68: [1.01, 1.009] },
  }],
};

describe('probeDiagramJson', () => {
  it('writes one line of JSON with the keys in a fixed order, whatever order the input object has', () => {
    const shuffled = {
      groups: [{ curve: { high68: [2], low68: [0], best: [1], x: [0.5] }, points: { error: [0.1], y: [1], x: [0.5] }, label: 'g' }],
      referenceLabel: 'r', yLabel: 'y', xLabel: 'x', title: 't',
    } as ProbeDiagramDocument;
    expect(probeDiagramJson(shuffled)).toBe(
      '{"title":"t","xLabel":"x","yLabel":"y","referenceLabel":"r","groups":[{"label":"g","points":{"x":[0.5],"y":[1],"error":[0.1]},"curve":{"x":[0.5],"best":[1],"low68":[0],"high68":[2]}}]}\n',
    );
  });

  it('writes numbers as the shortest decimal that reads back to the same double (ECMA-262 Number::toString)', () => {
    const text = probeDiagramJson({ ...diagram, groups: [{ ...diagram.groups[0], points: { x: [0.1 + 0.2], y: [1 / 3], error: [1e-7] } }] });
    expect(text).toContain('"points":{"x":[0.30000000000000004],"y":[0.3333333333333333],"error":[1e-7]}');
  });

  it('reads back what it wrote', () => {
    expect(parseProbeDiagramJson(probeDiagramJson(diagram))).toEqual(diagram);
  });
});

describe('probeDiagramFileName and probeDiagramKey', () => {
  it('name the file after the probe key and read the key back', () => {
    expect(probeDiagramFileName('bao')).toBe('probe_bao.json');
    expect(probeDiagramKey(probeDiagramFileName('cmb_shift'))).toBe('cmb_shift');
  });

  it('refuse names that are not a probe diagram\'s', () => {
    for (const name of ['run.json', 'probe_.json', 'probe_BAO.json', 'probe_bao.json.tmp', 'xprobe_bao.json']) expect(probeDiagramKey(name), name).toBeNull();
  });
});
