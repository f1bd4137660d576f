import { readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { autocorrelationFigure, residualsFigure } from '../../../src/output/figures/index.js';
import { isCandelaError } from '../../../src/errors.js';
import { findAll, hasClass, parseXml, textContent } from './xmlTree.js';

describe('residualsFigure', () => {
  const redshift = Float64Array.of(0.01, 0.02, 0.05, 0.1, 0.3, 0.8);
  const residualMag = Float64Array.of(0.05, -0.03, 0.02, -0.01, 0.04, 5);
  const errorMag = Float64Array.of(0.1, 0.1, 0.08, 0.08, 0.1, 0.12);

  it('draws one marker per supernova and sample, binned means, and counts a point beyond the axis in the legend', () => {
    const svg = residualsFigure({
      redshift, residualMag, errorMag, sample: ['A', 'A', 'A', 'B', 'B', 'B'],
      binnedResiduals: [{ z: 0.02, mean: 0.01, err: 0.05 }, { z: 0.3, mean: 0.02, err: 0.06 }],
    }, { sampleNames: { A: 'low-z', B: 'deep' } });
    const tree = parseXml(svg);
    const markers = findAll(tree, 'path', (node) => hasClass(node, 'markers'));
    expect(markers.map((node) => node.attributes['d'].match(/M/g)?.length)).toEqual([3, 3]);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'binned-markers'))).toHaveLength(1);
    const legend = findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent);
    expect(legend).toEqual(['low-z (3)', 'deep (3)', 'best fit', 'binned mean residual', 'error bar beyond the axis (1)']);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'cut-marks'))).toHaveLength(1);
  });

  it('rejects per-supernova arrays of different lengths', () => {
    try {
      residualsFigure({ redshift, residualMag: residualMag.subarray(1), errorMag });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].code).toBe('figure.length_mismatch');
    }
  });
});

describe('autocorrelationFigure', () => {
  // An AR(1) process has rho(t) = phi^t and tau = (1 + phi)/(1 - phi) (textbook result); phi = 0.5 gives tau = 3.
  const phi = 0.5;
  const correlation = Float64Array.from({ length: 200 }, (_, lag) => phi ** lag);

  it('shows lags up to 10 tau and marks tau on the curve, with tau in the legend', () => {
    const tree = parseXml(autocorrelationFigure([{ parameter: 'omega_m', correlation, tauSteps: 3 }]));
    const curve = findAll(tree, 'path', (node) => hasClass(node, 'autocorrelation'));
    expect(curve).toHaveLength(1);
    // 10 tau = 30 lags: 31 points, the first a move.
    expect(curve[0].attributes['d'].match(/[ML]/g)?.length).toBe(31);
    const clip = findAll(tree, 'rect')[0].attributes;
    const [left, width] = [Number(clip['x']), Number(clip['width'])];
    const drop = findAll(tree, 'path', (node) => hasClass(node, 'tau-drop'))[0].attributes['d'];
    const x = Number(/^M([-\d.]+)/.exec(drop)?.[1]);
    expect(x).toBeCloseTo(left + (3 / 30) * width, 1);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'tau-marker'))).toHaveLength(1);
    expect(findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toEqual(['Ωm: τ = 3.0 steps']);
  });

  it('draws a parameter without tau but marks nothing for it', () => {
    const tree = parseXml(autocorrelationFigure([{ parameter: 'w0', correlation, tauSteps: null }, { parameter: 'omega_m', correlation, tauSteps: 3 }]));
    expect(findAll(tree, 'path', (node) => hasClass(node, 'autocorrelation'))).toHaveLength(2);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'tau-marker'))).toHaveLength(1);
  });
});

describe('golden files', () => {
  // Fixed inputs with literal numbers; the golden files were inspected by eye (rendered to PNG) when
  // written. Set CANDELA_UPDATE_GOLDEN=1 to rewrite them after an intended change.
  const golden = (name: string, svg: string) => {
    const path = `test/golden/figures/${name}`;
    if (process.env.CANDELA_UPDATE_GOLDEN) writeFileSync(path, svg);
    expect(svg).toBe(readFileSync(path, 'utf8'));
  };

  it('draws the fixed residuals exactly as test/golden/figures/residuals-tiny.svg', () => {
    golden('residuals-tiny.svg', residualsFigure({
      redshift: Float64Array.of(0.015, 0.03, 0.08, 0.2, 0.45, 0.9), residualMag: Float64Array.of(0.04, -0.06, 0.01, -0.02, 0.05, -0.4),
      errorMag: Float64Array.of(0.12, 0.1, 0.08, 0.07, 0.09, 0.15), sample: ['near', 'near', 'near', 'far', 'far', 'far'],
      binnedResiduals: [{ z: 0.03, mean: -0.01, err: 0.06 }, { z: 0.4, mean: 0.01, err: 0.05 }],
      modelBand: { z: Float64Array.of(0.01, 0.1, 1), low68: Float64Array.of(-0.005, -0.01, -0.03), high68: Float64Array.of(0.005, 0.01, 0.03) },
    }, { width: 'single' }));
  });

  it('draws the AR(1) autocorrelations exactly as test/golden/figures/autocorrelation-tiny.svg', () => {
    // rho(t) = phi^t with tau = (1 + phi)/(1 - phi) (textbook AR(1) result) for phi = 0.5 and 0.8.
    const ar1 = (phi: number) => Float64Array.from({ length: 120 }, (_, lag) => phi ** lag);
    golden('autocorrelation-tiny.svg', autocorrelationFigure([
      { parameter: 'omega_m', correlation: ar1(0.5), tauSteps: 3 },
      { parameter: 'w0', correlation: ar1(0.8), tauSteps: 9 },
    ], { width: 'single' }));
  });
});
