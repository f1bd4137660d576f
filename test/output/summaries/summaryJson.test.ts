import { describe, expect, it } from 'vitest';
import { SUMMARY_SCHEMA, summaryJsonDocument, summaryJsonText, type SummaryJsonInput } from '../../../src/output/index.js';
import type { SampleStatistics } from '../../../src/output/index.js';

// summary.json's layout is candela's own (README, "summary.json (schema
// candela-summary-1)"): these checks hold the keys and where each number
// comes from. The numbers are made up for the layout; no physics is checked.

/** Statistics with the intervals given as written (mean ± sd, ± 2 sd). */
function stats(mean: number, sd: number, ci68: [number, number], ci95: [number, number]): SampleStatistics {
  return { count: 1000, effectiveCount: 1000, mean, sd, median: mean, ci68, ci95, hdi68: ci68, min: ci95[0], max: ci95[1], map: mean + 0.001 };
}

function ensembleInput(overrides: Partial<SummaryJsonInput> = {}): SummaryJsonInput {
  return {
    title: 'Kestrel layout test',
    model: { label: 'flat_lcdm', dark_energy: 'lambda', curvature: 'flat', radiation: false },
    summary: {
      sampleCount: 1000,
      parameters: [
        { name: 'omega_m', stats: stats(0.3, 0.02, [0.28, 0.32], [0.26, 0.34]) },
        { name: 'mass_step', stats: stats(-0.05, 0.01, [-0.06, -0.04], [-0.07, -0.03]), note: 'sign convention: high-mass hosts brighter' },
        { name: 'age_gyr', stats: stats(13.8, 0.2, [13.6, 14.0], [13.4, 14.2]), derived: true, oneSidedLimit: { side: 'upper', value: 14.2, mass: 0.95 } },
      ],
      correlationNames: ['omega_m', 'mass_step'],
      correlation: Float64Array.of(1, -0.25, -0.25, 1),
    },
    diagnostics: {
      omega_m: { rhat: 1.002, rhatWalkers: 1.01, essBulk: 2500, essTail: 2100, tau: 40, mcseMean: 0.0004 },
      mass_step: { rhat: 1.001, essBulk: 2600, essTail: 2200, tau: null, mcseMean: 0.0002 },
    },
    steps: 3000,
    converged: true,
    nested: null,
    targetEss: 2000,
    maxRhat: 1.01,
    acceptanceMean: 0.31,
    stuckWalkers: 0,
    minimumChainLengthOverTau: 50,
    bestFit: {
      parameters: { omega_m: 0.301, mass_step: -0.049 }, chi_square: 35.5, n_data: 40, n_free: 2, degrees_of_freedom: 38,
      log_likelihood: -17.75, log_posterior: -16.5, abs_mag: -19.3,
    },
    goodness: { chiSquare: 35.5, degreesOfFreedom: 38, reducedChiSquare: 35.5 / 38, pValue: 0.58, flagged: false },
    burnInSteps: 100,
    keptSamples: 185600,
    run: {
      seed: '7', steps: 3000, walkers: 16, ensembles: 4, evaluations: 192000, wall_seconds: 12.5, worker_threads: 2,
      stop_reason: 'converged', version: '0.1.0', inputs: [{ path: 'kestrel.csv', sha256: 'ab' }], configuration: { seed: 7 },
    },
    likelihood: { description: ['Gaussian'], path: 'dense' },
    data: { supernovae: 40 },
    warnings: [{ code: 'prior_edge', parameter: 'age_gyr', message: 'touches its prior edge', numbers: { prior_upper: 14.5 } }],
    ...overrides,
  };
}

describe('summaryJsonDocument', () => {
  it('writes an ensemble run in the schema order, with no sampler or evidence key', () => {
    const document = summaryJsonDocument(ensembleInput());
    expect(Object.keys(document)).toEqual(['schema', 'title', 'model', 'parameters', 'diagnostics', 'correlation', 'fit', 'convergence', 'run', 'likelihood', 'data', 'warnings']);
    expect(document.schema).toBe(SUMMARY_SCHEMA);
    expect(SUMMARY_SCHEMA).toBe('candela-summary-1');
    expect(document.convergence).toEqual({ passed: true, target_ess: 2000, max_rhat: 1.01, acceptance_mean: 0.31, stuck_walkers: 0, minimum_chain_length_over_tau: 50 });
  });

  it('gives each parameter its statistics, MAP, derived flag, one-sided limit and note', () => {
    const { parameters } = summaryJsonDocument(ensembleInput());
    expect(parameters.omega_m).toEqual({
      mean: 0.3, sd: 0.02, median: 0.3, ci68: [0.28, 0.32], ci95: [0.26, 0.34], hdi68: [0.28, 0.32],
      map: 0.301, derived: false, samples: 1000, one_sided_limit: null,
    });
    expect(parameters.mass_step.note).toBe('sign convention: high-mass hosts brighter');
    expect('note' in parameters.omega_m).toBe(false);
    expect(parameters.age_gyr.derived).toBe(true);
    expect(parameters.age_gyr.one_sided_limit).toEqual({ side: 'upper', value: 14.2, mass: 0.95 });
  });

  it('quotes the chain length in autocorrelation times, and null where tau is missing', () => {
    const { diagnostics } = summaryJsonDocument(ensembleInput());
    expect(diagnostics.omega_m).toEqual({ rhat: 1.002, rhat_walkers: 1.01, ess_bulk: 2500, ess_tail: 2100, tau: 40, mcse_mean: 0.0004, chain_length_over_tau: 75 });
    expect(diagnostics.mass_step.chain_length_over_tau).toBeNull();
    expect(diagnostics.mass_step.rhat_walkers).toBeNull();
  });

  it('unpacks the row-major correlation into rows', () => {
    const { correlation } = summaryJsonDocument(ensembleInput());
    expect(correlation).toEqual({ names: ['omega_m', 'mass_step'], matrix: [[1, -0.25], [-0.25, 1]] });
  });

  it('reads the goodness of fit into fit, and gives records without per-term fits one supernova term', () => {
    const { fit } = summaryJsonDocument(ensembleInput());
    expect(fit.chi_square_per_degree_of_freedom).toBeCloseTo(35.5 / 38, 15);
    expect(fit.p_value).toBe(0.58);
    expect(fit.terms).toEqual([{ name: 'supernovae', chi_square: 35.5, n_data: 40, n_free: 2, degrees_of_freedom: 38 }]);
    expect(fit.best_fit_parameters).toEqual({ omega_m: 0.301, mass_step: -0.049 });
    const noGoodness = summaryJsonDocument(ensembleInput({ goodness: null })).fit;
    expect([noGoodness.chi_square_per_degree_of_freedom, noGoodness.p_value]).toEqual([null, null]);
  });

  it('keeps the run facts, with the burn-in and kept samples of the analysis', () => {
    const { run, warnings } = summaryJsonDocument(ensembleInput());
    expect(run).toMatchObject({ seed: '7', steps: 3000, burn_in_steps: 100, samples_kept: 185600, stop_reason: 'converged', version: '0.1.0' });
    expect(warnings).toEqual([{ code: 'prior_edge', parameter: 'age_gyr', message: 'touches its prior edge', numbers: { prior_upper: 14.5 } }]);
  });

  it('writes a nested run with sampler and evidence keys and says the chain checks do not apply', () => {
    const evidence = { log_z: -21.25, log_z_error: 0.125, information_nats: 3.3, iterations: 1900, likelihood_calls: 40000 };
    const document = summaryJsonDocument(ensembleInput({
      diagnostics: {},
      nested: { livePoints: 300, maxUnexploredLnZ: 0.1, stop: 'max_unexplored_ln_z', remainingLogZ: 0.08, effectiveSampleSize: 1200.5, evidence },
      keptSamples: 1429,
    }));
    expect(Object.keys(document)).toEqual(['schema', 'sampler', 'title', 'model', 'parameters', 'diagnostics', 'correlation', 'fit', 'convergence', 'evidence', 'run', 'likelihood', 'data', 'warnings']);
    expect(document.sampler).toEqual({ method: 'nested', live_points: 300, max_unexplored_ln_z: 0.1 });
    expect(document.convergence).toMatchObject({
      applies: false, passed: true, stop: 'max_unexplored_ln_z', max_unexplored_ln_z: 0.1, remaining_log_z: 0.08,
      effective_sample_size_kish: 1200.5, weighted_samples: 1429,
    });
    expect(document.evidence).toEqual(evidence);
    expect(document.evidence).not.toBe(evidence);
    const noEvidence = summaryJsonDocument(ensembleInput({ nested: { livePoints: null, maxUnexploredLnZ: null, stop: null, remainingLogZ: null, effectiveSampleSize: null, evidence: null } }));
    expect('evidence' in noEvidence).toBe(false);
  });
});

describe('summaryJsonText', () => {
  it('writes the document as two-space JSON in its key order, ending in one line break, and reads back equal', () => {
    const document = { ...summaryJsonDocument(ensembleInput()), blinding: { state: 'blinded' } };
    const text = summaryJsonText(document);
    expect(text.startsWith('{\n  "schema": "candela-summary-1",\n  "title": "Kestrel layout test",\n')).toBe(true);
    expect(text.endsWith('\n  "blinding": {\n    "state": "blinded"\n  }\n}\n')).toBe(true);
    expect(JSON.parse(text)).toEqual(JSON.parse(JSON.stringify(document)));
  });
});
