/**
 * Downhill simplex minimization (Nelder & Mead 1965, "A simplex method for
 * function minimization", Computer Journal 7, 308), in the precise form of
 * Lagarias, Reeds, Wright & Wright (1998, SIAM J. Optim. 9, 112, section 2:
 * reflection, expansion, outside and inside contraction, shrink) with the
 * dimension-adaptive coefficients of Gao & Han (2012, Comput. Optim. Appl.
 * 51, 259): reflection 1, expansion 1 + 2/n, contraction 3/4 - 1/(2n),
 * shrink 1 - 1/n (for n = 1 the classic 1, 2, 1/2, 1/2).
 *
 * Written as a generator that asks for batches of points, so a caller can
 * evaluate several searches' points together (in parallel threads); the
 * synchronous {@link minimizeNelderMead} drives it with a plain function.
 */

/** Default budget of objective evaluations per dimension (common practice). */
export const NELDER_MEAD_EVALUATIONS_PER_DIMENSION = 500;
/** Default convergence: spread of the simplex values (best to worst), in objective units. */
export const NELDER_MEAD_VALUE_TOLERANCE = 1e-8;
/** Default convergence: largest vertex distance from the best vertex, per coordinate, relative to its initial step. */
export const NELDER_MEAD_POSITION_TOLERANCE = 1e-6;

/** Options of a Nelder-Mead search. */
export interface NelderMeadOptions {
  /** Initial simplex edge along each coordinate (the start plus one step per axis), in the coordinate's units, > 0. */
  initialSteps: ArrayLike<number>;
  /** Evaluation budget (default 500 x dimension). */
  maxEvaluations?: number;
  /** Stop when best-to-worst value spread is at most this (default 1e-8) ... */
  valueTolerance?: number;
  /** ... and every vertex is within this many initial steps of the best (default 1e-6). */
  positionTolerance?: number;
}

/** Outcome of a Nelder-Mead search. */
export interface NelderMeadResult {
  /** Best point found. */
  point: Float64Array;
  /** Objective at `point` (+Infinity if no finite value was ever seen). */
  value: number;
  /** Final simplex, (n + 1) x n row major, best vertex first. */
  simplex: Float64Array;
  /** Objective at the final vertices, ascending. */
  values: Float64Array;
  evaluations: number;
  iterations: number;
  /** True when both tolerances were met before the budget ran out. */
  converged: boolean;
}

/**
 * The search as a generator: each `yield` hands out k points (k x n, row
 * major) and expects their k objective values back through `next(values)`;
 * NaN values count as +Infinity. The return value is the result.
 * Cost: n + 1 evaluations to start, then 1 or 2 per iteration (n + 2 on a
 * shrink). Throws RangeError for a start or steps of the wrong length or a
 * step that is not a positive finite number.
 * @example
 * const search = nelderMeadSearch(Float64Array.of(0), { initialSteps: [1] });
 * let request = search.next();
 * while (!request.done) request = search.next(request.value.map((x) => (x - 3) ** 2));
 * request.value.point // ~ [3]
 */
export function* nelderMeadSearch(start: ArrayLike<number>, options: NelderMeadOptions): Generator<Float64Array, NelderMeadResult, Float64Array> {
  const n = start.length;
  const steps = options.initialSteps;
  if (n < 1 || steps.length !== n) throw new RangeError(`nelderMeadSearch: start has ${n} coordinates and initialSteps ${steps.length}`);
  for (let i = 0; i < n; i++) if (!(steps[i] > 0 && steps[i] < Infinity)) throw new RangeError(`nelderMeadSearch: initial step ${i} is ${steps[i]}`);
  const maxEvaluations = options.maxEvaluations ?? NELDER_MEAD_EVALUATIONS_PER_DIMENSION * n;
  const valueTolerance = options.valueTolerance ?? NELDER_MEAD_VALUE_TOLERANCE;
  const positionTolerance = options.positionTolerance ?? NELDER_MEAD_POSITION_TOLERANCE;
  const reflection = 1;
  const expansion = n > 1 ? 1 + 2 / n : 2;
  const contraction = n > 1 ? 0.75 - 1 / (2 * n) : 0.5;
  const shrink = n > 1 ? 1 - 1 / n : 0.5;

  const simplex = new Float64Array((n + 1) * n);
  const values = new Float64Array(n + 1);
  for (let v = 0; v <= n; v++) {
    for (let i = 0; i < n; i++) simplex[v * n + i] = start[i] + (v === i + 1 ? steps[i] : 0);
  }
  const clean = (value: number): number => (value === value ? value : Infinity);
  values.set((yield simplex.slice()).map(clean));
  let evaluations = n + 1;
  let iterations = 0;
  const order = Array.from({ length: n + 1 }, (_, v) => v);
  const centroid = new Float64Array(n);
  const trial = (from: Float64Array, coefficient: number, worst: number): Float64Array => {
    const point = new Float64Array(n);
    for (let i = 0; i < n; i++) point[i] = from[i] + coefficient * (from[i] - simplex[worst * n + i]);
    return point;
  };
  const evaluate = function* (point: Float64Array): Generator<Float64Array, number, Float64Array> {
    evaluations += 1;
    return clean((yield point)[0]);
  };
  const replace = (vertex: number, point: Float64Array, value: number): void => {
    simplex.set(point, vertex * n);
    values[vertex] = value;
  };
  let converged = false;
  for (;;) {
    order.sort((a, b) => values[a] - values[b] || a - b);
    const best = order[0];
    const worst = order[n];
    let spread = 0;
    for (let v = 1; v <= n; v++) {
      for (let i = 0; i < n; i++) spread = Math.max(spread, Math.abs(simplex[order[v] * n + i] - simplex[best * n + i]) / steps[i]);
    }
    if (values[worst] - values[best] <= valueTolerance && spread <= positionTolerance) {
      converged = true;
      break;
    }
    if (evaluations >= maxEvaluations) break;
    iterations += 1;
    centroid.fill(0);
    for (let v = 0; v < n; v++) for (let i = 0; i < n; i++) centroid[i] += simplex[order[v] * n + i] / n;
    const reflected = trial(centroid, reflection, worst);
    const reflectedValue = yield* evaluate(reflected);
    if (reflectedValue < values[best]) {
      const expanded = trial(centroid, reflection * expansion, worst);
      const expandedValue = yield* evaluate(expanded);
      if (expandedValue < reflectedValue) replace(worst, expanded, expandedValue);
      else replace(worst, reflected, reflectedValue);
      continue;
    }
    if (reflectedValue < values[order[n - 1]]) {
      replace(worst, reflected, reflectedValue);
      continue;
    }
    const outside = reflectedValue < values[worst];
    const contracted = trial(centroid, outside ? reflection * contraction : -contraction, worst);
    const contractedValue = yield* evaluate(contracted);
    if (outside ? contractedValue <= reflectedValue : contractedValue < values[worst]) {
      replace(worst, contracted, contractedValue);
      continue;
    }
    const shrunk = new Float64Array(n * n);
    for (let v = 1; v <= n; v++) {
      for (let i = 0; i < n; i++) {
        const x0 = simplex[best * n + i];
        shrunk[(v - 1) * n + i] = x0 + shrink * (simplex[order[v] * n + i] - x0);
      }
    }
    const shrunkValues = yield shrunk;
    evaluations += n;
    for (let v = 1; v <= n; v++) replace(order[v], shrunk.subarray((v - 1) * n, v * n), clean(shrunkValues[v - 1]));
  }
  const sortedSimplex = new Float64Array((n + 1) * n);
  const sortedValues = new Float64Array(n + 1);
  order.forEach((vertex, rank) => {
    sortedSimplex.set(simplex.subarray(vertex * n, (vertex + 1) * n), rank * n);
    sortedValues[rank] = values[vertex];
  });
  return { point: sortedSimplex.slice(0, n), value: sortedValues[0], simplex: sortedSimplex, values: sortedValues, evaluations, iterations, converged };
}

/**
 * Minimizes `objective` from `start` with {@link nelderMeadSearch}.
 * Cost: see there; one objective call per evaluation. Throws what the
 * objective throws, and RangeError for bad steps.
 * @example
 * minimizeNelderMead((x) => (x[0] - 1) ** 2 + 100 * (x[1] - x[0] ** 2) ** 2, [-1.2, 1], { initialSteps: [0.1, 0.1] }).point // ~ [1, 1]
 */
export function minimizeNelderMead(objective: (point: Float64Array) => number, start: ArrayLike<number>, options: NelderMeadOptions): NelderMeadResult {
  const n = start.length;
  const search = nelderMeadSearch(start, options);
  let request = search.next();
  while (!request.done) {
    const points = request.value;
    const values = new Float64Array(points.length / n);
    for (let k = 0; k < values.length; k++) values[k] = objective(points.subarray(k * n, (k + 1) * n));
    request = search.next(values);
  }
  return request.value;
}
