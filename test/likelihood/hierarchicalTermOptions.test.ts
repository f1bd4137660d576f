import { describe, expect, it } from 'vitest';
import type { CovarianceMatrix } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';
import {
  createHierarchicalSupernovaTerm, hierarchicalPopulationPriors, HIERARCHICAL_POPULATION_PRIORS, type ParameterValues,
} from '../../src/likelihood/index.js';
import { hierarchicalOptions, lightCurveTable, milneModulusMag, type LightCurveRow } from './hierarchicalFixtures.js';

const rows: LightCurveRow[] = [0.05, 0.2, 0.5, 0.9].map((z, i) => ({
  z, mB: milneModulusMag(z, 70) - 19.3 + 0.05 * (i - 1.5), x1: 0.3 * i - 0.5, c: 0.02 * i - 0.03, mass: 9.5 + 0.4 * i,
  sample: i % 2 ? 'deep' : 'wide', errors: [0.1, 0.4, 0.035], covariances: [0.002, 0.0005, -0.003],
}));
const table = lightCurveTable(rows);
const p: ParameterValues = { omega_m: 0.3, omega_de: 0.7, h0: 70, abs_mag: -19.3, alpha: 0.14, beta: 3.1, mass_step: 0.05, sigma_int: 0.1, x1_mean: 0, x1_width: 1, color_mean: 0, color_width: 0.1 };
const coupling: CovarianceMatrix = { target: 'magnitudes', size: 4, values: Float64Array.from({ length: 16 }, (_, k) => (k % 5 === 0 ? 0.002 : 0.001)), sourceFile: 'sys' };

function thrownCode(build: () => unknown): string | undefined {
  try {
    build();
  } catch (error) {
    return isCandelaError(error) ? error.issues[0].code : 'not a CandelaError';
  }
  return undefined;
}

describe('createHierarchicalSupernovaTerm: parameters, rejections and options', () => {
  it('lists the parameters it reads: per-sample populations, slopes and per-sample intrinsic scatter', () => {
    const term = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], {
      offset: 'marginalize', population: { perSample: true, redshiftDependentMeans: true },
      standardization: { ...hierarchicalOptions(table).standardization, intrinsicScatter: 'per_sample' },
    }));
    expect(term.requires).toEqual([
      'omega_m', 'alpha', 'beta', 'mass_step', 'sigma_int_wide', 'sigma_int_deep', 'x1_mean_wide', 'x1_mean_deep', 'x1_width_wide', 'x1_width_deep',
      'color_mean_wide', 'color_mean_deep', 'color_width_wide', 'color_width_deep', 'x1_mean_slope', 'color_mean_slope',
    ]);
    expect(term.dataCount).toBe(12); // 3 observations per supernova
    expect(term.warnings.some((w) => /sample wide has 2 supernovae/.test(w))).toBe(true);
    expect(term.describe().join('\n')).toMatch(/one per sample \(2\), means linear in z/);
  });

  it('returns -Infinity with a reason, never NaN, for widths <= 0, non-finite values and unphysical cosmologies', () => {
    const term = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { flat: false }));
    expect(Number.isFinite(term.logLikelihood(p))).toBe(true);
    expect(term.rejectionReason(p)).toBeNull();
    const cases: [ParameterValues, RegExp][] = [
      [{ ...p, x1_width: 0 }, /x1_width = 0 must be a positive/],
      [{ ...p, color_width: -0.1 }, /color_width = -0.1 must be a positive/],
      [{ ...p, alpha: NaN }, /alpha = NaN is not a finite number/],
      [{ ...p, color_mean: Infinity }, /color_mean = Infinity/],
      [{ ...p, omega_m: 0.1, omega_de: 2.5 }, /no Big Bang/], // E^2 < 0 in the past: a bounce (common practice)
      [{ ...p, h0: -70 }, /h0 = -70/],
    ];
    for (const [q, reason] of cases) {
      expect(term.logLikelihood(q)).toBe(-Infinity);
      expect(term.rejectionReason(q)).toMatch(reason);
      expect(term.bestFitExtras!(q)).toEqual({});
      expect(() => term.hubbleDiagram(q)).toThrow(/no Hubble diagram at this point/);
    }
  });

  it('rejects a supernova whose 3 x 3 covariance is not positive definite, naming it', () => {
    const broken = lightCurveTable([rows[0], { ...rows[1], covariances: [5, 0, 0] }]); // |cov(m_B, x1)| >> sigma sigma
    const term = createHierarchicalSupernovaTerm(hierarchicalOptions(broken, []));
    expect(term.logLikelihood(p)).toBe(-Infinity);
    expect(term.rejectionReason(p)).toMatch(/supernova sn2 \(row 2\) is not positive definite/);
  });

  it('reports best-fit extras that add up to ln L (marginalized offset)', () => {
    const term = createHierarchicalSupernovaTerm(hierarchicalOptions(table, [], { offset: 'marginalize' }));
    const extras = term.bestFitExtras!(p);
    const total = extras.chi_square + extras.log_det_covariance + 12 * Math.log(2 * Math.PI) + extras.offset_marginalization_term;
    expect(term.logLikelihood(p)).toBeCloseTo(-0.5 * total, 12);
    expect(extras.abs_mag_best_fit).toBe(term.bestFitOffset(p));
  });

  it('throws CandelaError for magnitude tables, bad light-curve values, z <= 0, wrong matrix sizes and frozen covariances without values', () => {
    expect(thrownCode(() => createHierarchicalSupernovaTerm(hierarchicalOptions({ ...table, kind: 'magnitudes' }))))
      .toBe('likelihood.hierarchical_needs_light_curves');
    expect(thrownCode(() => createHierarchicalSupernovaTerm(hierarchicalOptions(lightCurveTable([{ ...rows[0], x1: NaN }])))))
      .toBe('likelihood.bad_light_curve_value');
    expect(thrownCode(() => createHierarchicalSupernovaTerm(hierarchicalOptions(lightCurveTable([{ ...rows[0], z: 0 }])))))
      .toBe('likelihood.bad_redshift');
    expect(thrownCode(() => createHierarchicalSupernovaTerm(hierarchicalOptions(table, [{ ...coupling, size: 3, values: new Float64Array(9) }]))))
      .toBe('likelihood.covariance_mismatch');
    expect(thrownCode(() => createHierarchicalSupernovaTerm(hierarchicalOptions(table, [coupling], {
      standardization: { ...hierarchicalOptions(table).standardization, alphaBetaCovariance: 'frozen', frozenAt: { alpha: 0.14, beta: 3.1 } },
    })))).toBe('likelihood.frozen_without_values');
  });

  it('freezes the dense covariance: one factorization, exact at the frozen values, widths no longer read', () => {
    const frozenAt = { alpha: p.alpha, beta: p.beta, x1_width: p.x1_width, color_width: p.color_width, sigma_int: p.sigma_int };
    const base = hierarchicalOptions(table, [coupling]);
    const frozen = createHierarchicalSupernovaTerm({ ...base, standardization: { ...base.standardization, alphaBetaCovariance: 'frozen', frozenAt } });
    const exact = createHierarchicalSupernovaTerm(base);
    expect(frozen.requires).not.toContain('x1_width');
    expect(frozen.requires).not.toContain('sigma_int');
    expect(frozen.logLikelihood(p)).toBeCloseTo(exact.logLikelihood(p), 12); // identical inputs at the frozen point
    for (const alpha of [0.1, 0.12, 0.18]) expect(Number.isFinite(frozen.logLikelihood({ ...p, alpha }))).toBe(true);
    expect(frozen.describe()).toContain('factorizations so far: 1');
    expect(frozen.warnings[0]).toMatch(/dense covariance frozen/);
    const blocks = createHierarchicalSupernovaTerm({ ...base, covariances: [], standardization: { ...base.standardization, alphaBetaCovariance: 'frozen', frozenAt } });
    expect(blocks.path).toBe('blocks');
    expect(blocks.warnings[0]).toMatch(/has no effect here/);
  });

  it('gives default population priors by base name (hierarchicalPopulationPriors)', () => {
    expect(hierarchicalPopulationPriors(['omega_m', 'x1_width_north', 'x1_mean_slope', 'color_mean', 'constructor'])).toEqual({
      x1_width_north: { kind: 'log_uniform', min: 0.05, max: 5 },
      x1_mean_slope: { kind: 'uniform', min: -5, max: 5 },
      color_mean: { kind: 'uniform', min: -0.3, max: 0.3 },
    });
    expect(Object.keys(HIERARCHICAL_POPULATION_PRIORS)).toEqual(['x1_mean', 'x1_width', 'color_mean', 'color_width', 'x1_mean_slope', 'color_mean_slope']);
  });
});
