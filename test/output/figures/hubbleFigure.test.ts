import { readFileSync } from 'node:fs';
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

  it('lists each sample with its count, the model, its band, the binned means and the cut error bars in the legend', () => {
    // The residual axis is ±0.2 mag, so the bar of the -0.2 mag residual (error 0.1 mag) is cut at the axis.
    expect(findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toEqual(['LOWZ (3)', 'Lyra-Wide (3)', 'best fit', 'model 68% band', 'binned mean residual', 'error bar beyond the axis (1)']);
  });

  it('plots residuals as data minus best fit: a supernova on the model sits on the zero line', () => {
    const lowerClip = findAll(tree, 'clipPath', (node) => node.attributes.id === 'hd-clip-lower')[0].children[0].attributes;
    const [top, height] = [Number(lowerClip.y), Number(lowerClip.height)];
    const lowz = findAll(tree, 'path', (node) => hasClass(node, 'markers') && node.attributes['data-sample'] === 'LOWZ');
    // Second LOWZ markers path is the residual panel; residuals 0, +0.1 and 0 mag.
    const centres = markerCentres(lowz[1].attributes.d, 1.8);
    const zeroY = centres[0][1];
    expect(centres[2][1]).toBeCloseTo(zeroY, 2);
    expect(zeroY).toBeGreaterThan(top);
    expect(zeroY).toBeLessThan(top + height);
    const zeroLine = findAll(tree, 'path', (node) => hasClass(node, 'model-curve'))[1].attributes.d;
    expect(Number(/^M-?[\d.]+ ([\d.]+)/.exec(zeroLine)?.[1])).toBeCloseTo(zeroY, 2);
    // The residual axis spans ±0.2 mag (residualRangeMag: 99% point of |residual|, 0.1, plus the median error, 0.1; by hand), so the
    // +0.1 mag point sits a quarter of the panel height above the zero line.
    expect(zeroY - centres[1][1]).toBeCloseTo(height / 4, 1);
  });

  it('uses a log redshift axis labelled 0.01, 0.02, 0.05 and a distance-modulus axis in mag', () => {
    const tickLabels = findAll(tree, 'text', (node) => hasClass(node, 'tick-label')).map(textContent);
    expect(tickLabels).toEqual(expect.arrayContaining(['0.01', '0.02', '0.05']));
    const axisLabels = findAll(tree, 'text', (node) => hasClass(node, 'axis-label')).map(textContent);
    expect(axisLabels).toEqual(['μ [mag]', 'redshift z', 'Δμ [mag]']);
  });

  it('shows sample names in place of codes, and draws the model and binned means in ink, a colour no sample takes', () => {
    const named = parseXml(hubbleFigure(input, { sampleNames: { LOWZ: 'nearby programme' } }));
    const labels = findAll(named, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent);
    expect(labels.slice(0, 2)).toEqual(['nearby programme (3)', 'Lyra-Wide (3)']);
    const sampleColors = findAll(named, 'path', (node) => hasClass(node, 'markers')).map((node) => node.attributes.fill);
    expect(new Set(sampleColors).size).toBe(2);
    const modelColors = findAll(named, 'path', (node) => hasClass(node, 'model-curve') || hasClass(node, 'binned-markers')).map((node) => node.attributes.stroke);
    for (const color of modelColors) expect(sampleColors).not.toContain(color);
    // The binned means are open circles: white inside, and the legend key is an open circle too.
    expect(findAll(named, 'path', (node) => hasClass(node, 'binned-markers'))[0].attributes.fill).toBe('#ffffff');
    const binnedKey = findAll(named, 'g', (node) => hasClass(node, 'legend-entry') && textContent(node) === 'binned mean residual')[0];
    expect(findAll(binnedKey, 'circle')[0].attributes.fill).toBe('#ffffff');
  });

  it('puts the legend in a strip below the panels, so it covers no data', () => {
    const lowerClip = findAll(tree, 'clipPath', (node) => node.attributes.id === 'hd-clip-lower')[0].children[0].attributes;
    const rule = findAll(tree, 'path', (node) => hasClass(node, 'caption-rule'))[0];
    expect(Number(/^M[-\d.]+ ([-\d.]+)/.exec(rule.attributes.d)?.[1])).toBeGreaterThan(Number(lowerClip.y) + Number(lowerClip.height));
  });

  it('does not bin already-binned data again', () => {
    const binned = parseXml(hubbleFigure(input, { dataAreBinned: true }));
    expect(findAll(binned, 'path', (node) => hasClass(node, 'binned-markers'))).toHaveLength(0);
    expect(findAll(binned, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).not.toContain('binned mean residual');
  });

  it('throws figure.length_mismatch when per-supernova arrays differ', () => {
    expect(() => hubbleFigure({ ...input, muErrMag: new Float64Array(5) })).toThrow(/one entry per supernova/);
  });
});

describe('hubbleFigure on DES-SN5YR, whose release holds a few supernovae with huge errors', () => {
  // Open data set: DES Collaboration (Abbott et al. 2024), DES-SN5YR_HD.csv, 1829 supernovae; counted in the
  // file by hand: MU spans 34.96..44.59 mag, 64 rows have MUERR_FINAL above 5 mag, the largest is 449.6 mag.
  const rows = readFileSync('../shared/data-real/des-sn5yr/DES-SN5YR_HD.csv', 'utf8').trim().split('\n').slice(1).map((line) => line.split(','));
  const z = Float64Array.from(rows, (row) => Number(row[3]));
  const mu = Float64Array.from(rows, (row) => Number(row[5]));
  const muErr = Float64Array.from(rows, (row) => Number(row[6]));
  // Model: flat LambdaCDM, Omega_m = 0.3, H0 = 70, mu = 5 log10(D_L / Mpc) + 25 with D_L = (1 + z) c/H0 int_0^z dz'/E(z')
  // (Hogg 1999, eqs. 14, 15, 21, 25), integrated by the midpoint rule on 2000 steps.
  const muLambdaCdm = (redshift: number) => {
    let sum = 0;
    for (let step = 0; step < 2000; step++) sum += 1 / Math.sqrt(0.3 * (1 + ((step + 0.5) * redshift) / 2000) ** 3 + 0.7);
    return 5 * Math.log10((((1 + redshift) * 299792.458) / 70) * (sum * redshift / 2000)) + 25;
  };
  const grid = Float64Array.from({ length: 120 }, (_, k) => 0.005 * 400 ** (k / 119));
  const median = grid.map(muLambdaCdm);
  const svg = hubbleFigure({ redshift: z, muObsMag: mu, muErrMag: muErr, sample: rows.map((row) => row[1]), modelCurve: { z: grid, median, low68: median, high68: median } }, { sampleNames: { '10': 'DES' } });
  const figure = parseXml(svg);
  const [upperAxes, lowerAxes] = findAll(figure, 'g', (node) => hasClass(node, 'axes'));
  const tickValues = (axes: typeof upperAxes, anchor: string) => findAll(axes, 'text', (node) => hasClass(node, 'tick-label') && node.attributes['text-anchor'] === anchor).map((node) => Number(textContent(node).replace('\u2212', '-')));

  it('keeps the distance-modulus axis on the data (34.96..44.59 mag), not on the ±450 mag error bars', () => {
    const ticks = tickValues(upperAxes, 'end');
    expect(Math.min(...ticks)).toBeGreaterThanOrEqual(34);
    expect(Math.max(...ticks)).toBeLessThanOrEqual(46);
    expect(Math.max(...ticks) - Math.min(...ticks)).toBeGreaterThanOrEqual(6);
  });

  it('keeps the residual axis within ±1.5 mag and marks every error bar it cuts', () => {
    const ticks = tickValues(lowerAxes, 'end');
    expect(Math.max(...ticks.map(Math.abs))).toBeLessThanOrEqual(1.5);
    const legend = findAll(figure, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent);
    const cut = Number(/error bar beyond the axis \((\d+)\)/.exec(legend.join('|'))?.[1]);
    expect(cut).toBeGreaterThanOrEqual(64);
    expect(findAll(figure, 'path', (node) => hasClass(node, 'cut-marks')).length).toBeGreaterThan(0);
    expect(legend).toContain('DES (1635)');
  });
});
