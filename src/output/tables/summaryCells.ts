import { formatInterval, formatWithError, formatWithErrors, roundingPlaceFor } from '../summaries/formatWithErrors.js';
import type { NumberStyle } from '../summaries/formatWithErrors.js';
import { roundToDecimalPlace } from '../summaries/roundToDecimalPlace.js';
import type { ParameterSummary } from '../summaries/runSummary.js';

/** Text of a missing number in tables. */
export const MISSING_CELL = '—';
/** Decimals of R-hat in tables (R-hat limits are quoted as 1.01 or 1.001; common practice). */
const R_HAT_DECIMALS = 3;

/** The texts of one summary row (private to the output layer). */
export interface SummaryCells {
  meanSd: string;
  median68: string;
  interval68: string;
  interval95: string;
  hdi68: string;
  map: string;
  rHat: string;
  essBulk: string;
  essTail: string;
  /** The one-sided limit (e.g. '< 0.031 (95% upper limit)') when the posterior is cut by a prior edge, else ''. */
  limit: string;
  /** Power of ten of the last digit used for the median row, intervals and MAP. */
  place: number;
}

/**
 * Formats one parameter's numbers: mean ± sd PDG-rounded on the sd; median
 * with the 68.27% equal-tailed errors PDG-rounded on the smaller one; the
 * 68.27% and 95.45% intervals, the 68.27% HDI and the MAP value at the
 * median's place;
 * R-hat with 3 decimals; ESS as whole numbers. A posterior cut by a prior
 * edge (`oneSidedLimit`) quotes its one-sided limit in the mean and median
 * cells instead of two-sided errors, which such a marginal does not have.
 */
export function summaryCells(parameter: ParameterSummary, style: NumberStyle): SummaryCells {
  const { stats, diagnostics } = parameter;
  const plus = stats.ci68[1] - stats.median;
  const minus = stats.median - stats.ci68[0];
  const place = roundingPlaceFor(stats.median, [plus, minus]);
  const plain = (value: number | undefined, digits: (x: number) => string): string =>
    value !== undefined && Number.isFinite(value) ? digits(value) : MISSING_CELL;
  const limit = limitText(parameter, place, style);
  return {
    meanSd: limit || formatWithError(stats.mean, stats.sd, style),
    median68: limit || formatWithErrors(stats.median, plus, minus, style),
    interval68: formatInterval(stats.ci68[0], stats.ci68[1], place, style),
    interval95: formatInterval(stats.ci95[0], stats.ci95[1], place, style),
    hdi68: formatInterval(stats.hdi68[0], stats.hdi68[1], place, style),
    map: plain(stats.map, (x) => roundToDecimalPlace(x, place)),
    rHat: plain(diagnostics?.rHat, (x) => x.toFixed(R_HAT_DECIMALS)),
    essBulk: plain(diagnostics?.essBulk, (x) => String(Math.round(x))),
    essTail: plain(diagnostics?.essTail, (x) => String(Math.round(x))),
    limit,
    place,
  };
}

/** '< 0.031 (95% upper limit)' or '> -4.2 (95% lower limit)', or '' without a limit. */
function limitText(parameter: ParameterSummary, place: number, style: NumberStyle): string {
  const limit = parameter.oneSidedLimit;
  if (!limit) return '';
  const percent = `${Math.round(limit.mass * 100)}${style === 'latex' ? '\\%' : '%'}`;
  const value = roundToDecimalPlace(limit.value, place);
  const words = `${percent} ${limit.side} limit`;
  const sign = limit.side === 'upper' ? '<' : '>';
  // \mbox is core LaTeX, so the cell needs no package inside math mode.
  return style === 'latex' ? `${sign} ${value}\\ (\\mbox{${words}})` : `${sign} ${value} (${words})`;
}
