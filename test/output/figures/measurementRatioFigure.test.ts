import { describe, expect, it } from 'vitest';
import { measurementRatioFigure } from '../../../src/output/figures/index.js';
import { isCandelaError } from '../../../src/errors.js';

const group = (label: string) => ({
  label,
  points: { x: [0.5, 1.0], y: [1.01, 0.99], error: [0.01, 0.02] },
  curve: { x: [0.1, 0.5, 1.0, 1.5], best: [1, 1.001, 1.002, 1.003], low68: [0.99, 0.995, 0.996, 0.997], high68: [1.01, 1.006, 1.007, 1.008] },
});

describe('measurementRatioFigure', () => {
  it('draws one band, curve, error-bar set and marker set per group, the reference at 1, and a legend entry for each', () => {
    const svg = measurementRatioFigure({ groups: [group('D_M / r_d'), group('D_H / r_d')], xLabel: 'redshift z', yLabel: 'ratio to the reference', referenceLabel: 'flat ΛCDM' });
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg.match(/class="band band-68"/g)).toHaveLength(2);
    expect(svg.match(/class="best-fit"/g)).toHaveLength(2);
    expect(svg.match(/class="points"/g)).toHaveLength(2);
    expect(svg.match(/class="reference"/g)).toHaveLength(1);
    for (const label of ['D_M / r_d', 'D_H / r_d', 'flat ΛCDM']) expect(svg).toContain(label);
    expect(svg).not.toMatch(/NaN/);
  });

  it('refuses arrays of unequal length with a clear error', () => {
    const bad = group('x');
    bad.curve.low68 = [1];
    try {
      measurementRatioFigure({ groups: [bad], xLabel: 'z', yLabel: 'r', referenceLabel: 'ref' });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].code).toBe('figure.length_mismatch');
    }
  });
});
