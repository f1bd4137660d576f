import type { TraceEnsemble } from './tracePanel.js';

/** How the samples of one parameter are laid out in a flat chain column. */
export interface WalkerLayout {
  /** Stored steps per walker. */
  steps: number;
  /** Walkers per ensemble. */
  walkers: number;
  /** Independent ensembles. */
  ensembles: number;
}

/** Options of {@link sampleWalkerTraces}. */
export interface WalkerTraceOptions {
  /** Walkers drawn per ensemble, evenly spread over the ensemble (default 4). */
  perEnsemble?: number;
  /** Walkers flagged as stuck, per ensemble (0-based walker indices, e.g. from the diagnostics' acceptance summary); they are always drawn and highlighted. */
  stuckWalkers?: readonly (readonly number[])[];
  /** Step number of the first stored step (default 0) and steps between stored values (default 1). */
  firstStep?: number;
  stepStride?: number;
}

/** At most this many stuck walkers per ensemble are drawn (more would hide the others). */
const MAX_STUCK_DRAWN = 3;

/**
 * Picks the walkers a trace figure draws: per ensemble a few walkers spread
 * evenly over its walker indices, plus the walker whose value changed on the
 * fewest steps (so a walker that stopped moving is on the figure even when no
 * diagnostic flagged it), plus every walker flagged as stuck, which the
 * figure highlights. Individual walkers, unlike the ensemble mean, show a
 * stuck walker as a flat line.
 *
 * Cost: O(steps x walkers x ensembles) for the least-moving walker.
 *
 * @param column one parameter's samples, index (ensemble x steps + step) x walkers + walker (parameter units)
 * @param layout steps, walkers and ensembles
 * @param options walkers per ensemble, stuck walkers, step numbering
 * @returns one trace entry per ensemble, labelled 'ensemble 1', 'ensemble 2', ...
 * @example sampleWalkerTraces(chain.omega_m, { steps: 2000, walkers: 16, ensembles: 4 }, { perEnsemble: 4 })[0].series.length // 5
 */
export function sampleWalkerTraces(column: ArrayLike<number>, layout: WalkerLayout, options: WalkerTraceOptions = {}): TraceEnsemble[] {
  const { steps, walkers, ensembles } = layout;
  const perEnsemble = Math.max(1, Math.min(walkers, Math.trunc(options.perEnsemble ?? 4)));
  return Array.from({ length: ensembles }, (_, ensemble) => {
    const valueAt = (walker: number, step: number) => column[(ensemble * steps + step) * walkers + walker];
    const chosen: number[] = [];
    for (let pick = 0; pick < perEnsemble; pick++) chosen.push(Math.floor(((pick + 0.5) * walkers) / perEnsemble));
    let leastMoving = 0;
    let fewestMoves = Infinity;
    for (let walker = 0; walker < walkers; walker++) {
      let moves = 0;
      for (let step = 1; step < steps; step++) if (valueAt(walker, step) !== valueAt(walker, step - 1)) moves++;
      if (moves < fewestMoves) {
        fewestMoves = moves;
        leastMoving = walker;
      }
    }
    if (!chosen.includes(leastMoving)) chosen.push(leastMoving);
    const flagged = (options.stuckWalkers?.[ensemble] ?? []).filter((walker) => walker >= 0 && walker < walkers).slice(0, MAX_STUCK_DRAWN);
    for (const walker of flagged) if (!chosen.includes(walker)) chosen.push(walker);
    const series = chosen.map((walker) => Float64Array.from({ length: steps }, (_, step) => valueAt(walker, step)));
    return {
      label: `ensemble ${ensemble + 1}`,
      series,
      walkers: chosen,
      stuck: chosen.flatMap((walker, position) => (flagged.includes(walker) ? [position] : [])),
      firstStep: options.firstStep,
      stepStride: options.stepStride,
    };
  });
}
