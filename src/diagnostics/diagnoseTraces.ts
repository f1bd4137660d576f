import { chooseBurnIn } from './chooseBurnIn.js';
import { diagnoseEnsembleChains, type EnsembleTrace, type ParameterDiagnostics } from './diagnoseEnsembleChains.js';
import { integratedAutocorrelationTime } from './integratedAutocorrelationTime.js';

/** Thinning for the rank-based diagnostics: keep one step per tau/5. */
const THINNING_PER_TAU = 5;
/** Fewest thinned steps per walker worth diagnosing; below it every step is used. */
const MINIMUM_THINNED_STEPS = 20;

/** Convergence numbers of several quantities of one set of ensemble chains. */
export interface TraceDiagnosis {
  /** Integrated autocorrelation time of each quantity over the whole chain, steps (NaN when undefined). */
  tauSteps: number[];
  burnInSteps: number;
  /** Thinning of the kept steps used for R-hat and ESS. */
  thin: number;
  /** Per quantity: R-hat, bulk/tail ESS, MCSE on the thinned kept steps, with `tau` replaced by tauSteps. */
  diagnostics: ParameterDiagnostics[];
}

/** Each walker's series of one quantity from step-major ensemble traces. */
function walkerSeries(trace: readonly EnsembleTrace[]): Float64Array[] {
  const series: Float64Array[] = [];
  for (const { steps, walkers, values } of trace) {
    for (let w = 0; w < walkers; w++) {
      const walker = new Float64Array(steps);
      for (let s = 0; s < steps; s++) walker[s] = values[s * walkers + w];
      series.push(walker);
    }
  }
  return series;
}

/**
 * Integrated autocorrelation time of each quantity over the whole of its
 * ensemble traces (FFT autocorrelation averaged over walkers, Sokal's
 * automatic window), in steps; NaN where it is undefined.
 * Cost: the FFTs, O(walkers x steps log steps) per quantity.
 * @param traces per quantity, its ensemble traces.
 * @returns tau per quantity, steps.
 * @example traceAutocorrelationTimes(traces)[0] // tau of the first quantity
 */
export function traceAutocorrelationTimes(traces: ReadonlyArray<readonly EnsembleTrace[]>): number[] {
  return traces.map((trace) => {
    try {
      return integratedAutocorrelationTime(walkerSeries(trace)).tauSteps;
    } catch {
      return Number.NaN;
    }
  });
}

/**
 * The one convergence computation of candela, used by the stopping rule while
 * sampling and by the summaries afterwards, so both report the same numbers:
 * 1. tau per quantity from the whole chain (FFT autocorrelation averaged over
 *    walkers, Sokal's automatic window; Goodman & Weare 2010);
 * 2. burn-in: the given one, or chooseBurnIn (2 x max tau of the first
 *    `burnInFrom` quantities, capped at half the chain);
 * 3. rank-normalized split-R-hat, bulk and tail ESS and MCSE (Vehtari et al.
 *    2021) on the kept steps thinned by a fifth of the shortest tau, every
 *    walker of every ensemble a chain. Draws closer than tau/5 carry little
 *    extra information, so the thinned ESS and R-hat estimate those of every
 *    draw (Geyer 1992, on thinning) at a fraction of the cost.
 * Cost: O(S log S) per quantity for S = kept draws / thin, plus the FFTs.
 */
export function diagnoseTraces(traces: ReadonlyArray<readonly EnsembleTrace[]>, options: { burnInSteps?: number; burnInFrom?: number } = {}): TraceDiagnosis {
  const steps = traces[0][0].steps;
  const tauSteps = traceAutocorrelationTimes(traces);
  const governing = tauSteps.slice(0, options.burnInFrom ?? tauSteps.length);
  const usable = governing.filter((tau) => Number.isFinite(tau) && tau > 0);
  const burnInSteps = options.burnInSteps ?? (usable.length === governing.length && usable.length > 0 ? chooseBurnIn(usable, steps) : Math.floor(steps / 2));
  const minTau = Math.min(...usable);
  let thin = Number.isFinite(minTau) ? Math.max(1, Math.floor(minTau / THINNING_PER_TAU)) : 1;
  if (Math.floor((steps - burnInSteps) / thin) < MINIMUM_THINNED_STEPS) thin = 1;
  const keptSteps = Math.floor((steps - burnInSteps) / thin);
  const diagnostics = traces.map((trace, index) => {
    const thinned = trace.map(({ walkers, values }) => {
      const out = new Float64Array(keptSteps * walkers);
      for (let j = 0; j < keptSteps; j++) out.set(values.subarray((burnInSteps + j * thin) * walkers, (burnInSteps + j * thin + 1) * walkers), j * walkers);
      return { steps: keptSteps, walkers, values: out };
    });
    const result = diagnoseEnsembleChains(thinned, 0);
    return { ...result, tau: Number.isFinite(tauSteps[index]) ? tauSteps[index] : result.tau === null ? null : result.tau * thin };
  });
  return { tauSteps, burnInSteps, thin, diagnostics };
}
