/**
 * How the models of one configuration share the thread budget when they are
 * fitted side by side: how many run at once, and how many worker threads each
 * running model gets.
 */
export interface SideBySidePlan {
  /** Models fitted at once (>= 2). */
  slots: number;
  /** Worker threads of the model running in slot s (its --workers), s = 0 .. slots - 1; they sum to the budget. */
  threadsPerSlot: number[];
}

/**
 * Splits a thread budget among the models of a configuration. On a machine
 * where one model cannot use every core well (a worker pool's gain falls as
 * threads are added: 1.24x for two threads on cheap likelihoods, where the
 * per-batch round trips dominate), running several models at once, each
 * with a share of the threads, gives more: the models are independent.
 *
 * Up to `budget` models run at once (never more than there are); the
 * threads are dealt out evenly, the first `budget mod slots` slots taking one
 * more (8 threads, 3 models: 3, 3, 2). A model waiting for a slot takes the
 * threads of the slot that frees. The thread counts change no chain: the
 * sampler gives the same chains whatever the number of threads.
 * @param modelCount models to fit (whole number).
 * @param budget worker threads the fit may use in all (sampler.workers or --workers; 'auto' = the cores).
 * @returns the plan, or null when side by side cannot help: fewer than two models, or a budget below two threads.
 * @throws nothing.
 * @example planSideBySide(3, 2) // { slots: 2, threadsPerSlot: [1, 1] }
 * @example planSideBySide(2, 8) // { slots: 2, threadsPerSlot: [4, 4] }
 */
export function planSideBySide(modelCount: number, budget: number): SideBySidePlan | null {
  if (!(modelCount >= 2) || !(budget >= 2)) return null;
  const slots = Math.min(Math.floor(modelCount), Math.floor(budget));
  const base = Math.floor(budget / slots);
  const extra = Math.floor(budget) - base * slots;
  return { slots, threadsPerSlot: Array.from({ length: slots }, (_, s) => base + (s < extra ? 1 : 0)) };
}
