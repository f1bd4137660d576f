import { describe, expect, it } from 'vitest';
import { bandFigure, sampleWalkerTraces, traceFigure, traceStackFigure } from '../../../src/output/figures/index.js';
import { findAll, hasClass, parseXml, textContent } from './xmlTree.js';

const ramp = (length: number, start: number, end: number) => Float64Array.from({ length }, (_, index) => start + ((end - start) * index) / (length - 1));

describe('sampleWalkerTraces', () => {
  // 2 ensembles x 4 steps x 3 walkers, value = 100 x ensemble + 10 x walker + step, except walker 2 of
  // ensemble 1, which never moves (all by hand).
  const layout = { steps: 4, walkers: 3, ensembles: 2 };
  const column = new Float64Array(24);
  for (let ensemble = 0; ensemble < 2; ensemble++) {
    for (let step = 0; step < 4; step++) {
      for (let walker = 0; walker < 3; walker++) column[(ensemble * 4 + step) * 3 + walker] = ensemble === 1 && walker === 2 ? 7 : 100 * ensemble + 10 * walker + step;
    }
  }

  it('reads walkers from the chain layout (ensemble x steps + step) x walkers + walker', () => {
    const traces = sampleWalkerTraces(column, layout, { perEnsemble: 3 });
    expect(traces.map((trace) => trace.label)).toEqual(['ensemble 1', 'ensemble 2']);
    expect(Array.from(traces[0].series[1])).toEqual([10, 11, 12, 13]);
    expect(Array.from(traces[1].series[0])).toEqual([100, 101, 102, 103]);
  });

  it('always includes the walker that moved least, and highlights flagged stuck walkers', () => {
    // One walker per ensemble is picked at index floor(0.5 x 3) = 1; the least-moving walker is added.
    const traces = sampleWalkerTraces(column, layout, { perEnsemble: 1, stuckWalkers: [[], [2]] });
    expect(traces[1].walkers).toEqual([1, 2]);
    expect(traces[1].stuck).toEqual([1]);
    expect(Array.from(traces[1].series[1])).toEqual([7, 7, 7, 7]);
    expect(traces[0].stuck).toEqual([]);
    const figure = parseXml(traceStackFigure([{ parameter: 'omega_m', ensembles: traces }], 0));
    const stuck = findAll(figure, 'path', (node) => hasClass(node, 'stuck-walker'));
    expect(stuck).toHaveLength(1);
    expect(stuck[0].attributes['data-walker']).toBe('2');
    expect(findAll(figure, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toContain('stuck walker');
  });
});

describe('traceStackFigure', () => {
  const ensembles = [
    { label: 'ensemble 1', series: [ramp(1001, 0.1, 0.3), ramp(1001, 0.5, 0.3)] },
    { label: 'ensemble 2', series: [ramp(1001, 0.2, 0.31)] },
  ];
  const tree = parseXml(traceStackFigure([{ parameter: 'omega_m', ensembles }, { parameter: 'w0', ensembles }], 250, { idPrefix: 'tr' }));

  it('draws one trace path per ensemble per panel and a legend entry per ensemble', () => {
    expect(findAll(tree, 'path', (node) => hasClass(node, 'trace'))).toHaveLength(4);
    expect(findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toEqual(['ensemble 1 (2 walkers)', 'ensemble 2']);
  });

  it('puts the legend in a caption strip below the step axis', () => {
    const lastClip = findAll(tree, 'clipPath', (node) => node.attributes.id === 'tr-clip-1')[0].children[0].attributes;
    const rule = findAll(tree, 'path', (node) => hasClass(node, 'caption-rule'))[0];
    expect(Number(/^M[-\d.]+ ([-\d.]+)/.exec(rule.attributes.d)?.[1])).toBeGreaterThan(Number(lastClip.y) + Number(lastClip.height));
  });

  it('shades the burn-in up to its step on the shared step axis', () => {
    // Steps 0..1000 across the panel: step 250 lies a quarter of the way (definition of a linear axis).
    const clip = findAll(tree, 'clipPath', (node) => node.attributes.id === 'tr-clip-0')[0].children[0].attributes;
    const burnIn = findAll(tree, 'rect', (node) => hasClass(node, 'burn-in'));
    expect(burnIn).toHaveLength(2);
    expect(Number(burnIn[0].attributes.width)).toBeCloseTo(Number(clip.width) / 4, 1);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'burn-in-edge'))).toHaveLength(2);
  });

  it('labels the step axis on the bottom panel only and the parameters with their symbols', () => {
    const axisLabels = findAll(tree, 'text', (node) => hasClass(node, 'axis-label')).map(textContent);
    expect(axisLabels).toEqual(['Ωm', 'step', 'w0']);
  });

  it('draws a single panel with traceFigure and no burn-in when burnInStep is 0', () => {
    const single = parseXml(traceFigure('w0', [{ label: 'mean of walkers', series: [ramp(10, -1, -0.9)], firstStep: 100, stepStride: 10 }], 0));
    expect(findAll(single, 'rect', (node) => hasClass(node, 'burn-in'))).toHaveLength(0);
    expect(findAll(single, 'path', (node) => hasClass(node, 'trace'))).toHaveLength(1);
  });
});

describe('bandFigure', () => {
  const x = ramp(21, 0, 2);
  const median = x.map((z) => -1 + 0.1 * z);
  const input = {
    x,
    median,
    low68: median.map((value) => value - 0.1),
    high68: median.map((value) => value + 0.1),
    low95: median.map((value) => value - 0.2),
    high95: median.map((value) => value + 0.2),
    referenceLine: { y: -1, label: 'w = -1' },
    xLabel: 'redshift z',
    yLabel: 'w(z)',
  };

  it('draws the 95% band, the 68% band, the reference and the median, with a legend', () => {
    const tree = parseXml(bandFigure(input));
    expect(findAll(tree, 'path', (node) => hasClass(node, 'band-95'))).toHaveLength(1);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'band-68'))).toHaveLength(1);
    expect(findAll(tree, 'path', (node) => hasClass(node, 'reference'))).toHaveLength(1);
    expect(findAll(tree, 'g', (node) => hasClass(node, 'legend-entry')).map(textContent)).toEqual(['median', '68% credible band', '95% credible band', 'w = -1']);
    expect(findAll(tree, 'text', (node) => hasClass(node, 'axis-label')).map(textContent)).toEqual(['redshift z', 'w(z)']);
  });

  it('takes a curve as reference and a log x axis', () => {
    const tree = parseXml(bandFigure({ ...input, x: ramp(21, 0.01, 2), referenceLine: { x: ramp(21, 0.01, 2), y: median, label: 'flat LambdaCDM' } }, { xScale: 'log' }));
    expect(findAll(tree, 'path', (node) => hasClass(node, 'reference'))[0].attributes.d.split('L')).toHaveLength(21);
  });

  it('throws figure.length_mismatch for bands of another length', () => {
    expect(() => bandFigure({ ...input, low68: new Float64Array(3) })).toThrow(/same length/);
  });
});
