import { describe, expect, it } from 'vitest';
import { planSideBySide } from '../../../src/pipeline/fit/sideBySidePlan.js';

// The split of a thread budget among models is plain arithmetic (an even split, the remainder to the first slots:
// common practice for dealing out whole units), checked by hand on the cases the documentation names.
describe('planSideBySide', () => {
  it('runs two of three models at once with one thread each on two cores', () => {
    expect(planSideBySide(3, 2)).toEqual({ slots: 2, threadsPerSlot: [1, 1] });
  });

  it('gives each of two models half of eight threads', () => {
    expect(planSideBySide(2, 8)).toEqual({ slots: 2, threadsPerSlot: [4, 4] });
  });

  it('deals the remainder of the threads to the first slots, so that they always sum to the budget', () => {
    expect(planSideBySide(3, 8)).toEqual({ slots: 3, threadsPerSlot: [3, 3, 2] });
    for (let models = 2; models <= 6; models++) {
      for (let budget = 2; budget <= 17; budget++) {
        const plan = planSideBySide(models, budget);
        expect(plan?.slots).toBe(Math.min(models, budget));
        expect(plan?.threadsPerSlot.reduce((sum, count) => sum + count, 0)).toBe(budget);
        expect(Math.max(...(plan?.threadsPerSlot ?? [])) - Math.min(...(plan?.threadsPerSlot ?? []))).toBeLessThanOrEqual(1);
      }
    }
  });

  it('never runs more models at once than there are threads', () => {
    expect(planSideBySide(5, 2)).toEqual({ slots: 2, threadsPerSlot: [1, 1] });
  });

  it('is null when side by side cannot help: one model, or fewer than two threads', () => {
    expect(planSideBySide(1, 8)).toBeNull();
    expect(planSideBySide(3, 1)).toBeNull();
    expect(planSideBySide(0, 4)).toBeNull();
    expect(planSideBySide(3, Number.NaN)).toBeNull();
  });
});
