import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { partTimeMinutes, resolveClusterResources } from '../../../src/pipeline/cluster/slurmResources.js';

describe('partTimeMinutes', () => {
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
