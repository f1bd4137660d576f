import { CandelaError } from '../../errors.js';
import { gaussianLinearResponse, type LinearResponse } from './gaussianLinearResponse.js';
import { importanceWeights } from './importanceWeights.js';
import { quadratureDifference } from './quadratureDifference.js';
import { reweightedShift } from './reweightedShift.js';
import { contributionError, varianceDifferenceError } from './varianceDifferenceError.js';

/** The log likelihoods of one systematic's two variants at every draw. */
export interface SystematicVariantLikelihoods {
  /** Name of the systematic (as the configuration names it). */
  name: string;
  /** ln L with every systematic but this one, per draw (nats). */
  withoutLogLikelihood: ArrayLike<number>;
  /** ln L with the statistical errors and this systematic only, per draw (nats). */
  aloneLogLikelihood: ArrayLike<number>;
}

/** Everything {@link systematicBudget} needs: one set of draws and log likelihoods of the variants. */
export interface SystematicBudgetInput {
  /** Draws of the posterior with every systematic, n x p row major. */
  draws: Float64Array;
  /** The p parameter names, in column order. */
  parameterNames: readonly string[];
  /** ln L with every systematic at each draw (the likelihood the draws were sampled with), nats. */
  allLogLikelihood: ArrayLike<number>;
  /** ln L with the statistical errors only at each draw, nats. */
  statisticalLogLikelihood: ArrayLike<number>;
  /** One entry per systematic. */
  systematics: readonly SystematicVariantLikelihoods[];
  /** Below this Kish effective count of its weights a reweighted variant is flagged unreliable (draws). */
  minEffectiveCount: number;
}

/** One parameter's numbers of one variant: reweighted, and the Gaussian linear-response prediction. */
export interface VariantParameterEstimate {
  /** Mean under the variant minus the mean of the draws (unit of the parameter). */
  shift: number;
  /** Monte Carlo error of `shift` for independent draws. */
  shiftMcError: number;
  /** Standard deviation under the variant (reweighted). */
  sd: number;
  /** The same shift and deviation from the Gaussian linear response (null when it failed). */
  linearShift: number | null;
  linearSd: number | null;
}

/** One reweighted variant (a set of covariance ingredients) of the budget. */
export interface BudgetVariant {
  /** Kish effective count of the importance weights (draws). */
  effectiveCount: number;
  /** effectiveCount >= minEffectiveCount. */
  reliable: boolean;
  /** Why the linear response failed, or null. */
  linearFailure: string | null;
  /** One estimate per parameter, in column order. */
  parameters: VariantParameterEstimate[];
}

/** One contribution in quadrature: reweighted with its Monte Carlo error, and by the linear response (null when it failed). */
export interface ContributionEstimate {
  reweighted: number;
  /** Delta-method error of the reweighted value (varianceDifferenceError, contributionError). */
  mcError: number;
  linear: number | null;
}

/** One systematic's line of the budget. */
export interface SystematicBudgetEntry {
  name: string;
  /** Stat + all but this one. */
  without: BudgetVariant;
  /** Stat + this one only. */
  alone: BudgetVariant;
  /** Per parameter: sqrt(sd_all^2 - sd_without^2) (signed), reweighted and linear (null when it failed). */
  contribution: ContributionEstimate[];
  /** Per parameter: sqrt(sd_stat+k^2 - sd_stat^2) (signed), reweighted and linear. */
  aloneContribution: ContributionEstimate[];
}

/** The whole budget: the all-systematics posterior, the statistical-only variant and one entry per systematic. */
export interface SystematicBudget {
  drawCount: number;
  parameterNames: string[];
  /** Mean and standard deviation of each parameter over the draws (stat + all). */
  allMean: number[];
  allSd: number[];
  /** Stat only, reweighted. */
  statistical: BudgetVariant;
  /** Per parameter: sqrt(sd_all^2 - sd_stat^2) (signed), reweighted and linear. */
  totalSystematic: ContributionEstimate[];
  systematics: SystematicBudgetEntry[];
}

/**
 * A systematic-error budget from one set of posterior draws (sampled with
 * the statistical errors and every systematic), by importance reweighting
 * (Owen 2013, section 9.2) with a Gaussian linear-response cross-check
 * (see gaussianLinearResponse). For each systematic k the draws are
 * reweighted by L_without_k / L_all (the shift of each mean when k is
 * removed, and its error contribution sqrt(sd_all^2 - sd_without_k^2)) and
 * by L_stat+k / L_all (its contribution alone, sqrt(sd_stat+k^2 -
 * sd_stat^2), against the stat-only reweighting L_stat / L_all). Priors
 * are the same in every variant, so the likelihood ratio is the posterior
 * ratio. A variant whose weights are worth fewer than minEffectiveCount
 * draws is flagged: its numbers are then only as good as the linear
 * response, and a full fit of the variant is the remedy.
 *
 * Cost: O(variants x (n p + n m^2)) with m = (p + 1)(p + 2) / 2.
 * @param input draws, names, log likelihoods (nats) and the reliability threshold.
 * @returns the budget.
 * @throws CandelaError `budget.bad_input` when an array length disagrees with the draws;
 *   the errors of importanceWeights (NaN log likelihoods, a variant that excludes every draw).
 * @example systematicBudget({ draws, parameterNames: ['w0'], allLogLikelihood, statisticalLogLikelihood, systematics: [...], minEffectiveCount: 200 }).systematics[0].contribution[0].reweighted
 */
export function systematicBudget(input: SystematicBudgetInput): SystematicBudget {
  const p = input.parameterNames.length;
  const n = input.allLogLikelihood.length;
  checkLength(input.draws.length, n * p, 'draws', `${n} draws x ${p} parameters`);
  checkLength(input.statisticalLogLikelihood.length, n, 'statistical log likelihood', `${n} draws`);
  for (const entry of input.systematics) {
    checkLength(entry.withoutLogLikelihood.length, n, `${entry.name} (without)`, `${n} draws`);
    checkLength(entry.aloneLogLikelihood.length, n, `${entry.name} (alone)`, `${n} draws`);
  }
  const columns = Array.from({ length: p }, (_, j) => Float64Array.from({ length: n }, (_, i) => input.draws[i * p + j]));
  const weightsOf = new Map<BudgetVariant, Float64Array>();
  const uniform = new Float64Array(n).fill(1 / n);
  const variant = (logLikelihood: ArrayLike<number>): BudgetVariant => {
    const logRatio = Float64Array.from({ length: n }, (_, i) => logLikelihood[i] - input.allLogLikelihood[i]);
    const { weights, effectiveCount } = importanceWeights(logRatio);
    const linear: LinearResponse = gaussianLinearResponse(input.draws, p, logRatio);
    const parameters = columns.map((values, j): VariantParameterEstimate => {
      const shift = reweightedShift(values, weights, input.parameterNames[j]);
      return {
        shift: shift.shift, shiftMcError: shift.shiftMcError, sd: shift.sd,
        linearShift: linear.ok ? linear.shift[j] : null, linearSd: linear.ok ? linear.sd[j] : null,
      };
    });
    const result = { effectiveCount, reliable: effectiveCount >= input.minEffectiveCount, linearFailure: linear.ok ? null : linear.reason, parameters };
    weightsOf.set(result, weights);
    return result;
  };
  const allMean: number[] = [];
  const allSd: number[] = [];
  for (const values of columns) {
    const base = reweightedShift(values, new Float64Array(n).fill(1 / n));
    allMean.push(base.baseMean);
    allSd.push(base.baseSd);
  }
  const statistical = variant(input.statisticalLogLikelihood);
  type Side = { sd: (j: number) => [number, number | null]; weights: Float64Array };
  const contributions = (larger: Side, smaller: Side): ContributionEstimate[] =>
    allSd.map((_, j) => {
      const [a, aLinear] = larger.sd(j);
      const [b, bLinear] = smaller.sd(j);
      const reweighted = quadratureDifference(a, b);
      const mcError = contributionError(reweighted, varianceDifferenceError(columns[j], larger.weights, smaller.weights));
      return { reweighted, mcError, linear: aLinear === null || bLinear === null ? null : quadratureDifference(aLinear, bLinear) };
    });
  const sdOf = (v: BudgetVariant): Side => ({ sd: (j) => [v.parameters[j].sd, v.parameters[j].linearSd], weights: weightsOf.get(v)! });
  const allOf: Side = { sd: (j) => [allSd[j], allSd[j]], weights: uniform };
  const systematics = input.systematics.map((entry): SystematicBudgetEntry => {
    const without = variant(entry.withoutLogLikelihood);
    const alone = variant(entry.aloneLogLikelihood);
    return { name: entry.name, without, alone, contribution: contributions(allOf, sdOf(without)), aloneContribution: contributions(sdOf(alone), sdOf(statistical)) };
  });
  return {
    drawCount: n, parameterNames: [...input.parameterNames], allMean, allSd, statistical,
    totalSystematic: contributions(allOf, sdOf(statistical)), systematics,
  };
}

function checkLength(found: number, expected: number, what: string, words: string): void {
  if (found !== expected) {
    throw new CandelaError({ code: 'budget.bad_input', path: what, message: `${what} has ${found} values, expected ${expected} (${words})`, expected: String(expected), found: String(found) });
  }
}
