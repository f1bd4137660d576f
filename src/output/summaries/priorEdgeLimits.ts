import type { HardBounds } from '../../math/index.js';
import { weightedQuantiles } from '../../math/index.js';
import { runWarning, type RunWarning } from './runWarning.js';
import type { ParameterSummary } from './runSummary.js';

/**
 * A marginal "touches" a hard prior edge when the edge lies within this
 * fraction of its 95.45% interval's width from the interval's end or from the
 * best fit. Our choice, from the quantiles of simple shapes: a posterior whose
 * density does not fall towards the edge ends its interval close to it (flat:
 * 2.4% of the width; half-normal from the edge: 1.3%; exponential: 0.6%), one
 * whose density falls linearly to zero at the edge does not (15%), and a
 * Gaussian is flagged only when its interval ends within 0.12 sd of the edge.
 */
export const PRIOR_EDGE_TOUCH_FRACTION = 0.03;
/** Mass of the one-sided limit quoted for a marginal cut by its prior (95%, common practice for upper limits). */
export const ONE_SIDED_LIMIT_MASS = 0.95;

/** What detectPriorEdges needs about one parameter. */
export interface PriorEdgeInput {
  summary: ParameterSummary;
  /** The hard prior edges (absent side: none). */
  bounds: HardBounds;
  /** Best-fit value, or undefined when unknown. */
  bestFit: number | undefined;
  /** The kept draws of the parameter and their weights (null: equal weights). */
  draws: Float64Array;
  weights: Float64Array | null;
}

/**
 * Flags a marginal whose 95.45% interval or best fit touches a hard prior
 * edge, and sets its one-sided limit (the 95% quantile for a lower edge, the
 * 5% quantile for an upper edge) so that tables quote the limit instead of
 * mean ± sd. When both edges are touched the posterior follows the prior:
 * no limit is set, the warning says the data do not constrain it.
 * Cost: one sort of the draws when an edge is touched.
 * @param input the parameter's summary (changed in place), bounds, best fit and draws.
 * @returns the warning, or null when no edge is touched.
 * @throws CandelaError from the quantile on non-finite draws.
 * @example detectPriorEdges({ summary, bounds: { lower: 0 }, bestFit: 0.0004, draws, weights: null })?.code // 'prior_edge'
 */
export function detectPriorEdges(input: PriorEdgeInput): RunWarning | null {
  const { summary, bounds, bestFit } = input;
  const [low, high] = summary.stats.ci95;
  const reach = PRIOR_EDGE_TOUCH_FRACTION * Math.max(high - low, Number.MIN_VALUE);
  const near = (edge: number | undefined, end: number): boolean => edge !== undefined && Number.isFinite(edge)
    && (Math.abs(end - edge) <= reach || (bestFit !== undefined && Math.abs(bestFit - edge) <= reach));
  const lowerTouched = near(bounds.lower, low);
  const upperTouched = near(bounds.upper, high);
  if (!lowerTouched && !upperTouched) return null;
  const name = summary.name;
  const numbers: Record<string, number> = {
    ci95_low: low, ci95_high: high,
    ...(bounds.lower !== undefined ? { prior_lower: bounds.lower } : {}),
    ...(bounds.upper !== undefined ? { prior_upper: bounds.upper } : {}),
    ...(bestFit !== undefined ? { best_fit: bestFit } : {}),
  };
  if (lowerTouched && upperTouched) {
    return runWarning('prior_dominated', name, `${name}: the 95.45% interval [${fmt(low)}, ${fmt(high)}] spans the prior [${fmt(bounds.lower!)}, ${fmt(bounds.upper!)}] edge to edge: the data do not constrain it and its numbers restate the prior`, numbers);
  }
  const side = lowerTouched ? 'upper' : 'lower';
  const edge = lowerTouched ? bounds.lower! : bounds.upper!;
  const [value] = weightedQuantiles(input.draws, [lowerTouched ? ONE_SIDED_LIMIT_MASS : 1 - ONE_SIDED_LIMIT_MASS], input.weights ?? undefined);
  summary.oneSidedLimit = { side, value, mass: ONE_SIDED_LIMIT_MASS };
  const what = bestFit !== undefined && Math.abs(bestFit - edge) <= reach ? `its best fit ${fmt(bestFit)}` : `its 95.45% interval [${fmt(low)}, ${fmt(high)}]`;
  return runWarning('prior_edge', name,
    `${name}: ${what} touches the ${lowerTouched ? 'lower' : 'upper'} prior edge ${fmt(edge)}; quoted as a one-sided 95% ${side} limit, ${name} ${side === 'upper' ? '<' : '>'} ${fmt(value)}, not as mean ± sd`,
    { ...numbers, edge, limit: value, limit_mass: ONE_SIDED_LIMIT_MASS });
}

function fmt(value: number): string {
  return Number(value.toPrecision(4)).toString();
}
