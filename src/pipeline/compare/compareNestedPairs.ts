import { isCandelaError } from '../../errors.js';
import { savageDickeyRatio, savageDickeyRatio2D, type SavageDickeyEstimate } from '../../compare/index.js';
import { priorLogDensity, type Prior } from '../../likelihood/index.js';
import { smoothingOf } from '../report/analyzeRun.js';
import type { AnalyzedRun } from './compareInputs.js';
import { storedConfiguration } from '../run/storedConfiguration.js';

/** A simpler run nested in an extended one: the extended model at fixed values of its extra parameters is the simpler model. */
export interface DetectedNestedPair {
  base: AnalyzedRun;
  extended: AnalyzedRun;
  /** The extended model's extra sampled parameters, the value the simpler model fixes each at, and the extended model's prior. */
  extra: Array<{ name: string; value: number; prior: Prior }>;
  /** Shared sampled parameters whose priors differ between the runs (the Savage-Dickey identity then does not hold exactly). */
  priorMismatches: string[];
}

/** The Savage-Dickey ratio of one pair, or why there is none. */
export type PairSavageDickey =
  | { ok: true; estimate: SavageDickeyEstimate; drawsUsed: number; thinning: number }
  | { ok: false; reason: string };

function dataFingerprint(run: AnalyzedRun['run']): string {
  const configuration = storedConfiguration(run);
  return JSON.stringify({
    files: run.record.inputs.slice(1).map((input) => input.sha256).sort(),
    count: run.record.best_fit.n_data,
    standardization: configuration.ok ? configuration.value.standardization : null,
    curvature: run.record.model.curvature,
    radiation: run.record.model.radiation,
  });
}

/**
 * Finds every nested pair among the runs: same data (the same data-file
 * SHA-256 digests, data count and standardization settings) and the same
 * curvature and radiation, the simpler run's sampled parameters a strict
 * subset of the extended run's, every extra parameter fixed by the simpler
 * run (e.g. w0 = -1, wa = 0 for a cosmological constant) at a value inside
 * the extended prior, and parameters fixed in both at equal values. A flat
 * model inside a curved one is not detected (flatness is a constraint on
 * omega_de, not a fixed value of a sampled parameter).
 *
 * Cost: O(runs^2 x parameters).
 * @param runs the analyzed runs.
 * @returns the pairs, in the order of the runs (simpler first).
 * @throws nothing.
 * @example detectNestedPairs([lcdm, wcdm])[0].extra // [{ name: 'w0', value: -1, prior: { kind: 'uniform', min: -2.5, max: -0.3 } }]
 */
export function detectNestedPairs(runs: readonly AnalyzedRun[]): DetectedNestedPair[] {
  const pairs: DetectedNestedPair[] = [];
  for (const base of runs) {
    for (const extended of runs) {
      if (base === extended || dataFingerprint(base.run) !== dataFingerprint(extended.run)) continue;
      const simple = base.run.record.parameters;
      const wide = extended.run.record.parameters;
      const simpleNames = simple.sampled.map((p) => p.name);
      const wideNames = wide.sampled.map((p) => p.name);
      if (!simpleNames.every((name) => wideNames.includes(name)) || wideNames.length <= simpleNames.length) continue;
      const extra = wide.sampled.filter((p) => !simpleNames.includes(p.name)).map((p) => ({ name: p.name, value: simple.fixed[p.name], prior: p.prior as Prior }));
      if (extra.some((entry) => entry.value === undefined || !(priorLogDensity(entry.prior, entry.value) > -Infinity))) continue;
      if (Object.entries(simple.fixed).some(([name, value]) => name in wide.fixed && wide.fixed[name] !== value)) continue;
      const priorMismatches = simpleNames.filter((name) => {
        const a = simple.sampled.find((p) => p.name === name)?.prior;
        const b = wide.sampled.find((p) => p.name === name)?.prior;
        return JSON.stringify(a) !== JSON.stringify(b);
      });
      pairs.push({ base, extended, extra, priorMismatches });
    }
  }
  return pairs;
}

function edges(prior: Prior): [number, number] {
  return prior.kind === 'gaussian' ? [-Infinity, Infinity] : [prior.min, prior.max];
}

/**
 * Savage-Dickey density ratio (Dickey 1971; Trotta 2007) of a nested pair,
 * B_01 = p(extra = fixed values | data, extended) / pi(fixed values), from
 * the extended run's kept draws: weighted for nested runs; for ensemble runs
 * thinned to one draw per walker every ceil(tau) steps (tau the largest
 * autocorrelation time of the extra parameters), so that the bootstrap error
 * sees roughly independent draws. One extra parameter uses the 1-D kernel
 * estimate, two the 2-D one, smoothed as the run's plotted marginals and
 * contours (`output.smoothing`); more are not supported.
 *
 * Cost: O(draws x bootstrap replicates).
 * @param pair a detected pair.
 * @param seed seed of the bootstrap stream.
 * @returns the estimate with the draws used and the thinning, or why there is none.
 * @throws nothing (a failed estimate is returned as a reason).
 * @example savageDickeyForPair(pair, 'compare').ok
 */
export function savageDickeyForPair(pair: DetectedNestedPair, seed: string): PairSavageDickey {
  const { run, analysis } = pair.extended;
  if (pair.extra.length > 2) return { ok: false, reason: `${pair.extra.length} extra parameters: the Savage-Dickey estimate is done for one or two` };
  let thinning = 1;
  if (!analysis.keptWeights) {
    for (const entry of pair.extra) thinning = Math.max(thinning, Math.ceil(analysis.diagnostics[entry.name]?.tau ?? 1));
  }
  const rows = Array.from(analysis.keptRows).filter((r) => (run.chains.step[r] - analysis.burnInSteps) % thinning === 0);
  const weights = analysis.keptWeights ? Float64Array.from(analysis.keptWeights) : undefined;
  const column = (name: string) => Float64Array.from(rows, (r) => run.chains.columns[name][r]);
  let logPriorDensity = 0;
  for (const entry of pair.extra) logPriorDensity += priorLogDensity(entry.prior, entry.value);
  // The kernel of the plotted marginals and contours: the run's output.smoothing.
  const { bandwidth, bandwidthRule, bandwidthFactor } = smoothingOf(run);
  try {
    const estimate = pair.extra.length === 1
      ? savageDickeyRatio({
        samples: column(pair.extra[0].name), weights, nestedValue: pair.extra[0].value, priorDensity: Math.exp(logPriorDensity),
        lowerEdge: edges(pair.extra[0].prior)[0], upperEdge: edges(pair.extra[0].prior)[1], seed, bandwidth, bandwidthRule, bandwidthFactor,
      })
      : savageDickeyRatio2D({
        xs: column(pair.extra[0].name), ys: column(pair.extra[1].name), weights, nestedPoint: [pair.extra[0].value, pair.extra[1].value],
        priorDensity: Math.exp(logPriorDensity),
        lowerEdges: [edges(pair.extra[0].prior)[0], edges(pair.extra[1].prior)[0]], upperEdges: [edges(pair.extra[0].prior)[1], edges(pair.extra[1].prior)[1]], seed,
        bandwidths: bandwidth !== undefined ? [bandwidth, bandwidth] : undefined, bandwidthRule, bandwidthFactor,
      });
    return { ok: true, estimate, drawsUsed: rows.length, thinning };
  } catch (error) {
    if (isCandelaError(error)) return { ok: false, reason: error.issues.map((issue) => issue.message).join('; ') };
    throw error;
  }
}
