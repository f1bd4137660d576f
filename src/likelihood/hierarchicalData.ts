import { CandelaError, type Issue } from '../errors.js';
import type { CovarianceMatrix } from '../data/index.js';
import { fixedScatterVariance, highMassFraction } from '../standardize/index.js';
import { checkSystematicModes } from './checkSystematicModes.js';
import type { HierarchicalTermOptions } from './hierarchicalTermOptions.js';

/**
 * The fixed inputs of the hierarchical term, prepared once (private helper).
 * Per supernova i the observation is o_i = (m_B - bias correction, x1, c) and
 * its measurement block V_i (symmetric 3 x 3, stored as v00 v01 v02 v11 v12
 * v22) holds the light-curve fit covariance, the lensing / peculiar-velocity
 * / redshift-error variance in v00, and the 3 x 3 blocks of covariance
 * matrices that do not couple supernovae. Matrices that do couple them stay
 * in `dense` (3N x 3N, interleaved (m_B, x1, c) order; an N x N magnitude
 * matrix is placed on the m_B entries).
 */
export interface HierarchicalData {
  readonly count: number;
  /** o_i interleaved: m_B - bias (mag), x1, c (mag); length 3N. */
  readonly observed: Float64Array;
  /** V_i as [v00, v01, v02, v11, v12, v22] per supernova; length 6N; mag^2 where m_B or c enter. */
  readonly measurement: Float64Array;
  /** f_high - 1/2 per supernova (0 when the step is off or the mass unknown). */
  readonly stepFraction: Float64Array;
  /** 1 for calibrators (finite calibratorMu). */
  readonly isCalibrator: Uint8Array;
  /** Sum of the coupling matrices (and U U^T on the m_B entries when modes come with them), 3N x 3N row major, or null when every matrix is per supernova. */
  readonly dense: Float64Array | null;
  /** Systematic modes U on m_B (N x K row major, mag) left to the Woodbury path, or null (none, or folded into `dense`). */
  readonly modes: Float64Array | null;
  /** K of `modes` (0 when null). */
  readonly modeCount: number;
  /** What the covariance is made of, for describe(). */
  readonly parts: string[];
}

/** True when the matrix has a non-zero entry outside the per-supernova blocks (3 x 3 for light curves, 1 x 1 for magnitudes). */
function couplesSupernovae(matrix: CovarianceMatrix): boolean {
  const size = matrix.size;
  const block = matrix.target === 'light_curves' ? 3 : 1;
  for (let r = 0; r < size; r++) {
    const start = r - (r % block);
    for (let c = 0; c < size; c++) if ((c < start || c >= start + block) && matrix.values[r * size + c] !== 0) return true;
  }
  return false;
}

/** dense[(3i, 3j)] += sum_k U_ik U_jk: the modes on the m_B entries of the 3N x 3N matrix. Cost N^2 K. */
function addModesToDense(modes: Float64Array, modeCount: number, n: number, dense: Float64Array): void {
  const size = 3 * n;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] * modes[j * modeCount + k];
      dense[3 * i * size + 3 * j] += sum;
    }
  }
}

function checkMatrices(options: HierarchicalTermOptions): void {
  const n = options.table.count;
  options.covariances.forEach((matrix, index) => {
    const expected = matrix.target === 'light_curves' ? 3 * n : n;
    if (matrix.size !== expected || matrix.values.length !== expected * expected) {
      throw new CandelaError({
        code: 'likelihood.covariance_mismatch', file: matrix.sourceFile, path: `covariances[${index}]`,
        message: `covariance size does not match the ${n} supernovae of the table`,
        expected: `${expected} x ${expected}`, found: `${matrix.size} x ${matrix.size}`,
        fix: 'apply the same cuts to the table and the covariance, or check the covariance target',
      });
    }
  });
}

/**
 * Prepares the observations, measurement blocks, coupling matrix and modes.
 * Cost O(N) plus O(size^2) scans of the given matrices; allocates a 3N x 3N
 * buffer when a matrix couples supernovae (systematic modes are then added to
 * it, N^2 K; otherwise they are kept as U for the Woodbury path).
 * @param options the term's options (table kind 'light_curves')
 * @throws CandelaError `likelihood.hierarchical_needs_light_curves`, `likelihood.light_curve_column_missing`,
 *   `likelihood.bad_light_curve_value` (with the row), `likelihood.covariance_mismatch`,
 *   `likelihood.modes_mismatch` and `likelihood.low_rank_mode` (systematic modes of the wrong shape or not finite)
 * @example prepareHierarchicalData(options).measurement.length === 6 * options.table.count
 */
export function prepareHierarchicalData(options: HierarchicalTermOptions): HierarchicalData {
  const { table, standardization } = options;
  const n = table.count;
  if (table.kind !== 'light_curves') {
    throw new CandelaError({
      code: 'likelihood.hierarchical_needs_light_curves', file: table.sourceFile, path: options.name,
      message: 'the hierarchical stretch and colour model needs light-curve parameters (m_B, x1, c), but the table holds magnitudes',
      expected: "kind 'light_curves'", found: `kind '${table.kind}'`, fix: 'read the table as light curves, or use the conventional supernova term',
    });
  }
  const columns = { peakMag: table.peakMag, stretch: table.stretch, color: table.color, peakMagErr: table.peakMagErr, stretchErr: table.stretchErr, colorErr: table.colorErr };
  const missing = Object.entries(columns).filter(([, column]) => column === undefined).map(([key]) => key);
  if (missing.length) {
    throw new CandelaError({
      code: 'likelihood.light_curve_column_missing', file: table.sourceFile, path: options.name,
      message: `the hierarchical term needs the light-curve values and their errors; missing: ${missing.join(', ')}`, fix: 'map these columns when reading the table',
    });
  }
  checkMatrices(options);
  const allModes = checkSystematicModes(options.systematicModes, n);
  const { peakMag, stretch, color, peakMagErr, stretchErr, colorErr } = columns as Record<keyof typeof columns, Float64Array>;
  const isCalibrator = new Uint8Array(n);
  for (let i = 0; i < n; i++) if (table.calibratorMu && Number.isFinite(table.calibratorMu[i])) isCalibrator[i] = 1;
  const fixed = fixedScatterVariance(table, standardization.scatter, new Float64Array(n));
  const lensingOnly = fixedScatterVariance(table, { ...standardization.scatter, peculiarVelocityKmPerS: 0, includeRedshiftErrors: false }, new Float64Array(n));
  const observed = new Float64Array(3 * n);
  const measurement = new Float64Array(6 * n);
  const stepFraction = new Float64Array(n);
  const issues: Issue[] = [];
  for (let i = 0; i < n; i++) {
    observed[3 * i] = peakMag[i] - (table.biasCorrectionMag ? table.biasCorrectionMag[i] : 0);
    observed[3 * i + 1] = stretch[i];
    observed[3 * i + 2] = color[i];
    const block = measurement.subarray(6 * i, 6 * i + 6);
    block[0] = peakMagErr[i] ** 2 + (isCalibrator[i] ? lensingOnly[i] : fixed[i]);
    block[1] = table.covPeakMagStretch ? table.covPeakMagStretch[i] : 0;
    block[2] = table.covPeakMagColor ? table.covPeakMagColor[i] : 0;
    block[3] = stretchErr[i] ** 2;
    block[4] = table.covStretchColor ? table.covStretchColor[i] : 0;
    block[5] = colorErr[i] ** 2;
    const allFinite = [observed[3 * i], stretch[i], color[i], ...block].every(Number.isFinite);
    if (!allFinite || !(peakMagErr[i] >= 0 && stretchErr[i] >= 0 && colorErr[i] >= 0)) {
      issues.push({
        code: 'likelihood.bad_light_curve_value', file: table.sourceFile, line: table.sourceLine[i], path: table.ids[i],
        message: 'a light-curve value or error is not a finite number (errors must be >= 0)',
        found: `m_B ${peakMag[i]}, x1 ${stretch[i]}, c ${color[i]}, errors ${peakMagErr[i]}, ${stretchErr[i]}, ${colorErr[i]}`,
      });
    }
    if (standardization.massStep.enabled && table.hostLogMass) stepFraction[i] = highMassFraction(table.hostLogMass[i], standardization.massStep) - 0.5;
  }
  if (issues.length) throw new CandelaError(issues);

  const parts = ['light-curve fit blocks (m_B, x1, c)', 'fixed scatter on m_B (lensing, peculiar velocity, redshift errors; calibrators: lensing only)'];
  const coupling = options.covariances.filter((matrix) => couplesSupernovae(matrix));
  const perSupernova = options.covariances.filter((matrix) => !coupling.includes(matrix));
  const blockEntry = [[0, 1, 2], [1, 3, 4], [2, 4, 5]];
  for (const matrix of perSupernova) {
    const size = matrix.size;
    for (let i = 0; i < n; i++) {
      if (matrix.target === 'magnitudes') measurement[6 * i] += matrix.values[i * size + i];
      else for (let a = 0; a < 3; a++) for (let b = a; b < 3; b++) measurement[6 * i + blockEntry[a][b]] += matrix.values[(3 * i + a) * size + 3 * i + b];
    }
  }
  if (perSupernova.length) parts.push(`${perSupernova.length} per-supernova matri${perSupernova.length > 1 ? 'ces' : 'x'} folded into the blocks`);
  let dense: Float64Array | null = null;
  if (coupling.length) {
    const size = 3 * n;
    dense = new Float64Array(size * size);
    for (const matrix of coupling) {
      if (matrix.target === 'light_curves') for (let k = 0; k < size * size; k++) dense[k] += matrix.values[k];
      else for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) dense[3 * i * size + 3 * j] += matrix.values[i * n + j];
    }
    parts.push(`${coupling.length} matri${coupling.length > 1 ? 'ces' : 'x'} coupling supernovae (3N x 3N)`);
  }
  const modeCount = allModes ? allModes.length / n : 0;
  if (allModes && dense) {
    addModesToDense(allModes, modeCount, n, dense);
    parts.push(`${modeCount} systematic mode${modeCount === 1 ? '' : 's'} U U^T on m_B, added to the 3N x 3N matrix`);
  } else if (allModes) parts.push(`${modeCount} systematic mode${modeCount === 1 ? '' : 's'} U U^T on m_B (Woodbury identity, no 3N x 3N matrix)`);
  const modes = dense ? null : allModes;
  return { count: n, observed, measurement, stepFraction, isCalibrator, dense, modes, modeCount: modes ? modeCount : 0, parts };
}
