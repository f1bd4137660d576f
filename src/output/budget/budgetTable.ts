import { roundToDecimalPlace } from '../summaries/roundToDecimalPlace.js';

/** One systematic's row of a budget table (every array has one entry per parameter, in `parameters` order). */
export interface BudgetTableRow {
  /** The systematic's name (configuration `name`, or `<name>.<column>`). */
  name: string;
  /** Kish effective count of the weights of stat + all but this one, and of stat + this one (draws). */
  effectiveCountWithout: number;
  effectiveCountAlone: number;
  /** Both effective counts reach the table's threshold. */
  reliable: boolean;
  /** Mean without it minus mean with all (unit of the parameter), and its Monte Carlo error. */
  shift: number[];
  shiftMcError: number[];
  /** sqrt(sd_all^2 - sd_without^2), signed, and its Monte Carlo error. */
  contribution: number[];
  contributionMcError: number[];
  /** sqrt(sd_stat+k^2 - sd_stat^2), signed, and its Monte Carlo error. */
  aloneContribution: number[];
  aloneContributionMcError: number[];
  /** The same shift and contribution from the Gaussian linear response (null where it failed). */
  linearShift: Array<number | null>;
  linearContribution: Array<number | null>;
  /** From a full fit of stat + all but this one (`--full`), or null. */
  fullShift: number[] | null;
  fullContribution: number[] | null;
}

/** A systematic budget ready to be written (Markdown, LaTeX, JSON, figure). */
export interface BudgetTable {
  /** Run title and model label. */
  title: string;
  model: string;
  /** How the numbers were obtained, one or two sentences (stated in every output). */
  method: string;
  /** Parameter names (configuration names), in column order. */
  parameters: string[];
  /** Draws of the stat + all posterior used. */
  drawCount: number;
  /** Threshold on the Kish effective count below which a reweighted variant is flagged (draws). */
  minEffectiveCount: number;
  /** Mean and standard deviation of each parameter with every systematic. */
  allMean: number[];
  allSd: number[];
  /** Standard deviation with the statistical errors only (reweighted), its effective count and flag. */
  statisticalSd: number[];
  statisticalEffectiveCount: number;
  statisticalReliable: boolean;
  /** sqrt(sd_all^2 - sd_stat^2), signed. */
  totalSystematic: number[];
  rows: BudgetTableRow[];
}

/** Digits kept below the leading digit of a parameter's posterior sd when its budget numbers are printed. */
const DIGITS_BELOW_SD = 2;

/**
 * The decimal place at which the budget numbers of one parameter are
 * printed: two digits below the leading digit of its posterior standard
 * deviation, so a contribution of 1% of the error still shows.
 * Cost O(1).
 * @param sd the parameter's posterior standard deviation (> 0; otherwise -3).
 * @example budgetPlace(0.17) // -3
 */
export function budgetPlace(sd: number): number {
  return sd > 0 && Number.isFinite(sd) ? Math.floor(Math.log10(sd)) - DIGITS_BELOW_SD : -3;
}

/**
 * The place of a number printed with its Monte Carlo error: the parameter's
 * place, or finer when the error needs it (one significant digit of the error).
 * @example placeWithError(-3, 0.0004) // -4
 */
export function placeWithError(place: number, error: number): number {
  return error > 0 && Number.isFinite(error) ? Math.min(place, Math.floor(Math.log10(error))) : place;
}

/**
 * One budget number as text at a parameter's place, with an explicit sign
 * when `signed` (shifts); `n/a` for null.
 * @example formatBudgetNumber(0.01234, -3, true) // '+0.012'
 */
export function formatBudgetNumber(value: number | null, place: number, signed = false): string {
  if (value === null || !Number.isFinite(value)) return 'n/a';
  const text = roundToDecimalPlace(value, place);
  return signed && !text.startsWith('-') && Number(text) !== 0 ? `+${text}` : text;
}
