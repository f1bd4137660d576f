// Coverage of the systematic budget's Monte Carlo errors (CANDELA_VALIDATE=1): 200 independent sets of
// draws of the linear Gaussian mock of test/math/reweighting/systematicBudget.test.ts, each budget compared
// with the closed-form generalized least-squares answer (Aitken 1935). If the reported errors are right,
// |estimate - truth| / error is standard normal: 95.45% of the 200 x 12 comparisons within 2 errors.
import { describe, expect, it } from 'vitest';
import { createRandomStream, quadratureDifference, systematicBudget } from '../../src/math/index.js';
import {
  covarianceWithModes, drawGaussian, generalizedLeastSquares, logLikelihoodAtDraws, type LinearGaussianModel,
} from '../math/reweighting/linearGaussianModel.js';

const N = 40;
const DRAWS = 2000;
const REPEATS = 200;

describe.skipIf(!process.env.CANDELA_VALIDATE)('systematic budget: Monte Carlo error coverage on 200 draw sets (CANDELA_VALIDATE=1)', () => {
  it('puts the closed-form shifts and contributions within 2 reported errors about 95% of the time', () => {
    const random = createRandomStream('budget-coverage-data');
    const z = Float64Array.from({ length: N }, (_, i) => 0.02 + i / (N - 1));
    const design = new Float64Array(N * 2);
    for (let i = 0; i < N; i++) { design[2 * i] = 1; design[2 * i + 1] = z[i]; }
    const diagonal = new Float64Array(N).fill(0.1 ** 2);
    const modes = [Float64Array.from(z, (zi) => (zi < 0.4 ? 0.05 : 0)), Float64Array.from(z, (zi) => 0.06 * zi), Float64Array.from(z, (zi) => (zi > 0.7 ? 0.04 : 0))];
    const data = Float64Array.from(z, (zi, i) => 1 + 2 * zi + modes[0][i] + 0.1 * random.normal());
    const model: LinearGaussianModel = { n: N, p: 2, design, data };
    const all = generalizedLeastSquares(model, covarianceWithModes(diagonal, modes));
    const without = modes.map((_, k) => generalizedLeastSquares(model, covarianceWithModes(diagonal, modes.filter((__, m) => m !== k))));
    const sd = (covariance: Float64Array, j: number) => Math.sqrt(covariance[3 * j]);
    const pulls: number[] = [];
    for (let repeat = 0; repeat < REPEATS; repeat++) {
      const draws = drawGaussian(all.mean, all.covariance, DRAWS, `budget-coverage-${repeat}`);
      const lnL = (kept: number[]) => logLikelihoodAtDraws(model, covarianceWithModes(diagonal, kept.map((k) => modes[k])), draws);
      const budget = systematicBudget({
        draws, parameterNames: ['a', 'b'], allLogLikelihood: lnL([0, 1, 2]), statisticalLogLikelihood: lnL([]),
        systematics: modes.map((_, k) => ({ name: `m${k}`, withoutLogLikelihood: lnL([0, 1, 2].filter((m) => m !== k)), aloneLogLikelihood: lnL([k]) })),
        minEffectiveCount: 100,
      });
      budget.systematics.forEach((entry, k) => {
        for (let j = 0; j < 2; j++) {
          const shift = entry.without.parameters[j];
          pulls.push((shift.shift - (without[k].mean[j] - all.mean[j])) / shift.shiftMcError);
          const truth = quadratureDifference(sd(all.covariance, j), sd(without[k].covariance, j));
          pulls.push((entry.contribution[j].reweighted - truth) / entry.contribution[j].mcError);
        }
      });
    }
    const within = pulls.filter((pull) => Math.abs(pull) <= 2).length / pulls.length;
    // Binomial standard error of a 95.45% fraction over 2,400 comparisons (not independent across one draw set): 0.4%;
    // allow 4 of them plus 2% for the first-order error formulas.
    expect(within).toBeGreaterThan(0.9545 - 4 * 0.0043 - 0.02);
    expect(within).toBeLessThan(0.9545 + 4 * 0.0043 + 0.02);
  }, 600_000);
});
