import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { createRandomStream } from '../../src/math/index.js';
import { createPosterior, priorContains, priorLogDensity, priorQuantile, type LikelihoodTerm, type Prior } from '../../src/likelihood/index.js';

const omegaPrior: Prior = { kind: 'uniform', min: 0, max: 1 };
const h0Prior: Prior = { kind: 'gaussian', mean: 73, sd: 1 };

/** A term that counts its calls: a Gaussian "measurement" omega_m = 0.3 +- 0.02 that also reads fixed w0. */
function countingTerm(): LikelihoodTerm & { calls: number; seen: Record<string, number>[] } {
  const term = {
    name: 'toy', requires: ['omega_m', 'w0'], dataCount: 3, calls: 0, seen: [] as Record<string, number>[],
    logLikelihood(p: Record<string, number>) {
      term.calls++;
      term.seen.push({ ...p });
      return p.omega_m > 0.9 ? NaN : -0.5 * ((p.omega_m - 0.3) / 0.02) ** 2;
    },
    rejectionReason: () => null,
  };
  return term;
}

describe('createPosterior', () => {
  it('adds the log prior and the terms, passing free and fixed values by name', () => {
    const term = countingTerm();
    const posterior = createPosterior({ free: [{ name: 'omega_m', prior: omegaPrior }, { name: 'h0', prior: h0Prior }], fixed: { w0: -1 }, terms: [term] });
    expect(posterior.names).toEqual(['omega_m', 'h0']);
    expect(posterior.dimension).toBe(2);
    expect(posterior.dataCount).toBe(3);
    const theta = Float64Array.of(0.32, 74);
    const expectedPrior = 0 + priorLogDensity(h0Prior, 74); // uniform on [0,1]: ln 1 = 0
    const out = { logPrior: 0, logLikelihood: 0 };
    const value = posterior.evaluate(theta, out);
    expect(out.logPrior).toBeCloseTo(expectedPrior, 14);
    expect(out.logLikelihood).toBeCloseTo(-0.5, 14); // ((0.32-0.3)/0.02)^2 = 1
    expect(value).toBeCloseTo(expectedPrior - 0.5, 14);
    expect(posterior.logPosterior(theta)).toBe(value);
    expect(term.seen.at(-1)).toEqual({ w0: -1, omega_m: 0.32, h0: 74 });
    expect(posterior.values(theta)).toEqual({ w0: -1, omega_m: 0.32, h0: 74 });
  });
  it('rejects points outside the prior support without calling the likelihood', () => {
    const term = countingTerm();
    const posterior = createPosterior({ free: [{ name: 'omega_m', prior: omegaPrior }], fixed: { w0: -1 }, terms: [term] });
    expect(posterior.logPosterior(Float64Array.of(1.2))).toBe(-Infinity);
    expect(term.calls).toBe(0);
    expect(posterior.rejectionReason(Float64Array.of(1.2))).toMatch(/omega_m = 1.2 is outside its uniform prior/);
    expect(posterior.rejectionReason(Float64Array.of(0.3))).toBeNull();
  });
  it('turns a NaN from a term into -Infinity with a reason', () => {
    const posterior = createPosterior({ free: [{ name: 'omega_m', prior: omegaPrior }], fixed: { w0: -1 }, terms: [countingTerm()] });
    expect(posterior.logLikelihood(Float64Array.of(0.95))).toBe(-Infinity);
    expect(posterior.logPosterior(Float64Array.of(0.95))).toBe(-Infinity);
    expect(posterior.rejectionReason(Float64Array.of(0.95))).toMatch(/toy returned NaN/);
  });
  it('throws a CandelaError naming a required parameter that is neither free nor fixed, and its term', () => {
    try {
      createPosterior({ free: [{ name: 'omega_m', prior: omegaPrior }], fixed: {}, terms: [countingTerm()] });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error)).toBe(true);
      if (!isCandelaError(error)) return;
      expect(error.issues).toHaveLength(1);
      expect(error.issues[0].code).toBe('posterior.missing_parameter');
      expect(error.issues[0].message).toContain('toy');
      expect(error.issues[0].message).toContain('w0');
    }
  });
  it('throws on invalid priors, duplicates and free-and-fixed names, listing every issue', () => {
    try {
      createPosterior({
        free: [{ name: 'omega_m', prior: { kind: 'uniform', min: 1, max: 0 } }, { name: 'omega_m', prior: omegaPrior }, { name: 'w0', prior: h0Prior }],
        fixed: { w0: -1 }, terms: [],
      });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues.map((i) => i.code).sort()).toEqual(['posterior.duplicate_parameter', 'posterior.free_and_fixed', 'prior.empty_interval']);
    }
  });
  it('maps the unit cube through the prior quantiles and draws inside the support', () => {
    const posterior = createPosterior({ free: [{ name: 'omega_m', prior: omegaPrior }, { name: 'h0', prior: h0Prior }], fixed: { w0: -1 }, terms: [countingTerm()] });
    const out = new Float64Array(2);
    posterior.priorTransform(Float64Array.of(0.25, 0.975), out);
    expect(out[0]).toBe(0.25);
    expect(out[1]).toBeCloseTo(priorQuantile(h0Prior, 0.975), 14);
    expect(out[1]).toBeCloseTo(73 + 1.959963984540054, 12); // normal 97.5% point (scipy.stats.norm.ppf)
    const rng = createRandomStream('posterior-draws');
    for (let i = 0; i < 100; i++) {
      posterior.samplePrior(rng, out);
      expect(priorContains(omegaPrior, out[0])).toBe(true);
      expect(Number.isFinite(posterior.logPrior(out))).toBe(true);
    }
  });
});
