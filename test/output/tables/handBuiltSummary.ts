import type { ParameterSummary, RunSummary, SampleStatistics } from '../../../src/output/index.js';

// A fixed, hand-written summary for the golden files of the tables. The numbers are invented (a fictional
// w0-wa fit of a made-up survey); they test the layout and the rounding, not any physics.
function stats(median: number, low68: number, high68: number, low95: number, high95: number, mean: number, sd: number, map: number, hdi: [number, number]): SampleStatistics {
  return { count: 48000, effectiveCount: 48000, mean, sd, median, ci68: [low68, high68], ci95: [low95, high95], hdi68: hdi, min: low95 - 3 * sd, max: high95 + 3 * sd, map };
}

const parameters: ParameterSummary[] = [
  { name: 'omega_m', stats: stats(0.2981, 0.2767, 0.3200, 0.2551, 0.3421, 0.2984, 0.0217, 0.2969, [0.2770, 0.3202]), diagnostics: { rHat: 1.0021, essBulk: 4120.4, essTail: 3580.2 } },
  { name: 'w0', stats: stats(-0.912, -1.034, -0.801, -1.171, -0.702, -0.918, 0.1163, -0.905, [-1.029, -0.797]), diagnostics: { rHat: 1.0043, essBulk: 2810, essTail: 2377 } },
  { name: 'wa', stats: stats(-0.48, -1.27, 0.21, -2.31, 0.67, -0.55, 0.745, -0.31, [-1.18, 0.28]), diagnostics: { rHat: 1.0124, essBulk: 388, essTail: 512 } },
  { name: 'h0', stats: stats(70.04, 68.80, 71.35, 67.51, 72.59, 70.06, 1.274, 70.11, [68.82, 71.36]) },
  { name: 'alpha', stats: stats(0.1412, 0.1347, 0.1479, 0.1281, 0.1546, 0.1413, 0.00661, 0.1409, [0.1346, 0.1478]), diagnostics: { rHat: 1.0008, essBulk: 5020, essTail: 4460 } },
  { name: 'beta', stats: stats(3.102, 3.021, 3.184, 2.941, 3.267, 3.103, 0.0815, 3.099, [3.020, 3.183]), diagnostics: { rHat: 1.0011, essBulk: 4870, essTail: 4120 } },
  { name: 'mass_step', stats: stats(-0.0612, -0.0841, -0.0385, -0.1069, -0.0157, -0.0613, 0.0228, -0.0598, [-0.0838, -0.0383]), diagnostics: { rHat: 1.0009, essBulk: 4400, essTail: 3950 } },
  { name: 'sigma_int_LOWZ', stats: stats(0.1093, 0.0951, 0.1247, 0.0822, 0.1411, 0.1098, 0.0149, 0.1075, [0.0938, 0.1231]), diagnostics: { rHat: 1.0015, essBulk: 3300, essTail: 2900 } },
  { name: 'age_gyr', stats: stats(13.62, 13.31, 13.95, 13.01, 14.29, 13.63, 0.3214, 13.58, [13.30, 13.94]), derived: true },
];

export const HAND_BUILT_SUMMARY: RunSummary = {
  title: 'Orrery Deep Field, w0-wa (demo)',
  sampleCount: 48000,
  parameters,
  correlationNames: ['omega_m', 'w0', 'wa'],
  correlation: Float64Array.of(1, 0.513, -0.782, 0.513, 1, -0.894, -0.782, -0.894, 1),
  maxLogPosterior: -512.37,
};
