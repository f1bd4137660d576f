/**
 * Gauss-Legendre quadrature rules on [-1, 1]: the n nodes are the roots of the
 * Legendre polynomial P_n, found by Newton's method from the asymptotic guess
 * x_i ~ cos(pi (i - 1/4) / (n + 1/2)), and the weights are
 * w_i = 2 / ((1 - x_i^2) P_n'(x_i)^2) (Abramowitz & Stegun 1964, eq. 25.4.29;
 * Davis & Rabinowitz 1984, "Methods of Numerical Integration").
 * An n-point rule integrates polynomials of degree 2n - 1 exactly.
 */

/** Nodes and weights of one rule on [-1, 1], nodes in increasing order. */
export interface QuadratureRule {
  readonly nodes: Float64Array;
  readonly weights: Float64Array;
}

/** Largest order served (more points than any use in candela needs). */
export const GAUSS_LEGENDRE_MAX_ORDER = 64;

/** Newton stops when the node moves less than this (a few ulps of 1). */
const NEWTON_STEP_TOLERANCE = 1e-15;
/** Newton converges in 3-5 steps from the asymptotic guess; this is a safety cap. */
const NEWTON_MAX_STEPS = 100;

const cache: (QuadratureRule | undefined)[] = [];

/**
 * The n-point Gauss-Legendre rule on [-1, 1], computed once and cached.
 * Cost: O(n^2) on the first call for each n, O(1) afterwards.
 * @param order number of points n, an integer in [1, 64].
 * @throws RangeError when the order is not an integer in [1, 64].
 * @example gaussLegendreRule(2).nodes // => [-0.5773502691896258, 0.5773502691896258] (= -+1/sqrt(3)), weights [1, 1]
 */
export function gaussLegendreRule(order: number): QuadratureRule {
  if (!Number.isInteger(order) || order < 1 || order > GAUSS_LEGENDRE_MAX_ORDER) {
    throw new RangeError(`Gauss-Legendre order must be an integer in [1, ${GAUSS_LEGENDRE_MAX_ORDER}], got ${order}`);
  }
  const cached = cache[order];
  if (cached) return cached;
  const nodes = new Float64Array(order);
  const weights = new Float64Array(order);
  const half = Math.floor((order + 1) / 2);
  for (let i = 0; i < half; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (order + 0.5));
    let derivative = 0;
    for (let step = 0; step < NEWTON_MAX_STEPS; step++) {
      const [value, slope] = legendreWithDerivative(order, x);
      derivative = slope;
      const dx = value / slope;
      x -= dx;
      if (Math.abs(dx) < NEWTON_STEP_TOLERANCE) {
        derivative = legendreWithDerivative(order, x)[1];
        break;
      }
    }
    const weight = 2 / ((1 - x * x) * derivative * derivative);
    // Roots come out in decreasing order; store symmetric pairs ascending.
    nodes[i] = -x;
    nodes[order - 1 - i] = x;
    weights[i] = weight;
    weights[order - 1 - i] = weight;
  }
  if (order % 2 === 1) nodes[(order - 1) / 2] = 0;
  const rule = { nodes, weights };
  cache[order] = rule;
  return rule;
}

/** P_n(x) and P_n'(x) by the three-term recurrence (Bonnet). */
function legendreWithDerivative(order: number, x: number): [number, number] {
  let previous = 1;
  let current = x;
  for (let k = 2; k <= order; k++) {
    const next = ((2 * k - 1) * x * current - (k - 1) * previous) / k;
    previous = current;
    current = next;
  }
  if (order === 1) return [x, 1];
  const slope = (order * (x * current - previous)) / (x * x - 1);
  return [current, slope];
}
