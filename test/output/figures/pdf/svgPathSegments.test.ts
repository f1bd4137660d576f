import { describe, expect, it } from 'vitest';
import { svgPathSegments } from '../../../../src/output/figures/pdf/svgPathSegments.js';

describe('svgPathSegments', () => {
  it('reads absolute, relative, horizontal and vertical lines and closes (SVG 1.1, section 8.3)', () => {
    expect(svgPathSegments('M1 2h3v4L0 0l1 1z')).toEqual([
      { kind: 'move', x: 1, y: 2 }, { kind: 'line', x: 4, y: 2 }, { kind: 'line', x: 4, y: 6 },
      { kind: 'line', x: 0, y: 0 }, { kind: 'line', x: 1, y: 1 }, { kind: 'close' },
    ]);
  });

  it('treats coordinates after a move as implicit lines (SVG 1.1, section 8.3.2)', () => {
    expect(svgPathSegments('m1 1 2 0 0 2')).toEqual([{ kind: 'move', x: 1, y: 1 }, { kind: 'line', x: 3, y: 1 }, { kind: 'line', x: 3, y: 3 }]);
  });

  it('turns two half-circle arcs into cubics whose points lie on the circle (arc conversion of SVG 1.1, appendix F.6.5)', () => {
    const radius = 5;
    const segments = svgPathSegments(`M10 20a${radius} ${radius} 0 1 0 10 0a${radius} ${radius} 0 1 0 -10 0`);
    const cubics = segments.filter((segment) => segment.kind === 'cubic');
    expect(cubics.length).toBe(4);
    let [x0, y0] = [10, 20];
    for (const segment of cubics) {
      if (segment.kind !== 'cubic') continue;
      // The midpoint of a cubic at t = 1/2 is (P0 + 3 P1 + 3 P2 + P3) / 8 (de Casteljau, common practice).
      const mx = (x0 + 3 * segment.x1 + 3 * segment.x2 + segment.x) / 8;
      const my = (y0 + 3 * segment.y1 + 3 * segment.y2 + segment.y) / 8;
      // A quarter-circle cubic with handle 4/3 tan(pi/8) deviates from the circle by 2.7e-4 of the radius at most (common practice).
      expect(Math.hypot(mx - 15, my - 20)).toBeCloseTo(radius, 2);
      expect(Math.hypot(segment.x - 15, segment.y - 20)).toBeCloseTo(radius, 9);
      [x0, y0] = [segment.x, segment.y];
    }
    expect(x0).toBeCloseTo(10, 9);
    expect(y0).toBeCloseTo(20, 9);
  });

  it('raises a quadratic curve to the cubic with control points 2/3 of the way to the quadratic one (common practice)', () => {
    expect(svgPathSegments('M0 0Q3 3 6 0')).toEqual([{ kind: 'move', x: 0, y: 0 }, { kind: 'cubic', x1: 2, y1: 2, x2: 4, y2: 2, x: 6, y: 0 }]);
  });

  it('throws figure.bad_svg for path data it cannot read', () => {
    expect(() => svgPathSegments('M1')).toThrow(/path data/);
  });
});
