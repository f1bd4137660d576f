/** What a nested-sampling run tells run.json, as plain facts (camelCase; the sampler's result and the settings used). */
export interface NestedRunJsonFacts {
  /** The configuration's seed, as written. */
  seed: string;
  /** Rows stored in chains.csv: the dead points, then the final live points. */
  storedSamples: number;
  likelihoodCalls: number;
  /** Wall-clock time of the sampling, s. */
  wallSeconds: number;
  /** True when the unexplored-ln Z criterion stopped the run, false when the iteration cap did. */
  evidenceSettled: boolean;
  /** The ensemble stopping targets of the configuration (recorded, unused by nested sampling). */
  targetEss: number;
  maxRhat: number;
  livePoints: number;
  /** Bound on the ln Z the live points could still add, nats. */
  maxUnexploredLnZ: number;
  maxIterations: number;
  /** Volume enlargement of the bounding ellipsoids. */
  enlargement: number;
  /** Remaining-evidence estimate ln(Z + L_max X) - ln Z when the run stopped, nats. */
  remainingLogZ: number;
  /** Kish (1965) effective sample size of the posterior weights. */
  effectiveSampleSize: number;
  /** ln Z and its error sqrt(H / N) (Skilling 2006), nats. */
  logZ: number;
  logZError: number;
  /** Information H, nats. */
  informationNats: number;
  iterations: number;
}

/** The sections run.json adds for a nested-sampling run (snake_case, as written). */
export interface NestedRunJsonSections {
  sampler: {
    method: 'nested';
    live_points: number;
    /** The configured bound on the ln Z the live points could still add, nats (`sampler.nested.max_unexplored_ln_z`). */
    max_unexplored_ln_z: number;
    max_iterations: number;
    /** Volume enlargement of the bounding ellipsoids. */
    enlargement: number;
    /** `max_unexplored_ln_z`: the unexplored ln Z fell below its bound; `max_iterations`: the iteration cap was reached first. */
    stop: 'max_unexplored_ln_z' | 'max_iterations';
    /** Remaining-evidence estimate ln(Z + L_max X) - ln Z when the run stopped, nats. */
    remaining_log_z: number;
    /** Kish (1965) effective sample size of the posterior weights. */
    effective_sample_size: number;
  };
  /** ln Z with its error sqrt(H / N), the information H (nats), iterations and likelihood calls (Skilling 2006). */
  evidence: { log_z: number; log_z_error: number; information_nats: number; iterations: number; likelihood_calls: number };
}

/**
 * The nested-sampling part of run.json, keys in the file's order: `run`,
 * where the chain layout reads as one ensemble of one walker whose `steps`
 * are the stored samples, no burn-in, one worker thread, the wall time to
 * the millisecond and `stop_reason` `converged` when the unexplored-ln Z
 * criterion was met, `max_steps` when the iteration cap stopped the run;
 * then `sampler` (method, settings, stop, Kish effective sample size) and
 * `evidence` (ln Z, its error, the information, iterations, likelihood calls).
 *
 * Cost: O(1).
 * @param facts the run's nested-sampling facts.
 * @returns the three sections, to follow the sections every run record has.
 * @throws nothing.
 * @example nestedRunJson({ ...facts, evidenceSettled: false }).sampler.stop // 'max_iterations'
 */
export function nestedRunJson(facts: NestedRunJsonFacts): { run: NestedRunSection } & NestedRunJsonSections {
  return {
    run: nestedRunSection(facts),
    sampler: {
      method: 'nested',
      live_points: facts.livePoints,
      max_unexplored_ln_z: facts.maxUnexploredLnZ,
      max_iterations: facts.maxIterations,
      enlargement: facts.enlargement,
      stop: facts.evidenceSettled ? 'max_unexplored_ln_z' : 'max_iterations',
      remaining_log_z: facts.remainingLogZ,
      effective_sample_size: facts.effectiveSampleSize,
    },
    evidence: {
      log_z: facts.logZ,
      log_z_error: facts.logZError,
      information_nats: facts.informationNats,
      iterations: facts.iterations,
      likelihood_calls: facts.likelihoodCalls,
    },
  };
}

/** run.json's `run` section as a nested-sampling run fills it (the keys every run record's `run` section has). */
function nestedRunSection(facts: NestedRunJsonFacts) {
  return {
    seed: facts.seed, steps: facts.storedSamples, burn_in_steps: 0, walkers: 1, ensembles: 1,
    evaluations: facts.likelihoodCalls, wall_seconds: Math.round(facts.wallSeconds * 1000) / 1000, worker_threads: 1,
    stop_reason: facts.evidenceSettled ? 'converged' as const : 'max_steps' as const,
    target_ess: facts.targetEss, max_rhat: facts.maxRhat,
  };
}

/** run.json's `run` section as a nested-sampling run fills it. */
export type NestedRunSection = ReturnType<typeof nestedRunSection>;
