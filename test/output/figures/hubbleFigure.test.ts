import { describe, expect, it } from 'vitest';
import { hubbleFigure } from '../../../src/output/figures/index.js';
import { findAll, hasClass, parseXml, textContent } from './xmlTree.js';

// Model: the low-redshift Hubble law mu = 5 log10(c z / H0 / Mpc) + 25 with H0 = 70 (common practice),
// sampled on a log grid; the figure interpolates it in ln z, where it is exactly linear.
const muOf = (z: number) => 5 * Math.log10((299792.458 * z) / 70) + 25;
const grid = Float64Array.from({ length: 41 }, (_, k) => 0.005 * 20 ** (k / 40));
const median = grid.map(muOf);
const modelCurve = { z: grid, median, low68: median.map((value) => value - 0.02), high68: median.map((value) => value + 0.02) };
const redshift = Float64Array.of(0.01, 0.02, 0.03, 0.05, 0.07, 0.09);
const offsets = [0, 0.1, -0.1, 0.05, -0.2, 0];
const input = {
  redshift,
  muObsMag: redshift.map((z, index) => muOf(z) + offsets[index]),
  muErrMag: new Float64Array(6).fill(0.1),
  sample: ['LOWZ', 'LOWZ', 'Lyra-Wide', 'Lyra-Wide', 'Lyra-Wide', 'LOWZ'],
  modelCurve,
  binnedResiduals: [{ z: 0.02, mean: 0.03, err: 0.05 }, { z: 0.06, mean: -0.08, err: 0.06 }],
};

/** First marker centre of a circle-marker path: `M{x - r} {y}a...`. */
function markerCentres(d: string, radius: number): [number, number][] {
  return [...d.matchAll(/M(-?[\d.]+) (-?[\d.]+)a/g)].map((match) => [Number(match[1]) + radius, Number(match[2])]);
}

describe('hubbleFigure', () => {
  const tree = parseXml(hubbleFigure(input, { idPrefix: 'hd' }));

  it('is well formed, with markers and error bars per sample in both panels', () => {
    expect(findAll(tree, 'path', (node) => hasClass(node, 'markers'))).toHaveLength(4);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'error-bars'))).toHaveLength(4);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'model-band'))).toHaveLength(2);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'binned-markers'))).toHaveLength(1);
  });

  it('lists each sample with its count, the model, its band and the binned means in the legend', () => {
    expect(findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toEqual(['LOWZ (3)', 'Lyra-Wide (3)', 'best fit', '68% band', 'binned mean']);
  });

  it('plots residuals as data minus best fit: a supernova on the model sits on the zero line', () => {
    const lowerClip = findAll(tree, 'clipPath', (node) => node.attributes.id === 'hd-clip-lower')[0].children[0].attributes;
    const [top, height] = [Number(lowerClip.y), Number(lowerClip.height)];
    const lowz = findAll(tree, 'path', (node) => hasClass(node, 'markers') && node.attributes['data-sample'] === 'LOWZ');
    // Second LOWZ markers path is the residual panel; residuals 0, +0.1 and 0 mag.
    const centres = markerCentres(lowz[1].attributes.d, 1.9);
    const zeroY = centres[0][1];
    expect(centres[2][1]).toBeCloseTo(zeroY, 2);
    expect(zeroY).toBeGreaterThan(top);
    expect(zeroY).toBeLessThan(top + height);
    const zeroLine = findAll(tree, 'path', (node) => hasClass(node, 'model-curve'))[1].attributes.d;
    expect(Number(/^M-?[\d.]+ ([\d.]+)/.exec(zeroLine)?.[1])).toBeCloseTo(zeroY, 2);
    // The residual axis spans ±0.2 mag (residualRangeMag: 98% of |residual| + error, by hand), so the
    // +0.1 mag point sits a quarter of the panel height above the zero line.
    expect(zeroY - centres[1][1]).toBeCloseTo(height / 4, 1);
  });

  it('uses a log redshift axis labelled 0.01, 0.02, 0.05 and a distance-modulus axis in mag', () => {
    const tickLabels = findAll(tree, 'text', (node) => hasClass(node, 'tick-label')).map(textContent);
    expect(tickLabels).toEqual(expect.arrayContaining(['0.01', '0.02', '0.05']));
    const axisLabels = findAll(tree, 'text', (node) => hasClass(node, 'axis-label')).map(textContent);
    expect(axisLabels).toEqual(['μ [mag]', 'redshift z', 'Δμ [mag]']);
  });

  it('throws figure.length_mismatch when per-supernova arrays differ', () => {
    expect(() => hubbleFigure({ ...input, muErrMag: new Float64Array(5) })).toThrow(/one entry per supernova/);
  });
});
