import type { ReportRunFacts } from '../../output/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { StoredRunRecord } from '../run/runFiles.js';

/**
 * The run facts at the top of a nested-sampling run's report page: the stop
 * criterion in words, that the Markov-chain convergence checks do not apply,
 * ln Z with its error, the information H, the Kish effective sample size,
 * the data count, the best-fit chi-square and the likelihood calls.
 *
 * Cost: O(1).
 * @param record run.json of a nested run.
 * @param analysis its analysis (for the effective sample size and sample count).
 * @returns the facts for reportHtml.
 * @throws nothing.
 * @example nestedReportFacts(record, analysis).extra?.[1].label // 'ln Z (evidence)'
 */
export function nestedReportFacts(record: StoredRunRecord, analysis: RunAnalysis): ReportRunFacts {
  const sampler = record.sampler;
  const evidence = record.evidence;
  return {
    seed: record.run.seed, steps: record.run.steps, wallTimeSeconds: record.run.wall_seconds, version: record.tool.version, model: record.model.label,
    stopReason: sampler?.stop === 'max_unexplored_ln_z' ? `nested sampling: unexplored ln Z below max_unexplored_ln_z = ${sampler.max_unexplored_ln_z}` : 'nested sampling: iteration cap reached',
    extra: [
      { label: 'sampler', value: `nested sampling, ${sampler?.live_points} live points (convergence checks for Markov chains do not apply)` },
      { label: 'ln Z (evidence)', value: evidence ? `${evidence.log_z.toFixed(3)} ± ${evidence.log_z_error.toFixed(3)}` : 'n/a' },
      { label: 'information H', value: evidence ? `${evidence.information_nats.toFixed(2)} nats` : 'n/a' },
      { label: 'effective sample size (Kish)', value: `${(analysis.effectiveSampleSize ?? 0).toFixed(0)} of ${analysis.keptSamples} weighted samples` },
      { label: 'supernovae', value: String(record.data.supernovae) },
      { label: 'chi-square at best fit', value: record.best_fit.chi_square === null ? 'n/a' : `${record.best_fit.chi_square.toFixed(2)} for ${record.best_fit.degrees_of_freedom} degrees of freedom` },
      ...(analysis.goodness ? [{ label: 'chi-square per degree of freedom', value: `${analysis.goodness.reducedChiSquare.toFixed(3)} (p-value ${analysis.goodness.pValue.toPrecision(3)})` }] : []),
      { label: 'likelihood evaluations', value: String(record.run.evaluations) },
    ],
  };
}
