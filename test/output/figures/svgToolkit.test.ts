import { describe, expect, it } from 'vitest';
import {
  bandPathData,
  circleMarkersPathData,
  createAxisScale,
  decimateMinMax,
  drawAxes,
  drawLegend,
  errorBarsPathData,
  escapeXml,
  linePathData,
  mixWithWhite,
  multiPolygonPathData,
  LANTERN_COLORS,
  SERIES_COLORS,
  seriesMarkerShape,
  seriesColor,
  svgDocument,
  svgElement,
} from '../../../src/output/figures/index.js';
import { hatchLinesInRectangle } from '../../../src/output/figures/hatchPattern.js';
import { findAll, hasClass, parseXml, textContent } from './xmlTree.js';

describe('parseXml (test helper)', () => {
  it('rejects what XML 1.0 forbids, so the figure checks below can fail', () => {
    expect(() => parseXml('<a><b></a></b>')).toThrow(/does not match/);
    expect(() => parseXml('<a x="1" x="2"/>')).toThrow(/duplicate/);
    expect(() => parseXml('<a>1 < 2</a>')).toThrow();
    expect(() => parseXml('<a>AT&T</a>')).toThrow(/entity/);
    expect(() => parseXml('<a>&nbsp;</a>')).toThrow(/unknown entity/);
    expect(() => parseXml('<a/><b/>')).toThrow(/second root/);
    expect(parseXml('<a t="&lt;&#937;">x<b/>y</a>').attributes.t).toBe('<Ω');
  });
});

describe('escapeXml', () => {
  it('escapes the five XML special characters (W3C XML 1.0, section 2.4)', () => {
    expect(escapeXml(`a < b & "c" 'd' > e`)).toBe('a &lt; b &amp; &quot;c&quot; &#39;d&#39; &gt; e');
  });
  it('replaces control characters that XML 1.0 forbids (section 2.2) by U+FFFD', () => {
    expect(escapeXml('bell\u0007tab\tnewline\n')).toBe('bell\uFFFDtab\tnewline\n');
    expect(() => parseXml(`<t>${escapeXml('x\u0000y & <z>')}</t>`)).not.toThrow();
  });
});

describe('svgElement', () => {
  it('writes numbers as pixels with two decimals, escapes values and drops absent attributes', () => {
    expect(svgElement('rect', { x: 1.23456, y: -0.001, width: 10, fill: 'a"b', stroke: undefined, hidden: false })).toBe('<rect x="1.23" y="0" width="10" fill="a&quot;b"/>');
    expect(svgElement('text', { x: Number.NaN }, 'Ω')).toBe('<text x="0">Ω</text>');
  });
});

describe('createAxisScale', () => {
  it('maps a linear domain onto pixels, reversed for a y axis', () => {
    const y = createAxisScale('linear', [0, 1], [250, 50]);
    expect(y.toPx(0)).toBe(250);
    expect(y.toPx(0.25)).toBe(200);
  });
  it('maps a log domain by log10: 1 is halfway between 0.1 and 10 (definition of a log scale)', () => {
    const x = createAxisScale('log', [0.1, 10], [0, 200]);
    expect(x.toPx(1)).toBeCloseTo(100, 12);
    expect(x.toPx(Math.sqrt(10) / 10)).toBeCloseTo(50, 12);
    expect(Number.isFinite(x.toPx(0))).toBe(false);
  });
  it('throws figure.bad_scale for an empty or non-positive log domain', () => {
    expect(() => createAxisScale('linear', [1, 1], [0, 1])).toThrow(/linear axis/);
    expect(() => createAxisScale('log', [0, 1], [0, 1])).toThrow(/positive/);
  });
});

describe('path data', () => {
  const x = createAxisScale('linear', [0, 10], [0, 100]);
  const y = createAxisScale('linear', [0, 10], [100, 0]);

  it('multiPolygonPathData closes every ring, drops the repeated GeoJSON end point and keeps holes as sub-paths', () => {
    // RFC 7946 section 3.1.6: a ring's first and last positions are equal; interior rings are holes.
    const square = [[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]];
    const hole = [[4, 4], [4, 6], [6, 6], [6, 4], [4, 4]];
    const data = multiPolygonPathData({ type: 'MultiPolygon', coordinates: [[square, hole]] }, x, y);
    expect(data).toBe('M0 100L100 100L100 0L0 0ZM40 60L40 40L60 40L60 60Z');
    expect(multiPolygonPathData({ type: 'MultiPolygon', coordinates: [[[[0, 0], [1, 1]]]] }, x, y)).toBe('');
  });

  it('linePathData breaks the line at a non-finite value instead of drawing NaN', () => {
    expect(linePathData([0, 1, 2, 3], [0, Number.NaN, 2, 3], x, y)).toBe('M0 100M20 80L30 70');
  });

  it('bandPathData goes out along the upper curve and back along the lower one', () => {
    expect(bandPathData([0, 10], [1, 2], [3, 4], x, y)).toBe('M0 70L100 60L100 80L0 90Z');
  });

  it('errorBarsPathData draws y ± error and skips negative or non-finite errors', () => {
    expect(errorBarsPathData([5, 6, 7], [5, 5, 5], [1, -1, Number.NaN], x, y)).toBe('M50 60V40');
  });

  it('circleMarkersPathData draws one closed pair of arcs per finite point', () => {
    const data = circleMarkersPathData([5, Number.NaN], [5, 1], x, y, 2);
    expect(data).toBe('M48 50a2 2 0 1 0 4 0a2 2 0 1 0 -4 0');
  });
});

describe('drawAxes', () => {
  it('draws tick labels, a real Ω in the axis title with a subscripted m', () => {
    const frame = { leftPx: 60, topPx: 10, widthPx: 200, heightPx: 100, clipId: 'c' };
    const scale = createAxisScale('linear', [0, 1], [60, 260]);
    const svg = drawAxes(frame, { scale, ticks: [0, 0.5, 1, 2], tickLabels: ['0', '0.5', '1', '2'], label: '\\Omega_{\\rm m}' }, undefined);
    const tree = parseXml(svg);
    expect(findAll(tree, 'text', (node) => hasClass(node, 'tick-label')).map(textContent)).toEqual(['0', '0.5', '1']);
    const title = findAll(tree, 'text', (node) => hasClass(node, 'axis-label'))[0];
    expect(textContent(title)).toBe('Ωm');
    const sub = findAll(title, 'tspan')[0];
    expect(sub.text).toBe('m');
    expect(Number(sub.attributes['baseline-shift'])).toBeLessThan(0);
  });
});

describe('drawLegend', () => {
  it('draws one entry per key and wraps a row legend at the given width', () => {
    const entries = ['first run', 'second run', 'third run'].map((label, index) => ({ label, color: seriesColor(index), key: 'fill' as const }));
    const column = drawLegend(entries, 0, 0);
    expect(findAll(parseXml(column.svg), 'g', (node) => hasClass(node, 'legend-entry'))).toHaveLength(3);
    const row = drawLegend(entries, 0, 0, { direction: 'row', maxWidthPx: 150 });
    expect(row.heightPx).toBeGreaterThan(drawLegend(entries, 0, 0, { direction: 'row' }).heightPx);
    expect(drawLegend([], 0, 0)).toEqual({ svg: '', widthPx: 0, heightPx: 0 });
  });
});

describe('palette', () => {
  // Colour-vision-deficiency simulation matrices of Machado, Oliveira & Fernandes (2009), severity 1.0,
  // applied to linear sRGB (from memory); sRGB decoding (IEC 61966-2-1) and CIELAB with the D65 white
  // (CIE 15:2004) as published.
  const simulations: Record<string, number[][] | undefined> = {
    normal: undefined,
    protanopia: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
    deuteranopia: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.01182, 0.04294, 0.968881]],
    tritanopia: [[1.255528, -0.076749, -0.178779], [-0.078411, 0.930809, 0.147602], [0.004733, 0.691367, 0.3039]],
  };
  const toLab = (hex: string, matrix?: number[][]) => {
    const linear = [1, 3, 5].map((at) => Number.parseInt(hex.slice(at, at + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
    const [r, g, b] = (matrix ? matrix.map((row) => row[0] * linear[0] + row[1] * linear[1] + row[2] * linear[2]) : linear).map((v) => Math.min(1, Math.max(0, v)));
    const xyz = [0.4124 * r + 0.3576 * g + 0.1805 * b, 0.2126 * r + 0.7152 * g + 0.0722 * b, 0.0193 * r + 0.1192 * g + 0.9505 * b];
    const f = (t: number) => (t > 216 / 24389 ? Math.cbrt(t) : ((24389 / 27) * t + 16) / 116);
    const [fx, fy, fz] = [f(xyz[0] / 0.95047), f(xyz[1]), f(xyz[2] / 1.08883)];
    return [116 * fy - 16, 500 * (fx - fy), 200 * (fy - fz)];
  };

  it('keeps every pair of series colours at least 25 CIELAB units apart for normal and simulated dichromatic vision', () => {
    for (const [name, matrix] of Object.entries(simulations)) {
      const labs = SERIES_COLORS.map((hex) => toLab(hex, matrix));
      let smallest = Infinity;
      for (let i = 0; i < labs.length; i++) for (let j = i + 1; j < labs.length; j++) smallest = Math.min(smallest, Math.hypot(labs[i][0] - labs[j][0], labs[i][1] - labs[j][1], labs[i][2] - labs[j][2]));
      // CIE 1976 difference; about 2.3 is just noticeable (Sharma 2003, from memory): 25 is far apart.
      expect(smallest, name).toBeGreaterThan(25);
    }
  });

  it('keeps series colours dark enough for thin lines on white (CIELAB lightness 30..68) and never uses the role colours', () => {
    for (const hex of SERIES_COLORS) {
      const [lightness] = toLab(hex);
      expect(lightness).toBeGreaterThan(30);
      expect(lightness).toBeLessThan(68);
      expect([LANTERN_COLORS.ink, LANTERN_COLORS.haze]).not.toContain(hex);
    }
    expect(seriesColor(0)).toBe(LANTERN_COLORS.indigo);
    expect(seriesColor(SERIES_COLORS.length)).toBe(seriesColor(0));
    expect([0, 6, 12].map(seriesMarkerShape)).toEqual(['circle', 'square', 'diamond']);
  });

  it('mixWithWhite moves each channel linearly towards 255', () => {
    expect(mixWithWhite('#000000', 0.5)).toBe('#808080');
    expect(mixWithWhite('#0072B2', 0)).toBe('#0072b2');
    expect(mixWithWhite('#0072B2', 1)).toBe('#ffffff');
  });
});

describe('decimateMinMax', () => {
  it('keeps each bucket extreme values in order', () => {
    const kept = decimateMinMax(Float64Array.of(0, 5, 1, 2, -3, 4), 4);
    expect(Array.from(kept.index)).toEqual([0, 1, 4, 5]);
    expect(Array.from(kept.value)).toEqual([0, 5, -3, 4]);
  });
  it('returns a short series whole, without its non-finite values', () => {
    expect(Array.from(decimateMinMax([1, Number.NaN, 3], 10).value)).toEqual([1, 3]);
  });
  it('keeps the global minimum and maximum of a long series', () => {
    const values = Float64Array.from({ length: 10_000 }, (_, index) => Math.sin(index / 50));
    values[7777] = 9;
    values[1234] = -9;
    const kept = decimateMinMax(values, 200);
    expect(kept.value.length).toBeLessThanOrEqual(200);
    expect(Math.max(...kept.value)).toBe(9);
    expect(Math.min(...kept.value)).toBe(-9);
  });
});

describe('svgDocument', () => {
  it('is a standalone SVG with namespace, viewBox, title and a white page', () => {
    const tree = parseXml(svgDocument(120, 80, 'a < b', [], []));
    expect(tree.name).toBe('svg');
    expect(tree.attributes.xmlns).toBe('http://www.w3.org/2000/svg');
    expect(tree.attributes.viewBox).toBe('0 0 120 80');
    expect(findAll(tree, 'title')[0].text).toBe('a < b');
    expect(findAll(tree, 'rect')[0].attributes.fill).toBe('#ffffff');
  });
});

describe('hatchLinesInRectangle', () => {
  it('cuts every line at the rectangle edges and keeps the angle (slab clipping, Liang & Barsky 1984)', () => {
    const data = hatchLinesInRectangle(10, 20, 40, 30, 45, 4);
    const segments = [...data.matchAll(/M(-?[\d.]+) (-?[\d.]+)L(-?[\d.]+) (-?[\d.]+)/g)].map((match) => match.slice(1).map(Number));
    expect(segments.length).toBeGreaterThan(10);
    const onEdge = (x: number, y: number) => Math.min(Math.abs(x - 10), Math.abs(x - 50), Math.abs(y - 20), Math.abs(y - 50)) < 0.02;
    for (const [x0, y0, x1, y1] of segments) {
      expect(onEdge(x0, y0) && onEdge(x1, y1)).toBe(true);
      // 45 degrees counterclockwise on screen: y falls as x rises, slope -1 (pixel coordinates, two decimals).
      expect((y1 - y0) / (x1 - x0)).toBeCloseTo(-1, 1);
    }
    expect(hatchLinesInRectangle(0, 0, 10, 10, 0, 5)).toBe('M0 0.43L10 0.43M0 5.43L10 5.43');
  });
});
