import { describe, expect, it } from 'vitest';
import type { CovarianceMatrix, SupernovaTable, SystematicModes } from '../../src/data/index.js';
import { choleskyInPlace, createRandomStream } from '../../src/math/index.js';
import { createSupernovaTerm, type SupernovaTermOptions } from '../../src/likelihood/index.js';
import { expectSamePaths, options, uniform, type Draw } from './pathHelpers.js';
import { readPantheonBinned, readPantheonBinnedSystematics } from './pantheonBinned.js';
import { syntheticSample } from './syntheticSample.js';

/** U U^T as a dense magnitude covariance, written out here (independent of the term's own fillDense). */
function outerProduct(modes: SystematicModes): CovarianceMatrix {
  const { count: n, modeCount: k, values } = modes;
  const dense = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let m = 0; m < k; m++) dense[i * n + j] += values[i * k + m] * values[j * k + m];
  return { target: 'magnitudes', size: n, values: dense, sourceFile: 'U U^T (test)' };
}

/** Smooth redshift modes (a low-z calibration offset, a linear and a log tilt) plus seeded random modes, mag. */
function syntheticModes(table: SupernovaTable, randomModes: number, seed: string): SystematicModes {
  const rng = createRandomStream(seed);
  const n = table.count;
  const k = 3 + randomModes;
  const values = new Float64Array(n * k);
  for (let i = 0; i < n; i++) {
    const z = table.redshift[i];
    values[i * k] = z < 0.1 ? 0.02 : 0;
    values[i * k + 1] = 0.015 * z;
    values[i * k + 2] = 0.01 * Math.log1p(z);
    for (let m = 3; m < k; m++) values[i * k + m] = 0.01 * rng.normal();
  }
  return { count: n, modeCount: k, values, sourceFile: 'modes (test)' };
}

describe('supernova term with systematic modes (C = D + U U^T, Woodbury 1950)', () => {
  const table = readPantheonBinned();
  const published = readPantheonBinnedSystematics();
  // The published Pantheon 2018 binned systematic matrix (Scolnic et al. 2018) is positive definite, so its
  // Cholesky factor L is a set of 40 modes with L L^T = C_sys: the modes path must reproduce the dense path on it.
  const factor = Float64Array.from(published.values);
  if (!choleskyInPlace(factor, published.size).ok) throw new Error('the Pantheon binned systematics should be positive definite');
  for (let i = 0; i < published.size; i++) for (let j = i + 1; j < published.size; j++) factor[i * published.size + j] = 0;
  const pantheonModes: SystematicModes = { count: table.count, modeCount: published.size, values: factor, sourceFile: 'Cholesky factor of the Pantheon binned C_sys' };
  const draw: Draw = (rng) => ({ omega_m: uniform(rng, 0.1, 0.5), w0: uniform(rng, -1.5, -0.5), wa: uniform(rng, -2, 1) });

  it('modes from the published matrix give the dense path\'s chi^2 and ln L, compressed (fixed C) and low_rank (sampled sigma_int)', () => {
    const withModes = (extra: Partial<SupernovaTermOptions>) => createSupernovaTerm({ ...options(table, [], { darkEnergy: 'cpl', ...extra }), systematicModes: pantheonModes });
    const dense = (extra: Partial<SupernovaTermOptions>) => createSupernovaTerm(options(table, [published], { darkEnergy: 'cpl', fastPath: 'general', ...extra }));
    const compressed = withModes({ fastPath: 'compressed' });
    expect(compressed.path).toBe('compressed');
    expect(withModes({}).path).toBe('compressed'); // auto with a fixed covariance
    expect(compressed.describe().join('\n')).toMatch(/Woodbury identity \(diagonal \+ 40 modes\)/);
    expectSamePaths(compressed, dense({}), draw, createRandomStream('modes-compressed'), 10);
    const scatter = { standardization: { ...options(table, []).standardization, intrinsicScatter: 'global' as const } };
    const lowRank = withModes(scatter);
    expect(lowRank.path).toBe('low_rank'); // auto: C varies with sigma_int
    const withScatter: Draw = (rng) => ({ ...draw(rng), sigma_int: uniform(rng, 0, 0.15) });
    expectSamePaths(lowRank, dense(scatter), withScatter, createRandomStream('modes-low-rank'), 10);
    expect(lowRank.describe().join('\n')).toMatch(/factorizations so far: \d+/);
  });

  it('the Hubble diagram errors are sqrt(diag C), modes and dense matrices included', () => {
    const term = createSupernovaTerm({ ...options(table, []), systematicModes: pantheonModes });
    const reference = createSupernovaTerm(options(table, [published], { fastPath: 'general' }));
    const statistical = createSupernovaTerm(options(table, []));
    const a = term.hubbleDiagram({ omega_m: 0.3 });
    const b = reference.hubbleDiagram({ omega_m: 0.3 });
    const c = statistical.hubbleDiagram({ omega_m: 0.3 });
    for (let i = 0; i < table.count; i++) {
      // diag C = statistical variance (with lensing and peculiar-velocity terms) + the published C_sys diagonal.
      const expected = Math.sqrt(c.distanceModulusErrorMag[i] ** 2 + published.values[i * table.count + i]);
      expect(a.distanceModulusErrorMag[i]).toBeCloseTo(expected, 12);
      expect(b.distanceModulusErrorMag[i]).toBeCloseTo(expected, 12);
    }
  });

  it('light curves with a 3N x 3N-free covariance: modes equal the dense U U^T for frozen and exact alpha/beta', () => {
    const { table: sample } = syntheticSample(500, 'modes-500');
    const modes = syntheticModes(sample, 7, 'modes-500-u');
    const lc: Draw = (rng) => ({
      omega_m: uniform(rng, 0.1, 0.6), w0: uniform(rng, -1.6, -0.5), wa: uniform(rng, -1.5, 0.8),
      alpha: uniform(rng, 0.1, 0.2), beta: uniform(rng, 2.6, 3.6), mass_step: uniform(rng, -0.1, 0.1),
    });
    const frozen = { ...options(sample, []).standardization, alphaBetaCovariance: 'frozen' as const, frozenAt: { alpha: 0.14, beta: 3.1 } };
    const frozenModes = createSupernovaTerm({ ...options(sample, [], { darkEnergy: 'cpl', standardization: frozen }), systematicModes: modes });
    expect(frozenModes.path).toBe('compressed');
    expectSamePaths(frozenModes, createSupernovaTerm(options(sample, [outerProduct(modes)], { darkEnergy: 'cpl', standardization: frozen, fastPath: 'general' })), lc, createRandomStream('lc-frozen'), 4);
    const exactModes = createSupernovaTerm({ ...options(sample, [], { darkEnergy: 'cpl' }), systematicModes: modes });
    expect(exactModes.path).toBe('low_rank');
    expectSamePaths(exactModes, createSupernovaTerm(options(sample, [outerProduct(modes)], { darkEnergy: 'cpl', fastPath: 'general' })), lc, createRandomStream('lc-exact'), 4);
    // The general path asked for explicitly builds U U^T itself and agrees too.
    expectSamePaths(exactModes, createSupernovaTerm({ ...options(sample, [], { darkEnergy: 'cpl', fastPath: 'general' }), systematicModes: modes }), lc, createRandomStream('lc-general'), 2);
  }, 60_000);

  it('rejects modes of the wrong size, non-finite modes and the diagonal path', () => {
    const short: SystematicModes = { count: table.count - 1, modeCount: 1, values: new Float64Array(table.count - 1), sourceFile: 'short.csv' };
    expect(() => createSupernovaTerm({ ...options(table, []), systematicModes: short })).toThrow(/do not match the 40 supernovae/);
    const bad = Float64Array.from(pantheonModes.values);
    bad[7] = NaN;
    expect(() => createSupernovaTerm({ ...options(table, []), systematicModes: { ...pantheonModes, values: bad } })).toThrow(/mode 8 of supernova 1 is not a finite number/);
    expect(() => createSupernovaTerm({ ...options(table, [], { fastPath: 'diagonal' }), systematicModes: pantheonModes })).toThrow(/diagonal path needs a diagonal covariance/);
    expect(() => createSupernovaTerm(options(table, [], { fastPath: 'low_rank' }))).toThrow(/low_rank path needs a diagonal covariance plus systematic modes/);
  });
});
