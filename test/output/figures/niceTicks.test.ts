import { describe, expect, it } from 'vitest';
import { formatTickLabel, logTicks, niceNumber, niceTicks } from '../../../src/output/figures/index.js';

describe('niceNumber', () => {
  it('rounds to 1, 2, 5 or 10 times a power of ten as Heckbert (1990) defines it', () => {
    // Heckbert 1990, Graphics Gems I p. 61-63: ceiling form for ranges, rounding form for steps (worked by hand).
    expect(niceNumber(438, false)).toBe(500);
    expect(niceNumber(125, true)).toBe(100);
    expect(niceNumber(0.0173, true)).toBeCloseTo(0.02, 15);
    expect(niceNumber(7.2, true)).toBe(10);
    expect(niceNumber(2, false)).toBe(2);
  });
});

describe('niceTicks', () => {
  it('labels 105..543 with steps of 100 from 100 to 600 when loose (Heckbert 1990 procedure, worked by hand)', () => {
    const ticks = niceTicks(105, 543, 5, true);
    expect(ticks.values).toEqual([100, 200, 300, 400, 500, 600]);
    expect(ticks.step).toBe(100);
    expect(ticks.decimals).toBe(0);
    expect(ticks.domain).toEqual([100, 600]);
  });

  it('keeps only ticks inside a tight range and leaves the range as given', () => {
    const ticks = niceTicks(0.16, 0.5, 4);
    // 0.34 / 3 = 0.113 rounds to the nice step 0.1 (by hand).
    expect(ticks.values).toEqual([0.2, 0.3, 0.4, 0.5]);
    expect(ticks.decimals).toBe(1);
    expect(ticks.domain).toEqual([0.16, 0.5]);
  });

  it('refines the step until a tight range holds at least two ticks', () => {
    // 9.2 / 3 = 3.07 rounds to the step 5, which leaves only 70 inside; the next finer step is 2 (by hand).
    expect(niceTicks(65.4, 74.6, 4).values).toEqual([66, 68, 70, 72, 74]);
  });

  it('writes decimal ticks without binary noise (3 * 0.1 is 0.3, not 0.30000000000000004)', () => {
    expect(niceTicks(0, 1, 11).values).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
  });

  it('handles negative ranges and a range crossing zero', () => {
    expect(niceTicks(-1.62, -0.38, 4).values).toEqual([-1.5, -1, -0.5]);
    expect(niceTicks(-0.45, 0.45, 5).values).toEqual([-0.4, -0.2, 0, 0.2, 0.4]);
  });

  it('widens a single value into a usable range', () => {
    // 70 becomes 63..77, step 14 / 4 = 3.5 rounds to 5 (by hand).
    const ticks = niceTicks(70, 70, 5);
    expect(ticks.values).toEqual([65, 70, 75]);
  });

  it('throws figure.bad_range for a non-finite bound', () => {
    expect(() => niceTicks(Number.NaN, 1)).toThrow(/finite/);
    try {
      niceTicks(0, Infinity);
    } catch (error) {
      expect((error as { issues: { code: string }[] }).issues[0].code).toBe('figure.bad_range');
    }
  });
});

describe('logTicks', () => {
  it('labels 1, 2 and 5 times each power of ten over a supernova redshift range (common practice)', () => {
    const ticks = logTicks(0.01, 2.3);
    expect(ticks.major).toEqual([0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1, 2]);
    expect(ticks.minor).toContain(0.03);
    expect(ticks.minor).toContain(0.9);
    expect(ticks.minor).not.toContain(3);
  });

  it('labels only powers of ten beyond three decades', () => {
    expect(logTicks(0.001, 1089).major).toEqual([0.001, 0.01, 0.1, 1, 10, 100, 1000]);
  });

  it('falls back to linear ticks inside a narrow range', () => {
    // Under half a decade: linear nice ticks, 0.5 / 3 = 0.167 rounds to the step 0.2 (by hand).
    expect(logTicks(0.3, 0.8).major).toEqual([0.4, 0.6, 0.8]);
  });

  it('throws figure.bad_log_range for a non-positive bound', () => {
    expect(() => logTicks(0, 1)).toThrow(/positive/);
  });
});

describe('formatTickLabel', () => {
  it('writes a typographic minus (U+2212) and never -0', () => {
    expect(formatTickLabel(-0.25, 2)).toBe('\u22120.25');
    expect(formatTickLabel(-0.0001, 1)).toBe('0.0');
    expect(formatTickLabel(-0, 0)).toBe('0');
    expect(formatTickLabel(0.05)).toBe('0.05');
    expect(formatTickLabel(1e-3 * 20)).toBe('0.02');
  });
});
