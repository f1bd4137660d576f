import { describe, expect, it } from 'vitest';
import { adaptiveGaussKronrod, createCompositeGaussLegendre, gaussLegendreRule } from '../../src/math/index.js';

describe('gaussLegendreRule', () => {
  it('reproduces the tabulated 2-, 3- and 5-point rules (Abramowitz & Stegun 1964, table 25.4)', () => {
    const two = gaussLegendreRule(2);
    expect(two.nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
    expect(two.weights[0]).toBeCloseTo(1, 15);
    expect(two.weights[1]).toBeCloseTo(1, 15);
    const three = gaussLegendreRule(3);
    expect(three.nodes[1]).toBe(0);
    expect(three.nodes[2]).toBeCloseTo(Math.sqrt(3 / 5), 15);
    expect(three.weights[1]).toBeCloseTo(8 / 9, 15);
    expect(three.weights[0]).toBeCloseTo(5 / 9, 15);
    // A&S table 25.4, n = 5 (values from memory): +-0.906179845938664, +-0.538469310105683; weights 0.236926885056189, 0.478628670499366, 0.568888888888889.
    const five = gaussLegendreRule(5);
    expect(five.nodes[4]).toBeCloseTo(0.906179845938664, 14);
    expect(five.nodes[3]).toBeCloseTo(0.538469310105683, 14);
    expect(five.weights[4]).toBeCloseTo(0.236926885056189, 14);
    expect(five.weights[3]).toBeCloseTo(0.478628670499366, 14);
    expect(five.weights[2]).toBeCloseTo(0.568888888888889, 14);
  });

  it('integrates x^k exactly for k <= 2n - 1 (defining property of Gauss quadrature)', () => {
    for (const n of [1, 4, 9, 16, 40]) {
      const { nodes, weights } = gaussLegendreRule(n);
      for (let k = 0; k <= 2 * n - 1; k += 1) {
        let sum = 0;
        for (let i = 0; i < n; i++) sum += weights[i] * nodes[i] ** k;
        const exact = k % 2 === 1 ? 0 : 2 / (k + 1);
        expect(Math.abs(sum - exact), `n=${n} k=${k}`).toBeLessThan(1e-14);
      }
    }
  });

  it('throws RangeError for orders outside [1, 64]', () => {
    expect(() => gaussLegendreRule(0)).toThrow(RangeError);
    expect(() => gaussLegendreRule(2.5)).toThrow(RangeError);
  });
});

describe('createCompositeGaussLegendre', () => {
  const integrator = createCompositeGaussLegendre({ maxPanelWidth: 0.25, panelTolerance: 1e-15, singularityDistance: 0.5, minOrder: 2, maxOrder: 16 });

  it('picks 9 points on a full 0.25 panel and 2 on a tiny one ((r/2d)^(2n) <= tolerance, Trefethen 2008)', () => {
    expect(integrator.orderForHalfWidth(0.125)).toBe(9);
    expect(integrator.orderForHalfWidth(1e-4)).toBe(2);
  });

  it('integrates exp and 1/(1+x^2) to 1e-15 (exact: e - 1, atan)', () => {
    expect(Math.abs(integrator.integrate(Math.exp, 0, 1) - (Math.E - 1))).toBeLessThan(2e-15);
    // 1/(1+x^2) has poles at +-i: distance 1 from the real axis, inside the plan's assumption (0.5).
    expect(Math.abs(integrator.integrate((x) => 1 / (1 + x * x), 0, 3) - Math.atan(3))).toBeLessThan(2e-15);
  });

  it('accumulates between sorted points, in place, as well as separate integrals do', () => {
    const points = Float64Array.from({ length: 500 }, (_, i) => (3 * (i + 1)) / 500);
    const out = Float64Array.from(points);
    integrator.cumulative(Math.cos, 0, out, out);
    points.forEach((x, i) => expect(Math.abs(out[i] - Math.sin(x))).toBeLessThan(1e-15));
    expect(() => integrator.integrate(Math.cos, 1, 0)).toThrow(RangeError);
  });
});

describe('adaptiveGaussKronrod', () => {
  it('uses a Kronrod extension that is exact for polynomials of degree 22 and contains the 7-point Gauss rule (Kronrod 1965)', () => {
    for (let k = 0; k <= 22; k++) {
      const result = adaptiveGaussKronrod((x) => x ** k, -1, 1, { maxIntervals: 1 });
      expect(Math.abs(result.value - (k % 2 === 1 ? 0 : 2 / (k + 1))), `k=${k}`).toBeLessThan(1e-15);
    }
  });

  it('converges on an endpoint singularity: int_0^1 sqrt(x) dx = 2/3 and int_0^1 ln(x) dx = -1', () => {
    const root = adaptiveGaussKronrod(Math.sqrt, 0, 1, { relativeTolerance: 1e-13 });
    expect(root.converged).toBe(true);
    expect(Math.abs(root.value - 2 / 3)).toBeLessThan(1e-13);
    const log = adaptiveGaussKronrod(Math.log, 0, 1, { relativeTolerance: 1e-12 });
    expect(Math.abs(log.value + 1)).toBeLessThan(1e-11);
  });

  it('negates for reversed limits and reports non-convergence when capped', () => {
    expect(adaptiveGaussKronrod(Math.exp, 1, 0).value).toBeCloseTo(1 - Math.E, 14);
    expect(adaptiveGaussKronrod((x) => Math.sin(1 / x), 1e-3, 1, { maxIntervals: 3 }).converged).toBe(false);
  });
});
