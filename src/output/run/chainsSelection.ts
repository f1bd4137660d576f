/**
 * Which steps chains.csv holds. `all`: every step, the burn-in flagged (the
 * full record, as the summaries read it). `after_burn_in`: the steps after
 * the burn-in, thinned to one step in every `thinTauFraction` x the largest
 * integrated autocorrelation time (rounded down, at least 1), every walker
 * of every ensemble kept: what a user needs to plot or re-weight posteriors
 * (draws a fraction of tau apart are still correlated, so little
 * information is lost; common practice), at a fraction of the size. The
 * summaries are then computed from the chain record (chain-record.bin),
 * which always holds every step.
 */
export interface ChainsCsvOption {
  keep: 'all' | 'after_burn_in';
  /** Thinning as a fraction of the largest autocorrelation time (after_burn_in only), > 0. */
  thinTauFraction: number;
}

/** The default of the configuration's `output.chains`: the steps after the burn-in, half an autocorrelation time apart. */
export const DEFAULT_CHAINS_CSV: ChainsCsvOption = { keep: 'after_burn_in', thinTauFraction: 0.5 };

/** The steps chains.csv holds: first_step, first_step + every_steps, ..., `steps` of them; recorded in run.json. */
export interface ChainsSelection {
  keep: 'all' | 'after_burn_in';
  first_step: number;
  every_steps: number;
  steps: number;
}

/**
 * The steps of a run that chains.csv holds under `option`.
 * Cost: O(1).
 * @param option what to keep.
 * @param totalSteps steps the run took.
 * @param burnInSteps steps of burn-in.
 * @param maxTauSteps largest integrated autocorrelation time, steps (null when unknown: no thinning).
 * @returns the selection.
 * @throws nothing.
 * @example chainsSelection({ keep: 'after_burn_in', thinTauFraction: 0.5 }, 1000, 100, 30) // { keep: 'after_burn_in', first_step: 100, every_steps: 15, steps: 60 }
 */
export function chainsSelection(option: ChainsCsvOption, totalSteps: number, burnInSteps: number, maxTauSteps: number | null): ChainsSelection {
  if (option.keep === 'all' || burnInSteps >= totalSteps) return { keep: 'all', first_step: 0, every_steps: 1, steps: totalSteps };
  const every = maxTauSteps !== null && Number.isFinite(maxTauSteps) ? Math.max(1, Math.floor(option.thinTauFraction * maxTauSteps)) : 1;
  return { keep: 'after_burn_in', first_step: burnInSteps, every_steps: every, steps: Math.floor((totalSteps - burnInSteps - 1) / every) + 1 };
}
