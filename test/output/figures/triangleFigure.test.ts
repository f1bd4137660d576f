import { readFileSync, writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parameterRanges, triangleFigure } from '../../../src/output/figures/index.js';
import type { ContourSet2D, MarginalDensity1D } from '../../../src/output/density/densityTypes.js';
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

  it('is a well-formed SVG with one outline per credible region per run per pair, hatching inside the innermost only', () => {
    expect(tree.name).toBe('svg');
    // 3 pairs x 2 runs x 2 regions (68% and 95%); hatching: 3 pairs x 2 runs.
    const regions = findAll(tree, 'path', (node) => hasClass(node, 'region'));
    expect(regions).toHaveLength(12);
    for (const region of regions) expect(region.attributes.fill).toBe('none');
    expect(findAll(tree, 'path', (node) => hasClass(node, 'hatching'))).toHaveLength(6);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'marginal'))).toHaveLength(6);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'marginal-area'))).toHaveLength(6);
  });

  it('draws the 68% region with a heavier outline than the 95% region', () => {
    const regions = findAll(tree, 'path', (node) => hasClass(node, 'region')).slice(0, 2);
    const byMass = Object.fromEntries(regions.map((node) => [node.attributes['data-mass'], Number(node.attributes['stroke-width'])]));
    expect(byMass['0.6827']).toBeGreaterThan(byMass['0.9545']);
  });

  it('hatches each run in its own direction, clipped to the region outline', () => {
    const hatching = findAll(tree, 'path', (node) => hasClass(node, 'hatching'));
    const direction = (d: string) => {
      const [x0, y0, x1, y1] = (/^M([-\d.]+) ([-\d.]+)L([-\d.]+) ([-\d.]+)/.exec(d) ?? []).slice(1).map(Number);
      return Math.sign((x1 - x0) * (y1 - y0));
    };
    expect(direction(hatching[0].attributes.d)).not.toBe(direction(hatching[1].attributes.d));
    const clipIds = findAll(tree, 'clipPath').map((node) => node.attributes.id);
    expect(clipIds.filter((id) => id.includes('hatch'))).toHaveLength(6);
  });

  it('frames every panel, with tick marks pointing into it', () => {
    const frames = findAll(tree, 'path', (node) => hasClass(node, 'frame'));
    // 3 marginal panels + 3 pair panels.
    expect(frames).toHaveLength(6);
    for (const frame of frames) expect(frame.attributes.d).toMatch(/Z$/);
  });

  it('puts the legend in a caption strip below the panels: a run entry each, then the truth marker', () => {
    const entries = findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent);
    expect(entries).toEqual(['Lyra stat only (68% hatched, 95% outline)', 'Lyra stat+sys (68% hatched, 95% outline)', 'mock input']);
    const strip = findAll(tree, 'g', (node) => hasClass(node, 'caption-strip'))[0];
    const ruleY = Number(/^M[-\d.]+ ([-\d.]+)/.exec(findAll(strip, 'path', (node) => hasClass(node, 'caption-rule'))[0].attributes.d)?.[1]);
    const lowestClip = Math.max(...findAll(tree, 'clipPath').map((node) => node.children[0].attributes).filter((a) => a.y !== undefined).map((a) => Number(a.y) + Number(a.height)));
    expect(ruleY).toBeGreaterThan(lowestClip);
  });

  it('marks the true values with a cross in the pair panel that has both and lines on the marginals', () => {
    expect(findAll(tree, 'path', (node) => hasClass(node, 'truth'))).toHaveLength(1);
    // omega_m and w0 marginals, and the two panels against h0 (one known coordinate each).
    expect(findAll(tree, 'path', (node) => hasClass(node, 'truth-line'))).toHaveLength(4);
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

describe('triangleFigure flat-universe line', () => {
  it('draws Omega_m + Omega_DE = 1 on the (omega_m, omega_de) panel of a curved model (the flat FLRW condition, common practice)', () => {
    const curved: GaussianSpec = { parameters: ['omega_m', 'omega_de'], means: [0.3, 0.7], sigmas: [0.05, 0.1] };
    const ranges = { omega_m: [0.1, 0.5] as const, omega_de: [0.4, 1.0] as const };
    const figure = parseXml(triangleFigure([{ label: 'curved', marginals: gaussianMarginals(curved), contours: gaussianContours(curved) }], curved.parameters, { ranges, idPrefix: 'cv' }));
    const lines = findAll(figure, 'path', (node) => hasClass(node, 'flat-universe'));
    expect(lines).toHaveLength(1);
    const clip = findAll(figure, 'clipPath', (node) => node.attributes.id === 'cv-clip-1-0')[0].children[0].attributes;
    const [left, top, width, height] = [clip.x, clip.y, clip.width, clip.height].map(Number);
    const [x0, y0, x1, y1] = (/^M([-\d.]+) ([-\d.]+)L([-\d.]+) ([-\d.]+)$/.exec(lines[0].attributes.d) ?? []).slice(1).map(Number);
    // At omega_m = 0.1 the flat line has omega_de = 0.9; at 0.5 it has 0.5.
    expect(x0).toBeCloseTo(left, 1);
    expect(y0).toBeCloseTo(top + height - ((0.9 - 0.4) / 0.6) * height, 1);
    expect(x1).toBeCloseTo(left + width, 1);
    expect(y1).toBeCloseTo(top + height - ((0.5 - 0.4) / 0.6) * height, 1);
    expect(findAll(figure, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toContain('flat universe (Ωk = 0)');
    const off = parseXml(triangleFigure([{ label: 'curved', marginals: gaussianMarginals(curved), contours: gaussianContours(curved) }], curved.parameters, { flatUniverseLine: false }));
    expect(findAll(off, 'path', (node) => hasClass(node, 'flat-universe'))).toHaveLength(0);
  });

  it('fits a journal column: width single is 3.4 in = 326.4 px (96 px per inch, CSS Values 3)', () => {
    const figure = parseXml(triangleFigure(runs, three.parameters, { width: 'single', fontFace: 'serif' }));
    expect(Number(figure.attributes.width)).toBeCloseTo(326.4, 2);
    expect(figure.attributes['font-family']).toMatch(/serif$/);
    expect(figure.attributes['font-family']).not.toMatch(/sans-serif$/);
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
