import { readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parameterRanges, triangleFigure } from '../../../src/output/figures/index.js';
import type { ContourSet2D, MarginalDensity1D } from '../../../src/output/index.js';
import { gaussianContours, gaussianMarginals } from './gaussianPosterior.js';
import type { GaussianSpec } from './gaussianPosterior.js';
import { findAll, hasClass, parseXml, textContent } from './xmlTree.js';

const three: GaussianSpec = { parameters: ['omega_m', 'w0', 'h0'], means: [0.3, -1, 70], sigmas: [0.03, 0.1, 1], correlations: { '0,1': -0.8 } };
const wider: GaussianSpec = { ...three, means: [0.32, -0.95, 70.5], sigmas: [0.05, 0.15, 1.5] };
const runs = [
  { label: 'Lyra stat only', marginals: gaussianMarginals(three), contours: gaussianContours(three) },
  { label: 'Lyra stat+sys', marginals: gaussianMarginals(wider), contours: gaussianContours(wider) },
];

const luminance = (hex: string) => [1, 3, 5].reduce((sum, at) => sum + Number.parseInt(hex.slice(at, at + 2), 16), 0);

describe('triangleFigure', () => {
  const svg = triangleFigure(runs, three.parameters, { reference: { omega_m: 0.3, w0: -1 }, referenceLabel: 'mock input' });
  const tree = parseXml(svg);

  it('is a well-formed SVG with one filled path per credible region per run per pair', () => {
    expect(tree.name).toBe('svg');
    // 3 pairs x 2 runs x 2 regions (68% and 95%).
    expect(findAll(tree, 'path', (node) => hasClass(node, 'region'))).toHaveLength(12);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'region-outline'))).toHaveLength(12);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'marginal'))).toHaveLength(6);
    for (const region of findAll(tree, 'path', (node) => hasClass(node, 'region'))) expect(region.attributes['fill-rule']).toBe('evenodd');
  });

  it('fills the 68% region darker than the 95% region', () => {
    const regions = findAll(tree, 'path', (node) => hasClass(node, 'region')).slice(0, 2);
    const byMass = Object.fromEntries(regions.map((node) => [node.attributes['data-mass'], node.attributes.fill]));
    expect(luminance(byMass['0.6827'])).toBeLessThan(luminance(byMass['0.9545']));
  });

  it('has a legend entry per run plus the reference lines', () => {
    const entries = findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent);
    expect(entries).toEqual(['Lyra stat only', 'Lyra stat+sys', 'mock input']);
  });

  it('labels the axes with symbols: a real Ω with subscript m, units in brackets', () => {
    const labels = findAll(tree, 'text', (node) => hasClass(node, 'axis-label')).map(textContent);
    expect(labels.filter((label) => label === 'Ωm')).toHaveLength(1);
    expect(labels.filter((label) => label === 'w0')).toHaveLength(2);
    expect(labels).toContain('H0 [km s⁻¹ Mpc⁻¹]');
    const omega = findAll(tree, 'text', (node) => hasClass(node, 'axis-label') && textContent(node) === 'Ωm')[0];
    expect(omega.text).toBe('Ω');
    expect(findAll(omega, 'tspan')[0].text).toBe('m');
  });

  it('maps region vertices through the shared parameter ranges onto each panel', () => {
    // A square region [0.25, 0.35] x [-1.2, -0.8] in panel (row w0, column omega_m) with fixed ranges:
    // pixel = left + (value - low) / (high - low) * width, y flipped (definition of the axes).
    const square = [[0.25, -1.2], [0.35, -1.2], [0.35, -0.8], [0.25, -0.8], [0.25, -1.2]];
    const contour: ContourSet2D = { grid: { xParameter: 'omega_m', yParameter: 'w0', x: new Float64Array(0), y: new Float64Array(0), density: new Float64Array(0), bandwidthX: 0, bandwidthY: 0 }, regions: [{ mass: 0.68, threshold: 1, geometry: { type: 'MultiPolygon', coordinates: [[square]] } }] };
    const ranges = { omega_m: [0.2, 0.4] as const, w0: [-1.5, -0.5] as const };
    const figure = parseXml(triangleFigure([{ label: 'square', marginals: gaussianMarginals(three).slice(0, 2), contours: [contour] }], ['omega_m', 'w0'], { ranges, idPrefix: 'sq' }));
    const clip = findAll(figure, 'clipPath', (node) => node.attributes.id === 'sq-clip-1-0')[0].children[0].attributes;
    const [left, top, width, height] = [clip.x, clip.y, clip.width, clip.height].map(Number);
    const px = (value: number) => String(Number((left + ((value - 0.2) / 0.2) * width).toFixed(2)));
    const py = (value: number) => String(Number((top + height - ((value + 1.5) / 1) * height).toFixed(2)));
    const expected = `M${px(0.25)} ${py(-1.2)}L${px(0.35)} ${py(-1.2)}L${px(0.35)} ${py(-0.8)}L${px(0.25)} ${py(-0.8)}Z`;
    expect(findAll(figure, 'path', (node) => hasClass(node, 'region'))[0].attributes.d).toBe(expected);
  });

  it('accepts a pair given the other way round and transposes it', () => {
    const swapped = gaussianContours(three).map((set) => ({
      grid: { ...set.grid, xParameter: set.grid.yParameter, yParameter: set.grid.xParameter },
      regions: set.regions.map((region) => ({ ...region, geometry: { type: 'MultiPolygon' as const, coordinates: region.geometry.coordinates.map((polygon) => polygon.map((ring) => ring.map(([x, y]) => [y, x]))) } })),
    }));
    const normal = triangleFigure([{ label: 'a', marginals: gaussianMarginals(three), contours: gaussianContours(three) }], three.parameters);
    const transposed = triangleFigure([{ label: 'a', marginals: gaussianMarginals(three), contours: swapped }], three.parameters);
    expect(transposed).toBe(normal);
  });

  it('throws figure.no_runs, figure.no_parameters and figure.no_density for unusable input', () => {
    const code = (action: () => unknown) => {
      try {
        action();
      } catch (error) {
        return (error as { issues: { code: string }[] }).issues[0].code;
      }
      return 'no error';
    };
    expect(code(() => triangleFigure([], ['omega_m']))).toBe('figure.no_runs');
    expect(code(() => triangleFigure(runs, []))).toBe('figure.no_parameters');
    expect(code(() => triangleFigure(runs, ['omega_m', 'wa']))).toBe('figure.no_density');
  });
});

describe('parameterRanges', () => {
  it('takes the union over runs of the marginal above 0.2% of its peak, padded by 4%', () => {
    const flat = (parameter: string, low: number, high: number): MarginalDensity1D => ({ parameter, x: Float64Array.of(low, (low + high) / 2, high), density: Float64Array.of(1, 1, 1), bandwidth: 0 });
    const ranges = parameterRanges([{ marginals: [flat('w0', -1.5, -0.5)], contours: [] }, { marginals: [flat('w0', -1.2, 0.5)], contours: [] }], ['w0'], {});
    // Union [-1.5, 0.5], width 2, padding 0.08 (by hand).
    expect(ranges[0][0]).toBeCloseTo(-1.58, 12);
    expect(ranges[0][1]).toBeCloseTo(0.58, 12);
    expect(parameterRanges([], ['w0'], { w0: [-2, 0] })).toEqual([[-2, 0]]);
  });
});

describe('triangleFigure golden file', () => {
  it('draws the tiny fixed input exactly as test/golden/figures/triangle-tiny.svg', () => {
    // A fixed two-parameter input with literal coordinates; the golden file was inspected by eye
    // (rendered to PNG) when written. Set CANDELA_UPDATE_GOLDEN=1 to rewrite it after an intended change.
    const marginals: MarginalDensity1D[] = [
      { parameter: 'omega_m', x: Float64Array.of(0.2, 0.25, 0.3, 0.35, 0.4), density: Float64Array.of(0.1, 2, 4, 2, 0.1), bandwidth: 0.01 },
      { parameter: 'w0', x: Float64Array.of(-1.4, -1.2, -1, -0.8, -0.6), density: Float64Array.of(0.05, 1, 2, 1, 0.05), bandwidth: 0.05 },
    ];
    const ring = (scale: number) => [[0.3 - 0.05 * scale, -1 + 0.2 * scale], [0.3, -1 - 0.05 * scale], [0.3 + 0.05 * scale, -1 - 0.2 * scale], [0.3, -1 + 0.05 * scale], [0.3 - 0.05 * scale, -1 + 0.2 * scale]];
    const contours: ContourSet2D[] = [{
      grid: { xParameter: 'omega_m', yParameter: 'w0', x: new Float64Array(0), y: new Float64Array(0), density: new Float64Array(0), bandwidthX: 0, bandwidthY: 0 },
      regions: [
        { mass: 0.68, threshold: 2, geometry: { type: 'MultiPolygon', coordinates: [[ring(1)]] } },
        { mass: 0.95, threshold: 0.5, geometry: { type: 'MultiPolygon', coordinates: [[ring(2)]] } },
      ],
    }];
    const svg = triangleFigure([{ label: 'tiny fixture', marginals, contours }], ['omega_m', 'w0'], { panelPx: 120, reference: { omega_m: 0.3 } });
    const path = 'test/golden/figures/triangle-tiny.svg';
    if (process.env.CANDELA_UPDATE_GOLDEN) writeFileSync(path, svg);
    expect(svg).toBe(readFileSync(path, 'utf8'));
  });
});
