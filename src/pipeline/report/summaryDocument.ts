import { RELIABLE_STEPS_PER_TAU } from '../../diagnostics/index.js';
import { summaryJsonDocument, type SummaryJson } from '../../output/index.js';
import type { RunAnalysis } from './analyzeRun.js';
import type { RunOnDisk } from '../run/runFiles.js';

/**
 * summary.json's document for one run folder: maps run.json and the run's
 * analysis onto the output layer's summaryJsonDocument (the format itself
 * lives there). Built from the chains and run.json only, so it is
 * reproduced exactly by `candela report`.
 *
 * Cost: O(parameters^2).
 * @param run the run folder read back.
 * @param analysis its analysis (analyzeRun).
 * @returns the JSON-ready document.
 * @throws nothing.
 * @example JSON.stringify(summaryDocument(run, analyzeRun(run)), null, 2)
 */
export function summaryDocument(run: RunOnDisk, analysis: RunAnalysis): SummaryJson {
  const { record } = run;
  const sampler = record.sampler;
  return summaryJsonDocument({
    title: record.title,
    model: record.model,
    summary: analysis.summary,
    diagnostics: analysis.diagnostics,
    steps: analysis.steps,
    converged: analysis.converged,
    nested: analysis.method !== 'nested' ? null : {
      livePoints: sampler?.live_points ?? null,
      maxUnexploredLnZ: sampler?.max_unexplored_ln_z ?? null,
      stop: sampler?.stop ?? null,
      remainingLogZ: sampler?.remaining_log_z ?? null,
      effectiveSampleSize: analysis.effectiveSampleSize,
      evidence: record.evidence ?? null,
    },
    targetEss: record.run.target_ess,
    maxRhat: record.run.max_rhat,
    acceptanceMean: analysis.acceptanceMean,
    stuckWalkers: analysis.stuckWalkers,
    minimumChainLengthOverTau: RELIABLE_STEPS_PER_TAU,
    bestFit: record.best_fit,
    goodness: analysis.goodness,
    burnInSteps: analysis.burnInSteps,
    keptSamples: analysis.keptSamples,
    run: { ...record.run, version: record.tool.version, inputs: record.inputs, configuration: record.configuration },
    likelihood: record.likelihood,
    data: record.data,
    warnings: analysis.warnings,
  });
}
