/**
 * Polynomial interpolation at Chebyshev points of the second kind in the
 * barycentric form (Berrut & Trefethen 2004, "Barycentric Lagrange
 * Interpolation", SIAM Review 46, 501, eq. 4.2 with the weights of eq. 5.4):
 *
 *   p(x) = sum_j [w_j / (x - x_j)] f_j / sum_j [w_j / (x - x_j)],
 *   x_j = cos(j pi / n) mapped to [lower, upper], w_j = (-1)^j (halved at j = 0, n).
 *
 * Because p depends linearly on the node values f_j, the weights for a fixed
 * x are computed once ({@link barycentricRow}) and p(x) is a dot product.
 */

/**
 * The `count` Chebyshev points of the second kind on [lower, upper], ascending,
 * with their barycentric weights (the endpoints are nodes).
 * Cost: O(count). Requires count >= 2 and lower < upper.
 * @param count number of nodes K
 * @param lower interval start (units of the interpolation variable)
 * @param upper interval end
 * @example chebyshevNodes(3, 0, 2).nodes // [0, 1, 2]
 */
export function chebyshevNodes(count: number, lower: number, upper: number): { nodes: Float64Array; weights: Float64Array } {
  const degree = count - 1;
  const nodes = new Float64Array(count);
  const weights = new Float64Array(count);
  const middle = 0.5 * (lower + upper);
  const halfWidth = 0.5 * (upper - lower);
  for (let k = 0; k < count; k++) {
    const j = degree - k; // ascending order: x_j = cos(j pi / n) runs from +1 down to -1
    nodes[k] = middle + halfWidth * Math.cos((j * Math.PI) / degree);
    weights[k] = (j % 2 === 0 ? 1 : -1) * (j === 0 || j === degree ? 0.5 : 1);
  }
  nodes[0] = lower;
  nodes[degree] = upper;
  return { nodes, weights };
}

/**
 * Writes the row of interpolation coefficients at x, so that
 * p(x) = sum_k out[k] f_k. At a node the row is the unit vector.
 * Cost: O(K).
 * @param x evaluation point, inside [nodes[0], nodes[K-1]] for accuracy
 * @param nodes ascending nodes from {@link chebyshevNodes}
 * @param weights their barycentric weights
 * @param out length-K row to fill
 * @example // nodes 0, 1, 2 (K = 3): at x = 0.5 the quadratic through them has weights 3/8, 3/4, -1/8
 * barycentricRow(0.5, chebyshevNodes(3, 0, 2).nodes, chebyshevNodes(3, 0, 2).weights, new Float64Array(3)); // [0.375, 0.75, -0.125]
 */
export function barycentricRow(x: number, nodes: Float64Array, weights: Float64Array, out: Float64Array): void {
  const count = nodes.length;
  let total = 0;
  for (let k = 0; k < count; k++) {
    const difference = x - nodes[k];
    if (difference === 0) {
      out.fill(0);
      out[k] = 1;
      return;
    }
    out[k] = weights[k] / difference;
    total += out[k];
  }
  for (let k = 0; k < count; k++) out[k] /= total;
}

/**
 * Largest magnitude of the two highest Chebyshev coefficients a_n and a_{n-1}
 * of the interpolant through node values f (ascending nodes from
 * {@link chebyshevNodes}): with x_j = cos(j pi/n),
 * a_k = (2/n) sum''_j f_j cos(j k pi / n), and a_n halved again
 * (Trefethen, Approximation Theory and Approximation Practice, 2013, ch. 3).
 * For a function analytic near the interval the coefficients decay
 * geometrically, so this is the usual estimate of the interpolation error.
 * Cost: O(K).
 * @param values node values f_k in ascending node order (any units; result in the same units)
 * @example chebyshevTailSize(Float64Array.of(1, 0, 1)) // 0.5: x^2 at x = -1, 0, 1 is (T_0 + T_2)/2, so a_2 = 1/2 and a_1 = 0
 */
export function chebyshevTailSize(values: Float64Array): number {
  const count = values.length;
  const degree = count - 1;
  let last = 0;
  let previous = 0;
  for (let k = 0; k < count; k++) {
    const j = degree - k;
    const edge = j === 0 || j === degree ? 0.5 : 1;
    const sign = j % 2 === 0 ? 1 : -1;
    last += edge * sign * values[k];
    previous += edge * sign * Math.cos((j * Math.PI) / degree) * values[k];
  }
  return Math.max(Math.abs(last / degree), Math.abs((2 * previous) / degree));
}
