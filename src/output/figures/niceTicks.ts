import { CandelaError } from '../../errors.js';

/** Ticks of one linear axis. */
export interface TickSet {
  /** Tick positions in data units, increasing. */
  values: number[];
  /** Spacing between ticks in data units (1, 2 or 5 times a power of ten). */
  step: number;
  /** Decimals needed to tell the ticks apart (0 for integer steps). */
  decimals: number;
  /** Axis range: the input range (tight) or the outermost ticks (loose). */
  domain: [number, number];
}

/** A range narrower than this fraction of its magnitude is treated as a single value and widened. */
const DEGENERATE_RANGE_FRACTION = 1e-12;
/** A single value v is widened to v ± 10% of |v| (or ± 0.5 for zero), which keeps v itself a tick. */
const DEGENERATE_HALF_WIDTH_FRACTION = 0.1;
/** Tick values closer to zero than this fraction of the step are written as exactly zero. */
const ZERO_SNAP_FRACTION = 1e-9;
/** Largest decimal count `Number.prototype.toFixed` accepts (ECMAScript 2018 and later). */
const MAX_FIXED_DECIMALS = 100;
/** Tolerance (in steps) for keeping an end tick that rounding pushed just outside a tight range. */
const END_TICK_SLACK_STEPS = 1e-9;

/**
 * Heckbert's "nice number": the number 1, 2, 5 or 10 times a power of ten
 * closest to (round = true) or not below (round = false) the value.
 * Heckbert, P. S. (1990), "Nice numbers for graph labels", Graphics Gems I, 61-63.
 *
 * @param value positive number (data units)
 * @param round true to round to the nearest nice number, false to take the ceiling
 * @returns the nice number
 * @example niceNumber(438, false) // 500
 */
export function niceNumber(value: number, round: boolean): number {
  const exponent = Math.floor(Math.log10(value));
  const fraction = value / 10 ** exponent;
  let nice: number;
  if (round) nice = fraction < 1.5 ? 1 : fraction < 3 ? 2 : fraction < 7 ? 5 : 10;
  else nice = fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10;
  return nice * 10 ** exponent;
}

/** The next smaller number of the 1-2-5 sequence: 5 -> 2, 2 -> 1, 1 -> 0.5 (times the power of ten). */
function finerNiceStep(step: number): number {
  const exponent = Math.floor(Math.log10(step) + ZERO_SNAP_FRACTION);
  const mantissa = Math.round(step / 10 ** exponent);
  return mantissa >= 5 ? 2 * 10 ** exponent : mantissa >= 2 ? 10 ** exponent : 5 * 10 ** (exponent - 1);
}

/** Multiples of step inside [low, high] (tight) or covering it (loose), rounded to the step's decimals. */
function ticksAt(low: number, high: number, step: number, loose: boolean) {
  const firstIndex = loose ? Math.floor(low / step) : Math.ceil(low / step - END_TICK_SLACK_STEPS);
  const lastIndex = loose ? Math.ceil(high / step) : Math.floor(high / step + END_TICK_SLACK_STEPS);
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + ZERO_SNAP_FRACTION));
  const values: number[] = [];
  for (let index = firstIndex; index <= lastIndex; index++) {
    // Rounding to the step's decimals turns 3 * 0.1 = 0.30000000000000004 into 0.3.
    const value = Number((index * step).toFixed(Math.min(decimals, MAX_FIXED_DECIMALS)));
    values.push(Math.abs(value) < ZERO_SNAP_FRACTION * step ? 0 : value);
  }
  return { values, decimals, firstIndex, lastIndex };
}

/**
 * Tick marks for a linear axis by a variant of Heckbert's (1990) labelling
 * rule: the step is the nice number nearest to range / (targetCount - 1)
 * (Heckbert rounds the range to a nice number first, which can double the
 * step). With `loose` the axis grows to the outermost ticks (Heckbert's
 * "loose labelling"); otherwise only ticks inside [min, max] are kept, the
 * domain stays [min, max], and the step is refined until at least two ticks fit.
 *
 * Cost: O(number of ticks).
 *
 * @param min lower end of the data range (data units)
 * @param max upper end of the data range (data units)
 * @param targetCount wanted number of ticks (>= 2; default 5)
 * @param loose grow the domain to whole steps (default false)
 * @returns ticks, step, decimals and the axis domain
 * @throws CandelaError `figure.bad_range` when min or max is not finite
 * @example niceTicks(105, 543, 5, true) // values [100, 200, 300, 400, 500, 600], step 100
 */
export function niceTicks(min: number, max: number, targetCount = 5, loose = false): TickSet {
  if (!Number.isFinite(min) || !Number.isFinite(max)) {
    throw new CandelaError({
      code: 'figure.bad_range',
      message: 'an axis range must be two finite numbers',
      found: `[${min}, ${max}]`,
      fix: 'drop non-finite values before drawing',
    });
  }
  let low = Math.min(min, max);
  let high = Math.max(min, max);
  const magnitude = Math.max(Math.abs(low), Math.abs(high));
  if (high - low <= DEGENERATE_RANGE_FRACTION * magnitude || high === low) {
    const half = magnitude > 0 ? DEGENERATE_HALF_WIDTH_FRACTION * magnitude : 0.5;
    low -= half;
    high += half;
  }
  const count = Math.max(2, Math.round(targetCount));
  // Heckbert first rounds the range itself up to a nice number; dividing the raw range instead
  // avoids steps twice as coarse as asked for (0..2999 gets steps of 500, not 1000).
  let step = niceNumber((high - low) / (count - 1), true);
  let ticks = ticksAt(low, high, step, loose);
  // A tight range may hold a single tick at the rounded step; the next finer nice step gives two or more.
  while (ticks.values.length < 2) {
    step = finerNiceStep(step);
    ticks = ticksAt(low, high, step, loose);
  }
  const { values, decimals, firstIndex, lastIndex } = ticks;
  const domain: [number, number] = loose ? [firstIndex * step, lastIndex * step] : [low, high];
  return { values, step, decimals, domain };
}
