import { describe, expect, it } from 'vitest';
import { acceptanceSummary, STUCK_SHARE_OF_MEDIAN } from '../../src/diagnostics/index.js';

describe('acceptanceSummary', () => {
  it('summarizes fractions and flags walkers at 0 or below 0.2 x median (hand-made input)', () => {
    // median of 0, 0.05, 0.3, 0.35, 0.4 is 0.3; 0.2 x 0.3 = 0.06, so walkers 2 (0.05) and 4 (0) are stuck.
    const summary = acceptanceSummary(Float64Array.of(0.3, 0.35, 0.05, 0.4, 0));
    expect(summary.median).toBe(0.3);
    expect(summary.mean).toBeCloseTo(0.22, 15);
    expect(summary.min).toBe(0);
    expect(summary.max).toBe(0.4);
    expect(summary.stuckWalkers).toEqual([2, 4]);
  });

  it('keeps a walker exactly at 0.2 x median and flags one just below it', () => {
    // median of (0.3, t, 0.3, 0.3, t - 1e-9) is 0.3; threshold t = 0.2 x 0.3 computed the same way.
    const atThreshold = STUCK_SHARE_OF_MEDIAN * 0.3;
    const summary = acceptanceSummary(Float64Array.of(0.3, atThreshold, 0.3, 0.3, atThreshold - 1e-9));
    expect(summary.median).toBe(0.3);
    expect(summary.stuckWalkers).toEqual([4]);
  });

  it('flags every walker when none accepted anything', () => {
    expect(acceptanceSummary(new Float64Array(4)).stuckWalkers).toEqual([0, 1, 2, 3]);
  });

  it('flags no walker in a healthy ensemble', () => {
    expect(acceptanceSummary(Float64Array.of(0.31, 0.28, 0.36, 0.25, 0.33)).stuckWalkers).toEqual([]);
  });

  it('throws diagnostics.acceptance_range for a fraction outside [0, 1] and diagnostics.no_walkers for none', () => {
    expect(() => acceptanceSummary(Float64Array.of(0.3, 1.2))).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'diagnostics.acceptance_range', path: 'walkers[1]' })] }));
    expect(() => acceptanceSummary(Float64Array.of(Number.NaN))).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'diagnostics.acceptance_range' })] }));
    expect(() => acceptanceSummary(new Float64Array(0))).toThrow(expect.objectContaining({ issues: [expect.objectContaining({ code: 'diagnostics.no_walkers' })] }));
  });
});
