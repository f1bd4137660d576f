import type { ReportRunFacts } from './reportInput.js';

/** Chi-square of one likelihood term at the best fit. */
export interface ReportTermFacts {
  /** The term's name, e.g. 'supernovae' or 'bao'. */
  name: string;
  /** Its chi-square at the best fit (null when it has none, e.g. an analytically marginalized term). */
  chiSquare: number | null;
  /** Data points of the term. */
  dataPoints: number;
  degreesOfFreedom: number;
}

/** The ensemble sampler's facts. */
export interface EnsembleSamplerFacts {
  method: 'ensemble';
  walkers: number;
  ensembles: number;
  /** Why sampling stopped, in words (the run record's stop reason). */
  stopReason: string;
}

/** The nested sampler's facts. */
export interface NestedSamplerFacts {
  method: 'nested';
  livePoints: number | undefined;
  /** The stopping rule that ended the run: 'max_unexplored_ln_z', or anything else for the iteration cap. */
  stop: string | undefined;
  /** The configured bound on the unexplored ln Z (shown when it stopped the run). */
  maxUnexploredLnZ: number | undefined;
  /** ln Z with its error and the information H, nats (null when the run record has none). */
  evidence: { logZ: number; logZError: number; informationNats: number } | null;
  /** Kish effective sample size of the weights (Kish 1965). */
  effectiveSampleSize: number;
  /** Weighted samples kept. */
  weightedSamples: number;
}

/** Plain facts of one run for the top of its report page. */
export interface RunFactsForReportInput {
  seed: string | number;
  /** Steps per walker (ensemble) or iterations (nested). */
  steps: number;
  wallTimeSeconds: number;
  version: string;
  modelLabel: string;
  sampler: EnsembleSamplerFacts | NestedSamplerFacts;
  supernovae: number;
  /** Best-fit chi-square (null when the run has none) and its degrees of freedom. */
  chiSquare: number | null;
  degreesOfFreedom: number;
  /** Chi-square per degree of freedom and its p-value, when known. */
  goodness: { reducedChiSquare: number; pValue: number } | null;
  /** Every likelihood term (a row each when there are two or more; ensemble runs only). */
  terms: readonly ReportTermFacts[];
  /** Likelihood evaluations. */
  evaluations: number;
}

/**
 * The run facts at the top of a run's report page, worded once for both
 * samplers: seed, steps, why it stopped, wall time, version and model, then
 * the further facts in order. Ensemble runs: supernovae, the best-fit
 * chi-square, chi-square per degree of freedom with its p-value, one row per
 * likelihood term when there are two or more, and the likelihood calls.
 * Nested runs: the stop criterion in words, that the Markov-chain
 * convergence checks do not apply, ln Z with its error, the information H,
 * the Kish effective sample size (Kish 1965), then supernovae, chi-square,
 * chi-square per degree of freedom and the likelihood calls.
 *
 * Cost: O(terms).
 * @param facts the run's plain facts.
 * @returns the facts for reportHtml.
 * @throws nothing.
 * @example runFactsForReport({ ...facts, chiSquare: 12.345, degreesOfFreedom: 10 }).extra?.[1].value // '12.35 for 10 degrees of freedom'
 */
export function runFactsForReport(facts: RunFactsForReportInput): ReportRunFacts {
  const { sampler } = facts;
  const common = [
    { label: 'supernovae', value: String(facts.supernovae) },
    { label: 'chi-square at best fit', value: facts.chiSquare === null ? 'n/a' : `${facts.chiSquare.toFixed(2)} for ${facts.degreesOfFreedom} degrees of freedom` },
    ...(facts.goodness ? [{ label: 'chi-square per degree of freedom', value: `${facts.goodness.reducedChiSquare.toFixed(3)} (p-value ${facts.goodness.pValue.toPrecision(3)})` }] : []),
  ];
  const evaluations = { label: 'likelihood evaluations', value: String(facts.evaluations) };
  const head = { seed: facts.seed, steps: facts.steps };
  const tail = { wallTimeSeconds: facts.wallTimeSeconds, version: facts.version, model: facts.modelLabel };
  if (sampler.method === 'ensemble') {
    return {
      ...head, walkers: sampler.walkers, ensembles: sampler.ensembles, stopReason: sampler.stopReason, ...tail,
      extra: [...common, ...termRows(facts.terms), evaluations],
    };
  }
  const { evidence } = sampler;
  return {
    ...head,
    stopReason: sampler.stop === 'max_unexplored_ln_z' ? `nested sampling: unexplored ln Z below max_unexplored_ln_z = ${sampler.maxUnexploredLnZ}` : 'nested sampling: iteration cap reached',
    ...tail,
    extra: [
      { label: 'sampler', value: `nested sampling, ${sampler.livePoints} live points (convergence checks for Markov chains do not apply)` },
      { label: 'ln Z (evidence)', value: evidence ? `${evidence.logZ.toFixed(3)} ± ${evidence.logZError.toFixed(3)}` : 'n/a' },
      { label: 'information H', value: evidence ? `${evidence.informationNats.toFixed(2)} nats` : 'n/a' },
      { label: 'effective sample size (Kish)', value: `${sampler.effectiveSampleSize.toFixed(0)} of ${sampler.weightedSamples} weighted samples` },
      ...common,
      evaluations,
    ],
  };
}

/** One row per likelihood term when the posterior has more than one: its chi-square, data points and degrees of freedom. */
function termRows(terms: readonly ReportTermFacts[]): Array<{ label: string; value: string }> {
  if (terms.length < 2) return [];
  return terms.map((term) => ({
    label: `chi-square of ${term.name}`,
    value: term.chiSquare === null ? 'n/a' : `${term.chiSquare.toFixed(2)} for ${term.dataPoints} data points, ${term.degreesOfFreedom} degrees of freedom`,
  }));
}
