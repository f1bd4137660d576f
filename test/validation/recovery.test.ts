import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../src/config/index.js';
import { createPosterior, createSupernovaTerm, type Prior } from '../../src/likelihood/index.js';
import { deriveSeed } from '../../src/math/index.js';
import { generateMockSurvey, type MockTruth } from '../../src/mock/index.js';
import { sampleStatistics } from '../../src/output/index.js';
import { buildModel } from '../../src/pipeline/buildModel.js';
import { loadSupernovae } from '../../src/pipeline/loadSupernovae.js';
import { keptStepsOverTau, posteriorModel, quickFit, type QuickFit } from './support/quickFit.js';
import { mockOptions, mockTermOptions, quietCovariatesDesign } from './support/validationSurveys.js';

const TRUTH: MockTruth = {
  darkEnergy: 'lambda', flat: true, omegaMatter: 0.3, h0KmPerSPerMpc: 70, alpha: 0.14, beta: 3.1,
  absMagMag: -19.3, massStepMag: 0.08, massSplitLogMass: 10, sigmaIntMag: 0.1,
};
const SCATTER = { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250 };
const PRIORS: Record<string, Prior> = {
  omega_m: { kind: 'uniform', min: 0.05, max: 0.8 },
  alpha: { kind: 'uniform', min: 0, max: 0.4 },
  beta: { kind: 'uniform', min: 1, max: 5 },
  mass_step: { kind: 'uniform', min: -0.3, max: 0.3 },
  sigma_int: { kind: 'log_uniform', min: 0.01, max: 0.5 },
};

function summarize(fit: QuickFit) {
  return fit.names.map((name, d) => ({ name, ...sampleStatistics(fit.draws[d]), tau: fit.tauSteps[d] }));
}

describe('prototype', () => {
  it('noiseless', async () => {
    const t = performance.now();
    const samples = [quietCovariatesDesign('near', 100, 0.015, 0.1), quietCovariatesDesign('far', 200, 0.1, 1.0)];
    const mock = generateMockSurvey({ ...mockOptions(samples, TRUTH, 'noiseless', SCATTER), noiseless: true });
    const fixed = { h0: 70, sigma_int: 0.1 };
    const term = createSupernovaTerm({ ...mockTermOptions(mock.table, { darkEnergy: 'lambda', flat: true }, { massStep: true, ...SCATTER, offset: 'sample', fixed }),
      standardization: { ...mockTermOptions(mock.table, { darkEnergy: 'lambda', flat: true }, { massStep: true, ...SCATTER, offset: 'sample', fixed }).standardization, alphaBetaCovariance: 'frozen', frozenAt: { alpha: 0.14, beta: 3.1 } } });
    const names = ['omega_m', 'alpha', 'beta', 'mass_step', 'abs_mag'];
    const pri = { ...PRIORS, abs_mag: { kind: 'uniform', min: -20, max: -18.5 } as Prior };
    const posterior = createPosterior({ free: names.map((name) => ({ name, prior: pri[name] })), fixed, terms: [term] });
    console.log(term.path, term.bestFitExtras!({ omega_m: 0.3, alpha: 0.14, beta: 3.1, mass_step: 0.08, abs_mag: -19.3, ...fixed }));
    const fit = await quickFit(posteriorModel(posterior), posterior.names, (r, out) => posterior.samplePrior(r, out), { walkers: 16, ensembles: 2, steps: 1200, seed: 'x' });
    const tv = [0.3, 0.14, 3.1, 0.08, -19.3];
    console.log(((performance.now() - t) / 1000).toFixed(1), 's', keptStepsOverTau(fit), fit.burnInSteps, fit.acceptance, JSON.stringify(summarize(fit).map((s, d) => [s.name, (s.mean - tv[d]) / s.sd, (s.mean - tv[d]) / (s.sd * Math.sqrt(s.tau / (fit.walkersTotal * (fit.steps - fit.burnInSteps)))), s.sd, s.tau])));
  });
});
