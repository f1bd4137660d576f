import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { EnsembleSampler, createInProcessEvaluator, resolveEnsembleOptions, type LogProbabilityModel } from '../../../src/sampler/index.js';
import { partTimeMinutes, shellQuote, slurmTimeLimit } from '../../../src/pipeline/cluster/slurmScripts.js';
import { resolveClusterResources } from '../../../src/pipeline/cluster/slurmResources.js';

// Unit checks of the pieces of a cluster plan. The time formats are those
// the Slurm sbatch manual lists for --time ("minutes:seconds",
// "hours:minutes:seconds", "days-hours:minutes:seconds"); POSIX shell
// single-quoting is from the POSIX Shell Command Language, section 2.2.2.

describe('slurmTimeLimit', () => {
  it('writes hours:minutes:seconds below a day and days-hours:minutes:seconds from a day on (Slurm sbatch manual)', () => {
    expect(slurmTimeLimit(43)).toBe('00:43:00');
    expect(slurmTimeLimit(90)).toBe('01:30:00');
    expect(slurmTimeLimit(1440)).toBe('1-00:00:00');
    expect(slurmTimeLimit(3000)).toBe('2-02:00:00');
    // rounded up to whole minutes: a limit is never shorter than asked
    expect(slurmTimeLimit(0.2)).toBe('00:01:00');
  });

  it('grants a part max_minutes plus 10% plus 10 minutes for start-up and outputs', () => {
    expect(partTimeMinutes(30)).toBe(43);
    expect(partTimeMinutes(600)).toBe(670);
  });
});

describe('resolveClusterResources', () => {
  const sampler = { maxMinutes: 30, maxSteps: 5000 };
  const codes = (request: Parameters<typeof resolveClusterResources>[0]) => {
    try {
      resolveClusterResources(request, sampler);
      return [];
    } catch (error) {
      return isCandelaError(error) ? error.issues.map((issue) => `${issue.code} ${issue.path}`) : [String(error)];
    }
  };

  it('fills the defaults from the sampler settings and asks for no account, partition or memory', () => {
    expect(resolveClusterResources({}, sampler)).toEqual({ account: null, queue: null, memory: null, partMinutes: 43, stopWarningSeconds: 600, stepsPerPart: 5000 });
  });

  it('accepts the --mem forms of the Slurm sbatch manual (whole number, optional K, M, G or T)', () => {
    for (const memory of ['4000', '512M', '4G', '1T']) expect(resolveClusterResources({ memory }, sampler).memory).toBe(memory);
  });

  it('reports every bad option at once, each with its option name', () => {
    expect(codes({ account: 'my lab', queue: 'a;b', memory: '4 GB', partMinutes: 0, stepsPerPart: 10 })).toEqual([
      'plan.bad_name --cluster-account', 'plan.bad_name --cluster-queue', 'plan.bad_memory --part-memory', 'plan.bad_minutes --part-minutes', 'plan.bad_steps --steps-per-part',
    ]);
  });

  it('refuses a stop warning that would come before the part starts, or beyond what --signal takes (65535 s, from memory)', () => {
    expect(codes({ partMinutes: 10, stopWarningSeconds: 600 })).toEqual(['plan.bad_warning --stop-warning']);
    expect(codes({ partMinutes: 10, stopWarningSeconds: 599 })).toEqual([]);
    expect(codes({ partMinutes: 5000, stopWarningSeconds: 65536 })).toEqual(['plan.bad_warning --stop-warning']);
  });
});

describe('shellQuote', () => {
  it('leaves safe words alone and single-quotes the rest (POSIX Shell Command Language 2.2.2)', () => {
    expect(shellQuote('/data/run-1/config.yaml')).toBe('/data/run-1/config.yaml');
    expect(shellQuote('my run')).toBe("'my run'");
    expect(shellQuote("it's")).toBe("'it'\\''s'");
    expect(shellQuote('$HOME')).toBe("'$HOME'");
  });
});

describe('EnsembleSampler with ensembleIndices', () => {
  // A two-dimensional standard normal: any target shows the stream bookkeeping; the identity checked is exact.
  const model: LogProbabilityModel = {
    dimension: 2, blobCount: 0,
    evaluate: (theta) => -0.5 * (theta[0] * theta[0] + theta[1] * theta[1]),
  };
  const start = (k: number) => Float64Array.from({ length: 8 }, (_, i) => 0.1 * Math.sin(3 * i + k) + 0.01 * i);

  it('reproduces ensemble k of a full run bit for bit when it holds only ensemble k', async () => {
    const full = await EnsembleSampler.start({ dimension: 2, walkers: 4, ensembles: 3, seed: 'part-check' }, createInProcessEvaluator(model), [start(0), start(1), start(2)]);
    await full.advance(60);
    const alone = await EnsembleSampler.start({ dimension: 2, walkers: 4, ensembleIndices: [2], seed: 'part-check' }, createInProcessEvaluator(model), [start(2)]);
    await alone.advance(60);
    expect(alone.options.ensembles).toBe(1);
    expect(Array.from(alone.chain(0).positions)).toEqual(Array.from(full.chain(2).positions));
    expect(Array.from(alone.chain(0).positions)).not.toEqual(Array.from(full.chain(0).positions.subarray(0, 60 * 8)));
  });

  it('refuses repeated, negative or miscounted ensemble indices', () => {
    for (const ensembleIndices of [[1, 1], [-1], [0.5]]) {
      expect(() => resolveEnsembleOptions({ dimension: 2, walkers: 4, seed: '1', ensembleIndices })).toThrow();
    }
    try {
      resolveEnsembleOptions({ dimension: 2, walkers: 4, ensembles: 3, seed: '1', ensembleIndices: [0, 1] });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].path).toBe('ensembleIndices');
    }
  });
});
