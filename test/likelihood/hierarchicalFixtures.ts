// Test helper (not a test): builders for the hierarchical-term tests and a small, independent
// dense linear-algebra toolkit (Gaussian elimination with partial pivoting) for reference values.
import type { CovarianceMatrix, SupernovaTable } from '../../src/data/index.js';
import type { HierarchicalTermOptions } from '../../src/likelihood/index.js';

export const C_KM_PER_S = 299792.458; // exact (SI definition of the metre)
export const LOG_TWO_PI = Math.log(2 * Math.PI);

/** Empty (Milne) universe: D_L = (c/H0) z (1 + z/2) (Hogg 1999, astro-ph/9905116, D_M for Omega_k = 1), mu = 5 log10(D_L/Mpc) + 25. */
export function milneModulusMag(z: number, h0: number): number {
  return 5 * Math.log10((C_KM_PER_S / h0) * z * (1 + z / 2)) + 25;
}

/** Fixed scatter of the JLA form (Betoule et al. 2014): (0.055 z)^2 + ((5/ln 10) (v/c) / z)^2, mag^2. */
export function fixedScatter(z: number, lensingPerRedshift: number, velocityKmPerS: number): number {
  const pv = ((5 / Math.LN10) * (velocityKmPerS / C_KM_PER_S)) / z;
  return (lensingPerRedshift * z) ** 2 + pv * pv;
}

export interface LightCurveRow {
  z: number; mB: number; x1: number; c: number; mass?: number; sample?: string;
  errors: [number, number, number]; /** cov(m_B, x1), cov(m_B, c), cov(x1, c). */ covariances?: [number, number, number];
  calibratorMu?: number;
}

/** A light-curve table from explicit rows. */
export function lightCurveTable(rows: LightCurveRow[]): SupernovaTable {
  const n = rows.length;
  const column = (pick: (row: LightCurveRow) => number) => Float64Array.from(rows, pick);
  const sampleNames = [...new Set(rows.map((row) => row.sample ?? 'all'))];
  return {
    kind: 'light_curves', count: n, ids: rows.map((_, i) => `sn${i + 1}`), samples: rows.map((row) => row.sample ?? 'all'), sampleNames,
    sampleIndex: Int32Array.from(rows, (row) => sampleNames.indexOf(row.sample ?? 'all')),
    redshift: column((r) => r.z), redshiftHelio: column((r) => r.z), redshiftErr: new Float64Array(n),
    peakMag: column((r) => r.mB), stretch: column((r) => r.x1), color: column((r) => r.c),
    peakMagErr: column((r) => r.errors[0]), stretchErr: column((r) => r.errors[1]), colorErr: column((r) => r.errors[2]),
    covPeakMagStretch: column((r) => r.covariances?.[0] ?? 0), covPeakMagColor: column((r) => r.covariances?.[1] ?? 0),
    covStretchColor: column((r) => r.covariances?.[2] ?? 0), hostLogMass: column((r) => r.mass ?? NaN),
    calibratorMu: rows.some((r) => r.calibratorMu !== undefined) ? column((r) => r.calibratorMu ?? NaN) : undefined,
    sourceLine: Int32Array.from(rows, (_, i) => i + 2), sourceFile: 'rows',
  };
}

/** Options with the usual scatter terms, a sharp mass step at 10, global sigma_int, one population. */
export function hierarchicalOptions(table: SupernovaTable, covariances: CovarianceMatrix[] = [], extra: Partial<HierarchicalTermOptions> & { flat?: boolean } = {}): HierarchicalTermOptions {
  const { flat = true, ...rest } = extra;
  return {
    name: 'sn', table, covariances,
    cosmologyModel: { darkEnergy: 'lambda', flat, cmbTemperatureK: 0, effectiveNeutrinoSpecies: 3.046 },
    standardization: {
      massStep: { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0 },
      scatter: { lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, includeRedshiftErrors: false },
      intrinsicScatter: 'global', alphaBetaCovariance: 'exact',
    },
    population: { perSample: false, redshiftDependentMeans: false },
    offset: 'sample',
    ...rest,
  };
}

/** Solves A x = b (A n x n row major, copied) by Gaussian elimination with partial pivoting; returns x and ln|det A|. */
export function solveDense(matrix: ArrayLike<number>, n: number, rhs: ArrayLike<number>[]): { solutions: number[][]; logAbsDet: number } {
  const a = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c) => matrix[r * n + c]));
  const b = rhs.map((v) => Array.from(v));
  let logAbsDet = 0;
  for (let k = 0; k < n; k++) {
    let pivot = k;
    for (let r = k + 1; r < n; r++) if (Math.abs(a[r][k]) > Math.abs(a[pivot][k])) pivot = r;
    [a[k], a[pivot]] = [a[pivot], a[k]];
    for (const v of b) [v[k], v[pivot]] = [v[pivot], v[k]];
    logAbsDet += Math.log(Math.abs(a[k][k]));
    for (let r = k + 1; r < n; r++) {
      const f = a[r][k] / a[k][k];
      for (let c = k; c < n; c++) a[r][c] -= f * a[k][c];
      for (const v of b) v[r] -= f * v[k];
    }
  }
  const solutions = b.map((v) => {
    const x = new Array<number>(n).fill(0);
    for (let r = n - 1; r >= 0; r--) {
      let s = v[r];
      for (let c = r + 1; c < n; c++) s -= a[r][c] * x[c];
      x[r] = s / a[r][r];
    }
    return x;
  });
  return { solutions, logAbsDet };
}

/** ln N(r; 0, C) for a dense C (n x n row major), by {@link solveDense}. */
export function gaussianLogDensity(residual: number[], covariance: ArrayLike<number>, n: number): number {
  const { solutions, logAbsDet } = solveDense(covariance, n, [residual]);
  const chiSquare = residual.reduce((sum, r, i) => sum + r * solutions[0][i], 0);
  return -0.5 * (chiSquare + logAbsDet + n * LOG_TWO_PI);
}
