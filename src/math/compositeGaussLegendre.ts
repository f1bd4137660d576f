import { gaussLegendreRule } from './gaussLegendreRule.js';
import type { QuadratureRule } from './gaussLegendreRule.js';

/**
 * Composite Gauss-Legendre quadrature with an a-priori panel plan, for
 * integrands that are analytic near the real interval.
 *
 * Error control (Trefethen 2008, "Is Gauss quadrature better than
 * Clenshaw-Curtis?", SIAM Review 50, 67, Theorem 4.5): if f is analytic and
 * bounded by M inside the Bernstein ellipse of parameter rho around a panel,
 * the n-point rule errs by at most (64/15) M rho^(-2n) / (rho^2 - 1). A complex
 * singularity a distance d from a panel of half-width r gives rho ~ 2d/r, so
 * each panel uses the smallest n with (r / 2d)^(2n) <= panelTolerance. Panels
 * are at most maxPanelWidth wide. The plan states d as an assumption about the
 * integrand; the caller chooses it and tests it.
 */
export interface GaussLegendrePlan {
  /** Widest panel, in the units of the integration variable. */
  maxPanelWidth: number;
  /** Target error of one panel relative to its own integral (dimensionless). */
  panelTolerance: number;
  /** Assumed distance from the real axis to the nearest singularity of the integrand, same units as the variable. */
  singularityDistance: number;
  /** Fewest points per panel (>= 1). */
  minOrder: number;
  /** Most points per panel (<= 64); panels never need more when the plan is consistent. */
  maxOrder: number;
}

/** An integrator built from a plan: order thresholds are computed once. */
export interface CompositeGaussLegendre {
  readonly plan: Readonly<GaussLegendrePlan>;
  /** Points the plan uses on a panel of this half-width. */
  orderForHalfWidth(halfWidth: number): number;
  /** Integral of f from lower to upper (lower <= upper). */
  integrate(integrand: (x: number) => number, lower: number, upper: number): number;
  /**
   * out[i] = integral of f from start to sortedPoints[i], for ascending points
   * (>= start), integrating only between neighbours and accumulating with
   * Neumaier's compensated sum. No allocation.
   */
  cumulative(integrand: (x: number) => number, start: number, sortedPoints: ArrayLike<number>, out: Float64Array, count?: number): void;
}

/**
 * Builds a composite Gauss-Legendre integrator for a plan.
 * Cost: one panel of half-width r costs n(r) integrand calls; a cumulative
 * sweep over N points costs O(N + total panels) calls.
 * @param plan panel plan (widths in the integration variable's units).
 * @throws RangeError when the plan is inconsistent (non-positive width, tolerance outside (0, 1), orders outside [1, 64]);
 *   the returned functions throw RangeError for limits that are not finite and ascending.
 * @example createCompositeGaussLegendre({ maxPanelWidth: 0.5, panelTolerance: 1e-15, singularityDistance: 1, minOrder: 2, maxOrder: 16 })
 *   .integrate(Math.exp, 0, 1) // => 1.718281828459045 (e - 1)
 */
export function createCompositeGaussLegendre(plan: GaussLegendrePlan): CompositeGaussLegendre {
  const { maxPanelWidth, panelTolerance, singularityDistance, minOrder, maxOrder } = plan;
  if (!(maxPanelWidth > 0) || !(panelTolerance > 0 && panelTolerance < 1) || !(singularityDistance > 0) ||
      !Number.isInteger(minOrder) || !Number.isInteger(maxOrder) || minOrder < 1 || maxOrder > 64 || minOrder > maxOrder) {
    throw new RangeError(`inconsistent Gauss-Legendre plan ${JSON.stringify(plan)}`);
  }
  // halfWidthLimit[n]: the widest half-panel on which n points meet the tolerance.
  const halfWidthLimit = new Float64Array(maxOrder + 1);
  const rules: QuadratureRule[] = [];
  for (let n = minOrder; n <= maxOrder; n++) {
    halfWidthLimit[n] = 2 * singularityDistance * Math.pow(panelTolerance, 1 / (2 * n));
    rules[n] = gaussLegendreRule(n);
  }

  function orderForHalfWidth(halfWidth: number): number {
    for (let n = minOrder; n < maxOrder; n++) if (halfWidth <= halfWidthLimit[n]) return n;
    return maxOrder;
  }

  function integrateSpan(integrand: (x: number) => number, lower: number, upper: number): number {
    const span = upper - lower;
    if (span === 0) return 0;
    if (!(span > 0) || span === Infinity) throw new RangeError(`integration limits must be finite and ascending, got [${lower}, ${upper}]`);
    const panels = Math.ceil(span / maxPanelWidth);
    const halfWidth = span / (2 * panels);
    const rule = rules[orderForHalfWidth(halfWidth)];
    const { nodes, weights } = rule;
    let total = 0;
    for (let p = 0; p < panels; p++) {
      const center = lower + (2 * p + 1) * halfWidth;
      let panelSum = 0;
      for (let k = 0; k < nodes.length; k++) panelSum += weights[k] * integrand(center + halfWidth * nodes[k]);
      total += panelSum * halfWidth;
    }
    return total;
  }

  function cumulative(integrand: (x: number) => number, start: number, sortedPoints: ArrayLike<number>, out: Float64Array, count = sortedPoints.length): void {
    let sum = 0;
    let compensation = 0;
    let previous = start;
    for (let i = 0; i < count; i++) {
      const point = sortedPoints[i];
      const piece = integrateSpan(integrand, previous, point);
      // Neumaier (1974) compensated accumulation of the running integral.
      const next = sum + piece;
      if (Math.abs(sum) >= Math.abs(piece)) compensation += sum - next + piece;
      else compensation += piece - next + sum;
      sum = next;
      out[i] = sum + compensation;
      previous = point;
    }
  }

  return {
    plan: { ...plan },
    orderForHalfWidth,
    integrate: (integrand, lower, upper) => integrateSpan(integrand, lower, upper),
    cumulative,
  };
}
