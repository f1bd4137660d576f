// Test helper: a report input for an invented run of the fictional "Lyra Deep Survey"
// (a demo scenario, not a correctness reference), with every kind of figure inlined.
import { bandFigure, hubbleFigure, traceStackFigure, triangleFigure } from '../../../src/output/figures/index.js';
import type { ReportInput } from '../../../src/output/report/index.js';
import { gaussianContours, gaussianMarginals } from '../figures/gaussianPosterior.js';

const spec = { parameters: ['omega_m', 'w0'], means: [0.31, -1.02], sigmas: [0.03, 0.11], correlations: { '0,1': -0.7 } };

export function reportFixture(): ReportInput {
  const grid = Float64Array.from({ length: 30 }, (_, k) => 0.01 * 150 ** (k / 29));
  const median = grid.map((z) => 5 * Math.log10((299792.458 * z * (1 + 0.5 * z)) / 70) + 25);
  const redshift = Float64Array.of(0.02, 0.05, 0.1, 0.3, 0.6, 1.1);
  const ramp = Float64Array.from({ length: 400 }, (_, index) => 0.3 + 0.02 * Math.sin(index / 7));
  return {
    title: 'Lyra Deep Survey <flat wCDM> & friends',
    facts: { seed: 'lyra-2031', steps: 6000, walkers: 32, ensembles: 4, stopReason: 'converged: chains longer than 50 autocorrelation times', wallTimeSeconds: 734.2, version: '0.1.0', model: 'flat wCDM', startedAt: '2031-04-02T09:15:00Z' },
    summary: {
      columns: ['median and 68% interval', '95% interval'],
      rows: [
        { parameter: 'omega_m', cells: ['0.312 +0.031 −0.029', '[0.256, 0.371]'] },
        { parameter: 'w0', cells: ['−1.02 ± 0.11', '[−1.24, −0.81]'] },
        { parameter: 'sigma_int_LYRA', cells: ['0.11 ± 0.01', '[0.09, 0.13]'] },
      ],
      note: 'Medians with equal-tailed intervals; errors rounded by the Particle Data Group rule.',
    },
    diagnostics: {
      rows: [
        { parameter: 'omega_m', rHat: 1.003, ess: 2100, autocorrelationTimeSteps: 48.2 },
        { parameter: 'w0', rHat: 1.012, ess: 380, autocorrelationTimeSteps: 130.4 },
        { parameter: 'sigma_int_LYRA', rHat: Number.NaN, ess: 900, autocorrelationTimeSteps: 60 },
      ],
      chainLengthSteps: 5400,
      rHatMax: 1.01,
      essMin: 400,
      tauMultiple: 50,
      acceptanceFraction: 0.31,
    },
    figures: [
      { title: 'Posterior', caption: 'Filled regions hold 68% and 95% of the posterior.', svg: triangleFigure([{ label: 'Lyra Deep', marginals: gaussianMarginals(spec), contours: gaussianContours(spec) }], spec.parameters), fileName: 'triangle.svg' },
      { title: 'Hubble diagram', svg: hubbleFigure({ redshift, muObsMag: redshift.map((z) => 5 * Math.log10((299792.458 * z * (1 + 0.5 * z)) / 70) + 25), muErrMag: new Float64Array(6).fill(0.12), modelCurve: { z: grid, median, low68: median.map((v) => v - 0.02), high68: median.map((v) => v + 0.02) } }) },
      { title: 'Traces', svg: traceStackFigure([{ parameter: 'omega_m', ensembles: [{ label: 'ensemble 1', series: [ramp] }] }], 100) },
      { title: 'Dark energy', svg: bandFigure({ x: grid, median: grid.map(() => -1), low68: grid.map(() => -1.1), high68: grid.map(() => -0.9), xLabel: 'redshift z', yLabel: 'w(z)' }) },
    ],
    configurationYaml: 'survey: lyra-deep\ndata:\n  table: data-demo/lyra.csv  # <b>not bold</b> & "quoted"\nsampler:\n  walkers: 32\n',
    inputFiles: [
      { path: 'data-demo/lyra.csv', sha256: 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855', sizeBytes: 0, role: 'supernova table' },
      { path: 'data-demo/lyra_sys.cov', sha256: 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad', sizeBytes: 3, role: 'systematic covariance' },
    ],
    warnings: ['3 supernovae below z = 0.01 were cut'],
  };
}
