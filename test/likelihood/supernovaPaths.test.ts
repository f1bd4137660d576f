import { describe, expect, it } from 'vitest';
import type { DarkEnergyLaw } from '../../src/cosmology/index.js';
import type { CovarianceMatrix } from '../../src/data/index.js';
import { createRandomStream } from '../../src/math/index.js';
import { createSupernovaTerm, type SupernovaTermOptions } from '../../src/likelihood/index.js';
import { expectSamePaths, options, uniform, type Draw } from './pathHelpers.js';
import { readPantheonBinned, readPantheonBinnedSystematics } from './pantheonBinned.js';
import { syntheticSample } from './syntheticSample.js';

describe('supernova term paths on the Pantheon 2018 binned data (Scolnic et al. 2018; 40 bins, stat + sys)', () => {
  const table = readPantheonBinned();
  const systematic = readPantheonBinnedSystematics();
  const models: [string, Partial<SupernovaTermOptions> & { darkEnergy?: DarkEnergyLaw; flat?: boolean }, Draw][] = [
    ['flat LambdaCDM', {}, (rng) => ({ omega_m: uniform(rng, 0.02, 0.98) })],
    ['curved LambdaCDM', { flat: false }, (rng) => ({ omega_m: uniform(rng, 0.05, 0.6), omega_de: uniform(rng, 0.3, 1.0) })],
    ['flat wCDM', { darkEnergy: 'constant_w' }, (rng) => ({ omega_m: uniform(rng, 0.1, 0.5), w0: uniform(rng, -2, -0.4) })],
    ['flat w0waCDM', { darkEnergy: 'cpl' }, (rng) => ({ omega_m: uniform(rng, 0.1, 0.5), w0: uniform(rng, -1.5, -0.5), wa: uniform(rng, -2, 1) })],
  ];
  for (const [label, extra, draw] of models) {
    it(`compressed equals general for ${label}, offset marginalized and sampled`, () => {
      for (const offset of ['marginalize', 'sample'] as const) {
        const sampled: Draw = offset === 'sample' ? (rng) => ({ ...draw(rng), abs_mag: uniform(rng, -19.6, -19.1), h0: uniform(rng, 60, 80) }) : draw;
        const compressed = createSupernovaTerm(options(table, [systematic], { ...extra, offset, fastPath: 'compressed' }));
        const general = createSupernovaTerm(options(table, [systematic], { ...extra, offset, fastPath: 'general' }));
        expect(compressed.path).toBe('compressed');
        expectSamePaths(compressed, general, sampled, createRandomStream(`pantheon-${label}-${offset}`), 12);
      }
    });
  }
  it('diagonal equals general for the statistical errors alone, with a sampled intrinsic scatter (ln det C varies)', () => {
    const extra = { standardization: { ...options(table, []).standardization, intrinsicScatter: 'global' as const } };
    const diagonal = createSupernovaTerm(options(table, [], { ...extra, fastPath: 'diagonal' }));
    const general = createSupernovaTerm(options(table, [], { ...extra, fastPath: 'general' }));
    expect(diagonal.path).toBe('diagonal');
    expect(createSupernovaTerm(options(table, [], extra)).path).toBe('diagonal'); // auto: diagonal C that varies
    expectSamePaths(diagonal, general, (rng) => ({ omega_m: uniform(rng, 0.05, 0.9), sigma_int: uniform(rng, 0, 0.15) }), createRandomStream('pantheon-diagonal'), 12);
  });
  it('compressed equals general far outside the reference box (exact evaluation takes over when the Chebyshev tail grows)', () => {
    for (const [extra, points] of [
      [{ darkEnergy: 'cpl' as const }, [[0.3, -3, -5], [0.3, -0.2, 2], [0.01, -1, 0], [0.5, -4, 4], [0.05, 0.3, -3]]],
      [{ flat: false }, [[0, 0], [2, 0], [0, 1], [1.5, 2.5], [3, 1]]],
    ] as const) {
      const compressed = createSupernovaTerm(options(table, [systematic], { ...extra, fastPath: 'compressed' }));
      const general = createSupernovaTerm(options(table, [systematic], { ...extra, fastPath: 'general' }));
      for (const q of points) {
        const p: Record<string, number> = q.length === 3 ? { omega_m: q[0], w0: q[1], wa: q[2] } : { omega_m: q[0], omega_de: q[1] };
        expect(Math.abs(compressed.bestFitExtras!(p).chi_square - general.bestFitExtras!(p).chi_square)).toBeLessThanOrEqual(1e-6);
      }
      expect(compressed.describe().join(' ')).toMatch(/exact evaluations when the top Chebyshev coefficients exceed/);
    }
    const noBigBang = { omega_m: 0.05, omega_de: 1.3 };
    const curved = createSupernovaTerm(options(table, [systematic], { flat: false, fastPath: 'compressed' }));
    expect(curved.logLikelihood(noBigBang)).toBe(-Infinity);
    expect(curved.bestFitExtras!(noBigBang)).toEqual({});
    expect(() => curved.bestFitOffset(noBigBang)).toThrow(/no Big Bang/);
  });
  it('auto picks the compressed path for the fixed dense covariance', () => {
    expect(createSupernovaTerm(options(table, [systematic])).path).toBe('compressed');
  });
});

describe('supernova term paths on a synthetic 2,000-supernova sample with a dense covariance', () => {
  const { table, systematic } = syntheticSample(2000, 'paths-2000');
  const draw: Draw = (rng) => ({
    omega_m: uniform(rng, 0.1, 0.6), w0: uniform(rng, -1.6, -0.5), wa: uniform(rng, -1.5, 0.8),
    alpha: uniform(rng, 0.1, 0.2), beta: uniform(rng, 2.6, 3.6), mass_step: uniform(rng, -0.1, 0.1),
  });
  it('compressed equals general with light curves, mass step and a frozen alpha/beta covariance (w0waCDM)', () => {
    const frozen = { ...options(table, []).standardization, alphaBetaCovariance: 'frozen' as const, frozenAt: { alpha: 0.14, beta: 3.1 } };
    const base = options(table, [systematic], { darkEnergy: 'cpl', standardization: frozen });
    const compressed = createSupernovaTerm({ ...base, fastPath: 'auto' });
    const general = createSupernovaTerm({ ...base, fastPath: 'general' });
    expect(compressed.path).toBe('compressed');
    expect(compressed.warnings.join(' ')).toMatch(/frozen at alpha = 0.14, beta = 3.1/);
    expectSamePaths(compressed, general, draw, createRandomStream('synthetic-compressed'), 6);
    expect(general.describe().join('\n')).toMatch(/factorizations so far: 1\b/); // fixed covariance: factorized once
  }, 120_000);
  // The diagonal path against the general one at N = 2,000 (one more N^3/3 factorization) runs
  // with CANDELA_VALIDATE=1 in test/validation/likelihoodPaths.test.ts; N = 300 below always runs.
});

describe('supernova term paths with covariances that follow alpha, beta and sigma_int (300 supernovae)', () => {
  const { table, systematic } = syntheticSample(300, 'paths-300');
  const draw: Draw = (rng) => ({
    omega_m: uniform(rng, 0.1, 0.6), alpha: uniform(rng, 0.1, 0.2), beta: uniform(rng, 2.6, 3.6), mass_step: uniform(rng, -0.1, 0.1),
    sigma_int_north: uniform(rng, 0.02, 0.15), sigma_int_south: uniform(rng, 0.02, 0.15),
  });
  const perSample = { ...options(table, []).standardization, intrinsicScatter: 'per_sample' as const };
  it('diagonal equals general with per-sample intrinsic scatter and exact alpha/beta dependence', () => {
    const diagonal = createSupernovaTerm(options(table, [], { standardization: perSample }));
    const general = createSupernovaTerm(options(table, [], { standardization: perSample, fastPath: 'general' }));
    expect(diagonal.path).toBe('diagonal');
    expect(diagonal.requires).toEqual(['omega_m', 'alpha', 'beta', 'mass_step', 'sigma_int_north', 'sigma_int_south']);
    expectSamePaths(diagonal, general, draw, createRandomStream('varying-diagonal'), 10);
  });
  it('3N x 3N per-supernova blocks keep the covariance diagonal; a dense 3N x 3N matrix makes it general', () => {
    const n = table.count;
    const blocks = new Float64Array(9 * n * n);
    const dense = new Float64Array(9 * n * n);
    for (let i = 0; i < n; i++) {
      const d = 3 * i * 3 * n + 3 * i; // diagonal block start
      blocks[d] = 0.002; blocks[d + 3 * n + 1] = 0.01; blocks[d + 6 * n + 2] = 0.0004;
      blocks[d + 1] = blocks[d + 3 * n] = 0.001;
    }
    dense.set(blocks);
    for (let i = 0; i < 3 * n; i += 3) for (let j = 0; j < 3 * n; j += 3) if (i !== j) dense[i * 3 * n + j] += 0.0005; // correlated m_B
    const asMatrix = (values: Float64Array): CovarianceMatrix => ({ target: 'light_curves', size: 3 * n, values, sourceFile: 'test' });
    const blockTerm = createSupernovaTerm(options(table, [asMatrix(blocks)], { standardization: perSample }));
    const blockGeneral = createSupernovaTerm(options(table, [asMatrix(blocks)], { standardization: perSample, fastPath: 'general' }));
    expect(blockTerm.path).toBe('diagonal');
    expectSamePaths(blockTerm, blockGeneral, draw, createRandomStream('blocks'), 6);
    const denseTerm = createSupernovaTerm(options(table, [asMatrix(dense), systematic], { standardization: perSample }));
    expect(denseTerm.path).toBe('general');
    expect(denseTerm.describe().join(' ')).toMatch(/O\(N\^3\/3\)/);
    expect(Number.isFinite(denseTerm.logLikelihood(draw(createRandomStream('dense'))))).toBe(true);
  });
});
