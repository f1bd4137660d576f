// A small budget table for the writer tests: two parameters, three systematics, one flagged.
import type { BudgetTable } from '../../../src/output/budget/budgetTable.js';

export function budgetFixture(): BudgetTable {
  return {
    title: 'Kestrel demo survey', model: 'flat_w0wa',
    method: 'importance reweighting of one set of chains (stat + all), Gaussian linear response as a cross-check',
    parameters: ['w0', 'wa'], drawCount: 4000, minEffectiveCount: 200,
    allMean: [-0.95, 0.2], allSd: [0.17, 0.9],
    statisticalSd: [0.15, 0.8], statisticalEffectiveCount: 1800, statisticalReliable: true,
    totalSystematic: [0.08, 0.41],
    rows: [
      {
        name: 'calibration.nearby', effectiveCountWithout: 3500, effectiveCountAlone: 2500, reliable: true,
        shift: [0.0123, -0.05], shiftMcError: [0.002, 0.01], contribution: [0.05, 0.3], contributionMcError: [0.004, 0.02], aloneContribution: [0.04, 0.25], aloneContributionMcError: [0.005, 0.02],
        linearShift: [0.012, -0.049], linearContribution: [0.051, 0.29], fullShift: [0.013, -0.06], fullContribution: [0.052, 0.31],
      },
      {
        name: 'drift', effectiveCountWithout: 150, effectiveCountAlone: 900, reliable: false,
        shift: [-0.031, 0.2], shiftMcError: [0.004, 0.03], contribution: [0.06, 0.2], contributionMcError: [0.01, 0.03], aloneContribution: [0.055, 0.19], aloneContributionMcError: [0.01, 0.03],
        linearShift: [-0.03, 0.21], linearContribution: [0.06, 0.2], fullShift: null, fullContribution: null,
      },
      {
        name: 'host_mass', effectiveCountWithout: 3900, effectiveCountAlone: 3000, reliable: true,
        shift: [0.0004, 0.001], shiftMcError: [0.0008, 0.004], contribution: [-0.003, 0.01], contributionMcError: [0.01, 0.05], aloneContribution: [0.002, 0.012], aloneContributionMcError: [0.01, 0.05],
        linearShift: [null, null] as unknown as number[], linearContribution: [null, null] as unknown as number[], fullShift: null, fullContribution: null,
      },
    ],
  };
}
