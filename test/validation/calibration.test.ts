import { describe, expect, it } from 'vitest';
import { createPosterior, createSupernovaTerm, priorQuantile, type Prior } from '../../src/likelihood/index.js';
import { createRandomStream, deriveSeed } from '../../src/math/index.js';
import { generateMockSurvey, type MockTruth } from '../../src/mock/index.js';
import { ONE_SIGMA_MASS, TWO_SIGMA_MASS, sampleStatistics } from '../../src/output/index.js';
import { binomialBand, chiSquareSurvival, chiSquareUniformity, FALSE_ALARM_TAIL, rankHistogram, rankOfTruth } from './support/coverageStatistics.js';
import { keptStepsOverTau, posteriorModel, quickFit, ruleFit, spacedDraws } from './support/quickFit.js';
import { printComparison, type ComparisonRow } from './support/sideBySide.js';
import { mockOptions, mockTermOptions, quietCovariatesDesign } from './support/validationSurveys.js';

/*
 * Simulation-based calibration (Talts, Betancourt, Simpson, Vehtari & Gelman 2018, arXiv:1804.06788):
 * draw (omega_m, w0) from the prior, simulate a survey, fit it, and record the rank of the true value
 * among L posterior draws. If simulation, likelihood and sampler are right, every rank in 0..L is
 * equally likely, and every posterior interval covers the truth at its nominal rate (exactly: the
 * truth is a prior draw, so no independence or Gaussian assumption is involved).
 *
 * Setup: flat wCDM, 200 supernovae uniform in 0.02 < z < 1, light-curve errors with alpha, beta and
 * sigma_int fixed at the truth (so the magnitude covariance is diagonal and fixed: the compressed
 * path), no host-mass step, no lensing or velocity scatter (the likelihood then is the simulator's
 * exact density), abs_mag marginalized analytically with a flat prior. The marginal posterior of
 * (omega_m, w0) does not depend on the true abs_mag (a flat offset prior is translation invariant),
 * so its value is not drawn. Ranks use L = 99 draws (every walker at steps 2 tau apart), in 10 bins
 * of 10 ranks; uniformity is Pearson's chi-square test with 9 degrees of freedom, p > 0.001.
 */
const SUPERNOVAE = 200;
/** Steps per walker of each fit before any extension: burn-in (5 tau; tau ~ 25-60 steps here) plus ~20 tau kept. */
const STEPS_PER_FIT = 1000;
const PARAMETERS = ['omega_m', 'w0'] as const;
const DRAWS_PER_FIT = 99;
const RANK_BINS = 10;
/** Draws are taken every THINNING_TAU_MULTIPLE autocorrelation times (lag-2-tau correlation ~ e^-4 for an AR(1) chain). */
const THINNING_TAU_MULTIPLE = 2;
/** Kept chains span at least this many tau (chains are extended until they do), so that tau, the burn-in and the thinning are trustworthy (common practice: tens of tau). */
const MIN_KEPT_TAU = 20;
const PRIORS: Record<'omega_m' | 'w0', Prior> = {
  omega_m: { kind: 'uniform', min: 0.1, max: 0.5 },
  w0: { kind: 'uniform', min: -1.6, max: -0.4 },
};
const FIXED = { alpha: 0.14, beta: 3.1, sigma_int: 0.1 };

interface CalibrationRecord { truth: [number, number]; ranks: [number, number]; in68: [boolean, boolean]; in95: [boolean, boolean]; keptTau: number; tau: number }

/**
 * The stopping rule of `candela fit` (R-hat across 4 ensembles <= 1.01 and bulk ESS >= target, checked every 100
 * steps, burn-in 2 tau) at a reduced ESS target, so that the calibration also covers where the rule stops.
 */
const RULE = { walkers: 16, ensembles: 4, targetEss: 400, maxRhat: 1.01, checkEvery: 100, maxSteps: 20_000 };

async function calibrateOnce(index: number, steps: number, byRule = false): Promise<CalibrationRecord> {
  const rng = createRandomStream(deriveSeed('calibration', index, 'prior'));
  const omegaMatter = priorQuantile(PRIORS.omega_m, rng.uniform());
  const w0 = priorQuantile(PRIORS.w0, rng.uniform());
  const truth: MockTruth = {
    darkEnergy: 'constant_w', flat: true, omegaMatter, w0, h0KmPerSPerMpc: 70, alpha: FIXED.alpha, beta: FIXED.beta,
    absMagMag: -19.3, massStepMag: 0, massSplitLogMass: 10, sigmaIntMag: FIXED.sigma_int,
  };
  const scatter = { lensingPerRedshift: 0, peculiarVelocityKmPerS: 0 };
  const { table } = generateMockSurvey(mockOptions([quietCovariatesDesign('sbc', SUPERNOVAE, 0.02, 1.0)], truth, deriveSeed('calibration', index, 'survey'), scatter));
  const term = createSupernovaTerm(mockTermOptions(table, { darkEnergy: 'constant_w', flat: true }, { massStep: false, ...scatter, offset: 'marginalize', fixed: FIXED }));
  const posterior = createPosterior({ free: [{ name: 'omega_m', prior: PRIORS.omega_m }, { name: 'w0', prior: PRIORS.w0 }], fixed: FIXED, terms: [term] });
  const sampleStart = (r: Parameters<typeof posterior.samplePrior>[0], out: Float64Array) => posterior.samplePrior(r, out);
  const fit = byRule
    ? await ruleFit(posteriorModel(posterior), posterior.names, sampleStart, { ...RULE, seed: deriveSeed('calibration', index, 'rule-fit') })
    : await quickFit(posteriorModel(posterior), posterior.names, sampleStart, { walkers: 16, ensembles: 2, steps, seed: deriveSeed('calibration', index, 'fit'), minKeptTau: MIN_KEPT_TAU });
  const stride = Math.ceil(THINNING_TAU_MULTIPLE * Math.max(...fit.tauSteps));
  const values = [omegaMatter, w0];
  const ranks = values.map((value, d) => rankOfTruth(spacedDraws(fit, d, DRAWS_PER_FIT, stride), value)) as [number, number];
  const stats = values.map((_, d) => sampleStatistics(fit.draws[d]));
  return {
    truth: [omegaMatter, w0], ranks,
    in68: stats.map((s, d) => values[d] >= s.ci68[0] && values[d] <= s.ci68[1]) as [boolean, boolean],
    in95: stats.map((s, d) => values[d] >= s.ci95[0] && values[d] <= s.ci95[1]) as [boolean, boolean],
    keptTau: keptStepsOverTau(fit), tau: Math.max(...fit.tauSteps),
  };
}

async function calibrate(count: number, byRule = false): Promise<CalibrationRecord[]> {
  const records: CalibrationRecord[] = [];
  for (let index = 0; index < count; index++) records.push(await calibrateOnce(index, STEPS_PER_FIT, byRule));
  return records;
}

/** Prints and checks coverage (and, with `ranks`, rank uniformity) of every parameter. */
function report(title: string, records: CalibrationRecord[], ranks: boolean, minKeptTau = MIN_KEPT_TAU): void {
  const n = records.length;
  const band68 = binomialBand(n, ONE_SIGMA_MASS);
  const band95 = binomialBand(n, TWO_SIGMA_MASS);
  const rows: ComparisonRow[] = [];
  const notes: string[] = [];
  const checks: Array<() => void> = [];
  PARAMETERS.forEach((name, d) => {
    const hits68 = records.filter((r) => r.in68[d]).length;
    const hits95 = records.filter((r) => r.in95[d]).length;
    rows.push({ quantity: `${name}: truth inside 68.27% interval`, measured: `${hits68} / ${n}`, reference: (ONE_SIGMA_MASS * n).toFixed(1), accepted: `[${band68[0]}, ${band68[1]}]`, source: `exact binomial, tails ${FALSE_ALARM_TAIL}` });
    rows.push({ quantity: `${name}: truth inside 95.45% interval`, measured: `${hits95} / ${n}`, reference: (TWO_SIGMA_MASS * n).toFixed(1), accepted: `[${band95[0]}, ${band95[1]}]`, source: `exact binomial, tails ${FALSE_ALARM_TAIL}` });
    checks.push(() => {
      expect(hits68, `${name} 68%`).toBeGreaterThanOrEqual(band68[0]);
      expect(hits68, `${name} 68%`).toBeLessThanOrEqual(band68[1]);
      expect(hits95, `${name} 95%`).toBeGreaterThanOrEqual(band95[0]);
      expect(hits95, `${name} 95%`).toBeLessThanOrEqual(band95[1]);
    });
    const histogram = rankHistogram(records.map((r) => r.ranks[d]), DRAWS_PER_FIT, RANK_BINS);
    const test = chiSquareUniformity(histogram);
    notes.push(`${name} rank histogram (${RANK_BINS} bins of ${(DRAWS_PER_FIT + 1) / RANK_BINS} ranks, ${n / RANK_BINS} expected each): ${histogram.join(' ')}`);
    if (ranks) {
      rows.push({ quantity: `${name}: rank uniformity, Pearson chi-square (${test.degreesOfFreedom} dof)`, measured: `${test.statistic.toFixed(2)}, p = ${test.pValue.toPrecision(3)}`, reference: `${test.degreesOfFreedom} (mean)`, accepted: `p > ${FALSE_ALARM_TAIL}`, source: 'Talts et al. 2018' });
      checks.push(() => expect(test.pValue, `${name} rank uniformity`).toBeGreaterThan(FALSE_ALARM_TAIL));
    }
  });
  const spans = records.map((r) => r.keptTau).sort((a, b) => a - b);
  const taus = records.map((r) => r.tau).sort((a, b) => a - b);
  notes.push(`kept chain / tau: min ${spans[0].toFixed(1)}, median ${spans[Math.floor(n / 2)].toFixed(1)}; tau (steps): median ${taus[Math.floor(n / 2)].toFixed(1)}, max ${taus[n - 1].toFixed(1)}`);
  printComparison(title, rows, notes);
  for (const check of checks) check();
  expect(spans[0], 'shortest kept chain, in tau').toBeGreaterThanOrEqual(minKeptTau);
}

describe('simulation-based calibration helpers', () => {
  it('binomialBand matches exact binomial tails computed by hand', () => {
    // n = 20, p = 1/2: P(X <= 5) = 21700 / 2^20 = 0.0207 < 0.025 <= P(X <= 6) = 0.0577 (by hand), so the 2.5% band is [6, 14].
    expect(binomialBand(20, 0.5, 0.025)).toEqual([6, 14]);
    // n = 10, p = 0.9: P(X <= 7) = 0.0702, P(X <= 6) = 0.0128 (by hand), so with 5% tails the lower bound is 7; P(X >= 10) = 0.349.
    expect(binomialBand(10, 0.9, 0.05)).toEqual([7, 10]);
  });

  it('chiSquareSurvival reproduces the chi-square table (Abramowitz & Stegun 1964, table 26.8, values from memory; tol 2e-5)', () => {
    // 9 degrees of freedom: 16.919 at p = 0.05, 21.666 at p = 0.01, 27.877 at p = 0.001.
    expect(Math.abs(chiSquareSurvival(16.919, 9) - 0.05)).toBeLessThan(2e-5);
    expect(Math.abs(chiSquareSurvival(21.666, 9) - 0.01)).toBeLessThan(2e-5);
    expect(Math.abs(chiSquareSurvival(27.877, 9) - 0.001)).toBeLessThan(2e-5);
  });

  it('chiSquareUniformity sums (observed - expected)^2 / expected over the cells (Pearson 1900; by hand)', () => {
    expect(chiSquareUniformity([10, 10, 10, 10, 10, 10, 10, 10, 10, 10])).toEqual({ statistic: 0, degreesOfFreedom: 9, pValue: 1 });
    // Expected 10 per cell: (6^2 + 6^2) / 10 = 7.2.
    const test = chiSquareUniformity([16, 4, 10, 10, 10, 10, 10, 10, 10, 10]);
    expect(test.statistic).toBeCloseTo(7.2, 12);
    expect(test.pValue).toBeCloseTo(chiSquareSurvival(7.2, 9), 15);
  });

  it('quickFit samples a correlated 2-D Gaussian with its closed-form spread, and spacedDraws picks whole walker slices', async () => {
    // Unit variances, correlation 0.9 (the distribution's parameters). Sample sd: Monte Carlo relative error 1 / sqrt(2 ESS)
    // with ESS = walkers x kept steps / tau > 3000 is at most 1.3%, so 7% is more than 5 standard errors.
    const rho = 0.9;
    const model = { dimension: 2, blobCount: 0, evaluate: (t: Float64Array) => -(t[0] * t[0] - 2 * rho * t[0] * t[1] + t[1] * t[1]) / (2 * (1 - rho * rho)) };
    const fit = await quickFit(model, ['x', 'y'], (rng, out) => { out[0] = 3 * rng.normal(); out[1] = 3 * rng.normal(); }, { walkers: 16, ensembles: 2, steps: 4000, seed: 'gaussian' });
    expect(fit.walkersTotal * (fit.steps - fit.burnInSteps) / Math.max(...fit.tauSteps)).toBeGreaterThan(3000);
    for (const d of [0, 1]) expect(Math.abs(sampleStatistics(fit.draws[d]).sd - 1)).toBeLessThan(0.07);
    const draws = spacedDraws(fit, 0, 40, 10);
    const last = (fit.steps - fit.burnInSteps - 1) * fit.walkersTotal;
    expect(Array.from(draws.subarray(0, 32))).toEqual(Array.from(fit.draws[0].subarray(last, last + 32)));
    expect(draws[32]).toBe(fit.draws[0][last - 10 * fit.walkersTotal]);
  });

  it('rankOfTruth counts the draws below the truth and rankHistogram groups consecutive ranks (Talts et al. 2018, algorithm 1)', () => {
    expect(rankOfTruth(Float64Array.of(0.1, 0.5, 0.9), 0.6)).toBe(2);
    expect(rankOfTruth(Float64Array.of(0.1, 0.5, 0.9), 0)).toBe(0);
    expect(rankHistogram([0, 1, 2, 3, 99, 50], 99, 10)).toEqual([4, 0, 0, 0, 0, 1, 0, 0, 0, 1]);
    expect(() => rankHistogram([0], 98, 10)).toThrow(/equal bins/);
  });
});

describe('simulation-based calibration, fast subset (20 mocks, coverage only)', () => {
  it('covers omega_m and w0 at the 68.27% and 95.45% rates within exact binomial bands', async () => {
    report('SBC fast subset: 20 prior draws, flat wCDM, 200 supernovae', await calibrate(20), false);
  }, 180_000);
});

describe.skipIf(!process.env.CANDELA_VALIDATE)('simulation-based calibration, 200 mocks (CANDELA_VALIDATE=1)', () => {
  it('gives uniform ranks of the true omega_m and w0 (chi-square, 9 dof, p > 0.001) and nominal 68.27% / 95.45% coverage', async () => {
    report('SBC: 200 prior draws, flat wCDM, 200 supernovae', await calibrate(200), true);
  }, 1_200_000);
});

// The same calibration with the fits stopped by candela's own rule (R-hat across the ensembles, bulk ESS, a chain of
// 50 tau whose tau no longer grows), where they stop: a stopping rule that looked at the draws could bias coverage;
// this checks it does not. The report's own kept-chain check asks only 2 tau of it (the rule already asks 50).
describe('simulation-based calibration with the stopping rule of candela fit, fast subset (20 mocks, coverage only)', () => {
  it('covers omega_m and w0 at the 68.27% and 95.45% rates within exact binomial bands', async () => {
    report('SBC fast subset, stopped by the fit rule: 20 prior draws, flat wCDM, 200 supernovae', await calibrate(20, true), false, 2);
  }, 600_000);
});

describe.skipIf(!process.env.CANDELA_VALIDATE)('simulation-based calibration with the stopping rule of candela fit, 200 mocks (CANDELA_VALIDATE=1)', () => {
  it('gives uniform ranks and nominal coverage when every fit stops by the rule', async () => {
    report('SBC, stopped by the fit rule: 200 prior draws, flat wCDM, 200 supernovae', await calibrate(200, true), true, 2);
  }, 2_400_000);
});
