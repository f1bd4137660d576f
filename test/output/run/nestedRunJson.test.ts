import { describe, expect, it } from 'vitest';
import { nestedRunJson, runJsonText, type NestedRunJsonFacts } from '../../../src/output/index.js';

// run.json's nested-sampling sections are candela's own layout (README,
// "sampler.method: nested"); the numbers are made up, no sampling is checked.

const facts: NestedRunJsonFacts = {
  seed: '20180301', storedSamples: 2196, likelihoodCalls: 9876, wallSeconds: 1.30649, evidenceSettled: true,
  targetEss: 2000, maxRhat: 1.01, livePoints: 300, maxUnexploredLnZ: 0.1, maxIterations: 100000, enlargement: 1.25,
  remainingLogZ: 0.0987, effectiveSampleSize: 1429.5, logZ: -27.125, logZError: 0.105, informationNats: 3.3, iterations: 1896,
};

describe('nestedRunJson', () => {
  it('writes run, sampler and evidence in that order, the chain layout as one walker of one ensemble without burn-in', () => {
    const sections = nestedRunJson(facts);
    expect(Object.keys(sections)).toEqual(['run', 'sampler', 'evidence']);
    expect(sections.run).toEqual({
      seed: '20180301', steps: 2196, burn_in_steps: 0, walkers: 1, ensembles: 1, evaluations: 9876,
      wall_seconds: 1.306, worker_threads: 1, stop_reason: 'converged', target_ess: 2000, max_rhat: 1.01,
    });
    expect(sections.sampler).toEqual({
      method: 'nested', live_points: 300, max_unexplored_ln_z: 0.1, max_iterations: 100000, enlargement: 1.25,
      stop: 'max_unexplored_ln_z', remaining_log_z: 0.0987, effective_sample_size: 1429.5,
    });
    expect(sections.evidence).toEqual({ log_z: -27.125, log_z_error: 0.105, information_nats: 3.3, iterations: 1896, likelihood_calls: 9876 });
  });

  it('says max_steps and max_iterations when the iteration cap stopped the run', () => {
    const sections = nestedRunJson({ ...facts, evidenceSettled: false });
    expect([sections.run.stop_reason, sections.sampler.stop]).toEqual(['max_steps', 'max_iterations']);
  });

  it('rounds the wall time to the millisecond (2.0004 s is 2 s, 0.0126 s is 0.013 s)', () => {
    expect(nestedRunJson({ ...facts, wallSeconds: 2.0004 }).run.wall_seconds).toBe(2);
    expect(nestedRunJson({ ...facts, wallSeconds: 0.0126 }).run.wall_seconds).toBe(0.013);
  });

  it('reads back from run.json text unchanged', () => {
    const sections = nestedRunJson(facts);
    expect(JSON.parse(runJsonText(sections))).toEqual(sections);
  });
});
