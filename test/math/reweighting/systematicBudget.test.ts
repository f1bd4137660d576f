// The budget on a mock whose systematic shifts are known by construction: a straight
// line mu = a + b z measured at 60 redshifts with statistical errors and three
// systematic modes, one of them added to the data with a known amplitude. The
// posterior of every variant is the generalized least-squares solution (Aitken 1935),
// so each shift and each error contribution is known in closed form; the draws are
// independent draws of the all-systematics posterior (fixed seed).
import { describe, expect, it } from 'vitest';
import { createRandomStream } from '../../../src/math/index.js';
import { quadratureDifference } from '../../../src/math/reweighting/quadratureDifference.js';
import { systematicBudget } from '../../../src/math/reweighting/systematicBudget.js';
import {
  covarianceWithModes, drawGaussian, generalizedLeastSquares, logLikelihoodAtDraws, type LinearGaussianModel,
} from './linearGaussianModel.js';

const N = 60;
const DRAWS = 20_000;

function buildMock() {
  const random = createRandomStream('budget-mock');
  const z = Float64Array.from({ length: N }, (_, i) => 0.02 + (1.2 * i) / (N - 1));
  const design = new Float64Array(N * 2);
  for (let i = 0; i < N; i++) {
    design[i * 2] = 1;
    design[i * 2 + 1] = z[i];
  }
  const diagonal = new Float64Array(N).fill(0.12 ** 2);
  const modes = {
    calibration_low: Float64Array.from(z, (zi) => (zi < 0.3 ? 0.04 : 0)),
    drift: Float64Array.from(z, (zi) => 0.05 * zi),
    tiny: Float64Array.from(z, (zi) => (zi > 1 ? 0.002 : 0)),
  };
  // The data: truth a = 1, b = 2, plus 1.5 sigma of the low-redshift calibration mode, plus noise.
  const data = Float64Array.from(z, (zi, i) => 1 + 2 * zi + 1.5 * modes.calibration_low[i] + 0.12 * random.normal());
  const model: LinearGaussianModel = { n: N, p: 2, design, data };
  return { model, diagonal, modes };
}

describe('systematicBudget on a linear Gaussian mock', () => {
  const { model, diagonal, modes } = buildMock();
  const names = Object.keys(modes) as Array<keyof typeof modes>;
  const allCovariance = covarianceWithModes(diagonal, Object.values(modes));
  const all = generalizedLeastSquares(model, allCovariance);
  const draws = drawGaussian(all.mean, all.covariance, DRAWS, 'budget-draws');
  const logLikelihood = (kept: Array<keyof typeof modes>) => logLikelihoodAtDraws(model, covarianceWithModes(diagonal, kept.map((k) => modes[k])), draws);
  const budget = systematicBudget({
    draws, parameterNames: ['a', 'b'],
    allLogLikelihood: logLikelihood(names), statisticalLogLikelihood: logLikelihood([]),
    systematics: names.map((name) => ({ name, withoutLogLikelihood: logLikelihood(names.filter((k) => k !== name)), aloneLogLikelihood: logLikelihood([name]) })),
    minEffectiveCount: 500,
  });
  const exact = (kept: Array<keyof typeof modes>) => generalizedLeastSquares(model, covarianceWithModes(diagonal, kept.map((k) => modes[k])));
  const sd = (posterior: { covariance: Float64Array }, j: number) => Math.sqrt(posterior.covariance[j * 2 + j]);

  it('recovers the shift of each mean when each systematic is removed, within 4 Monte Carlo errors', () => {
    names.forEach((name, k) => {
      const without = exact(names.filter((other) => other !== name));
      for (let j = 0; j < 2; j++) {
        const estimate = budget.systematics[k].without.parameters[j];
        // The truth is the difference of the two exact posterior means: the errors of the weighted and the
        // plain mean of the same draws largely cancel, which the delta-method error accounts for.
        const truth = without.mean[j] - all.mean[j];
        expect(Math.abs(estimate.shift - truth), `${name} parameter ${j}`).toBeLessThan(4 * estimate.shiftMcError);
      }
    });
  });

  it('recovers each error contribution sqrt(sd_all^2 - sd_without^2) within 4 of its Monte Carlo errors', () => {
    names.forEach((name, k) => {
      const without = exact(names.filter((other) => other !== name));
      const entry = budget.systematics[k];
      for (let j = 0; j < 2; j++) {
        const truth = quadratureDifference(sd(all, j), sd(without, j));
        // sd estimates have relative errors 1/sqrt(2 n) (Gaussian draws, common practice), n the (effective) count;
        // the error of c = sqrt(a^2 - b^2) is (a da + b db) / c at most (errors of a and b added, not combined).
        const a = budget.allSd[j];
        const b = entry.without.parameters[j].sd;
        const mcError = (a * a / Math.sqrt(2 * DRAWS) + b * b / Math.sqrt(2 * entry.without.effectiveCount)) / Math.max(Math.abs(truth), 1e-3 * a);
        expect(Math.abs(entry.contribution[j].reweighted - truth), `${name} parameter ${j}`).toBeLessThan(4 * mcError);
      }
    });
  });

  it('recovers each contribution alone sqrt(sd_stat+k^2 - sd_stat^2) and the total, within 4 Monte Carlo errors', () => {
    const statistical = exact([]);
    names.forEach((name, k) => {
      const alone = exact([name]);
      const entry = budget.systematics[k];
      for (let j = 0; j < 2; j++) {
        const truth = quadratureDifference(sd(alone, j), sd(statistical, j));
        const a = entry.alone.parameters[j].sd;
        const b = budget.statistical.parameters[j].sd;
        const mcError = (a * a / Math.sqrt(2 * entry.alone.effectiveCount) + b * b / Math.sqrt(2 * budget.statistical.effectiveCount)) / Math.max(Math.abs(truth), 1e-3 * a);
        expect(Math.abs(entry.aloneContribution[j].reweighted - truth), `${name} parameter ${j}`).toBeLessThan(4 * mcError);
      }
    });
  });

  it('reports a Monte Carlo error on each contribution within which the closed form lies (4 errors)', () => {
    names.forEach((name, k) => {
      const without = exact(names.filter((other) => other !== name));
      for (let j = 0; j < 2; j++) {
        const entry = budget.systematics[k].contribution[j];
        const truth = quadratureDifference(sd(all, j), sd(without, j));
        expect(Math.abs(entry.reweighted - truth), `${name} parameter ${j}`).toBeLessThan(4 * entry.mcError);
      }
    });
  });

  it('predicts the same shifts by the Gaussian linear response, within the Monte Carlo error of the draws\' mean', () => {
    names.forEach((name, k) => {
      const without = exact(names.filter((other) => other !== name));
      for (let j = 0; j < 2; j++) {
        const linear = budget.systematics[k].without.parameters[j].linearShift;
        expect(linear).not.toBeNull();
        // Exact for this model up to the draws' covariance: relative error 1/sqrt(2 n) on a shift of any size,
        // plus the draws' mean error sd / sqrt(n) (the shift is measured from it).
        const truth = without.mean[j] - budget.allMean[j];
        const tolerance = 4 * (Math.abs(truth) * Math.sqrt(2 / DRAWS) + sd(all, j) / Math.sqrt(DRAWS));
        expect(Math.abs((linear as number) - truth), `${name} parameter ${j}`).toBeLessThan(tolerance);
      }
    });
  });

  it('finds the mode added to the data: removing it moves the intercept by more than 5 of its Monte Carlo errors', () => {
    const entry = budget.systematics[names.indexOf('calibration_low')].without.parameters[0];
    expect(Math.abs(entry.shift)).toBeGreaterThan(5 * entry.shiftMcError);
  });

  it('flags a variant whose weights are worth fewer draws than the threshold', () => {
    const strict = systematicBudget({
      draws, parameterNames: ['a', 'b'], allLogLikelihood: logLikelihood(names), statisticalLogLikelihood: logLikelihood([]),
      systematics: [], minEffectiveCount: DRAWS + 1,
    });
    expect(strict.statistical.reliable).toBe(false);
    expect(budget.statistical.reliable).toBe(true);
  });
});
