import { runFactsForReport, type ReportRunFacts } from '../../output/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { StoredRunRecord } from '../run/runFiles.js';

/**
 * The run facts at the top of a run's report page: run.json and the
 * analysis mapped onto output's runFactsForReport, which words them (for
 * ensemble runs the walkers, stop reason and per-term chi-square; for nested
 * runs the stop criterion, ln Z, the information H and the Kish effective
 * sample size).
 *
 * Cost: O(terms).
 * @param record run.json of the run.
 * @param analysis its analysis (goodness of fit; for nested runs the effective sample size and sample count).
 * @returns the facts for reportHtml.
 * @throws nothing.
 * @example reportFactsOfRun(record, analysis).extra?.[0].label // 'supernovae' (ensemble) or 'sampler' (nested)
 */
export function reportFactsOfRun(record: StoredRunRecord, analysis: RunAnalysis): ReportRunFacts {
  const { sampler, evidence } = record;
  return runFactsForReport({
    seed: record.run.seed, steps: record.run.steps, wallTimeSeconds: record.run.wall_seconds, version: record.tool.version, modelLabel: record.model.label,
    sampler: analysis.method === 'nested'
      ? {
        method: 'nested', livePoints: sampler?.live_points, stop: sampler?.stop, maxUnexploredLnZ: sampler?.max_unexplored_ln_z,
        evidence: evidence ? { logZ: evidence.log_z, logZError: evidence.log_z_error, informationNats: evidence.information_nats } : null,
        effectiveSampleSize: analysis.effectiveSampleSize ?? 0, weightedSamples: analysis.keptSamples,
      }
      : { method: 'ensemble', walkers: record.run.walkers, ensembles: record.run.ensembles, stopReason: record.run.stop_reason },
    supernovae: record.data.supernovae,
    chiSquare: record.best_fit.chi_square, degreesOfFreedom: record.best_fit.degrees_of_freedom,
    goodness: analysis.goodness ? { reducedChiSquare: analysis.goodness.reducedChiSquare, pValue: analysis.goodness.pValue } : null,
    terms: (record.best_fit.terms ?? []).map((term) => ({ name: term.name, chiSquare: term.chi_square, dataPoints: term.n_data, degreesOfFreedom: term.degrees_of_freedom })),
    evaluations: record.run.evaluations,
  });
}
