import { CandelaError } from '../../errors.js';
import { niceTicks } from './niceTicks.js';

/** Ticks of one logarithmic axis. */
export interface LogTickSet {
  /** Labelled ticks in data units, increasing. */
  major: number[];
  /** Unlabelled ticks (the other integer multiples of each power of ten). */
  minor: number[];
}

/** Above this many decades only the powers of ten are labelled; below it also 2 and 5 times them. */
const DECADES_FOR_POWERS_ONLY = 3;
/** Below this many decades too few 1-2-5 ticks fall in the range; linear nice ticks are used instead. */
const DECADES_FOR_LINEAR_FALLBACK = 0.5;
/** Relative slack for keeping a tick that sits on an end of the range. */
const END_TICK_RELATIVE_SLACK = 1e-9;

/**
 * Tick marks for a logarithmic axis: 1, 2 and 5 times each power of ten
 * inside [min, max] (only powers of ten when the range spans more than three
 * decades), with the other integer multiples as minor ticks. Very narrow
 * ranges (under half a decade) fall back to linear nice ticks. This is common
 * practice for log axes (e.g. Cleveland 1985, "The Elements of Graphing Data").
 *
 * Cost: O(decades).
 *
 * @param min lower end of the range (data units, > 0)
 * @param max upper end of the range (data units, > min)
 * @returns major (labelled) and minor ticks
 * @throws CandelaError `figure.bad_log_range` when min <= 0 or a bound is not finite
 * @example logTicks(0.01, 2.3).major // [0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2]
 */
export function logTicks(min: number, max: number): LogTickSet {
  if (!(min > 0) || !Number.isFinite(max) || !(max > 0)) {
    throw new CandelaError({
      code: 'figure.bad_log_range',
      message: 'a logarithmic axis needs a positive, finite range',
      found: `[${min}, ${max}]`,
      fix: 'drop zero or negative values (e.g. redshifts) before drawing on a log axis',
    });
  }
  const low = Math.min(min, max);
  const high = Math.max(min, max);
  const decades = Math.log10(high / low);
  if (decades < DECADES_FOR_LINEAR_FALLBACK) {
    return { major: niceTicks(low, high, 4).values.filter((value) => value > 0), minor: [] };
  }
  const labelled = decades > DECADES_FOR_POWERS_ONLY ? [1] : [1, 2, 5];
  const major: number[] = [];
  const minor: number[] = [];
  const lowerBound = low * (1 - END_TICK_RELATIVE_SLACK);
  const upperBound = high * (1 + END_TICK_RELATIVE_SLACK);
  for (let exponent = Math.floor(Math.log10(low)); exponent <= Math.ceil(Math.log10(high)); exponent++) {
    for (let multiple = 1; multiple <= 9; multiple++) {
      // Writing the tick through its decimal text keeps 0.2 from becoming 0.20000000000000004.
      const value = Number(`${multiple}e${exponent}`);
      if (value < lowerBound || value > upperBound) continue;
      (labelled.includes(multiple) ? major : minor).push(value);
    }
  }
  return { major, minor };
}
