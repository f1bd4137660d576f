import { describe, expect, it } from 'vitest';
import { chooseBurnIn } from '../../src/diagnostics/index.js';

describe('chooseBurnIn', () => {
  it('discards ceil(2 x the largest tau) steps (hand-made input)', () => {
    expect(chooseBurnIn([12.3, 40.2, 7], 5000)).toBe(81); // ceil(80.4)
    expect(chooseBurnIn([25], 5000)).toBe(50); // exactly 2 tau
  });

  it('never discards more than half the chain', () => {
    expect(chooseBurnIn([400], 500)).toBe(250);
    expect(chooseBurnIn([400], 501)).toBe(250); // floor(501 / 2)
    expect(chooseBurnIn([3], 0)).toBe(0);
  });

  it('throws for an empty list, a bad tau or a bad step count', () => {
    const codeOf = (run: () => unknown): string | undefined => {
      try {
        run();
      } catch (error) {
        return (error as { issues: Array<{ code: string }> }).issues[0].code;
      }
      return undefined;
    };
    expect(codeOf(() => chooseBurnIn([], 100))).toBe('diagnostics.no_tau');
    expect(codeOf(() => chooseBurnIn([5, Number.NaN], 100))).toBe('diagnostics.tau_value');
    expect(codeOf(() => chooseBurnIn([5, -1], 100))).toBe('diagnostics.tau_value');
    expect(codeOf(() => chooseBurnIn([5], 10.5))).toBe('diagnostics.step_count');
  });
});
