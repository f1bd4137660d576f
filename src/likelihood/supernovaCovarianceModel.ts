import { CandelaError } from '../errors.js';
import type { CovarianceMatrix, SupernovaTable, SystematicModes } from '../data/index.js';
import { checkSystematicModes } from './checkSystematicModes.js';
import { combineLightCurveCovariance, fixedScatterVariance, lightCurveVariance, splitLightCurveCovariance, type ScatterTerms } from '../standardize/index.js';

/**
 * The covariance of the standardized magnitudes as a function of
 * (alpha, beta, sigma_int per sample), following the JLA covariance model
 * (Betoule et al. 2014, A&A 568, A22, eq. 11-13):
 *
 *   C = A C_eta A^T + C_mag + U U^T + diag(light-curve variance(alpha, beta) + fixed scatter + sigma_int^2),
 *
 * A the N x 3N matrix with rows (1, alpha, -beta), C_eta the 3N x 3N
 * light-curve matrices, C_mag the N x N magnitude matrices, U the N x K
 * systematic modes. 3N x 3N matrices
 * that are block diagonal (one 3x3 block per supernova) are folded into the
 * per-supernova light-curve errors, so they keep the covariance diagonal.
 * Private helper of the supernova term.
 */
export interface SupernovaCovarianceModel {
  readonly count: number;
  /** True when C is diagonal for every parameter value. */
  readonly diagonal: boolean;
  /**
   * 'diagonal': C = D; 'low_rank': C = D + U U^T with no dense matrix (fillVariances gives D,
   * `modes` holds U); 'dense': a dense N x N or 3N x 3N matrix is part of C (U U^T, if any, is in fillDense).
   */
  readonly structure: 'diagonal' | 'low_rank' | 'dense';
  /** U, N x K row major (mag), or null without systematic modes. */
  readonly modes: Float64Array | null;
  /** K (0 without systematic modes). */
  readonly modeCount: number;
  /** Number of inputs: [alpha, beta, sigma_int of each sample]. */
  readonly inputCount: number;
  /** What the matrix is made of, for describe(). */
  readonly parts: string[];
  /** Writes the N variances of D (the diagonal part of C, without the modes) for inputs [alpha, beta, sigma_int...], mag^2. O(N). */
  fillVariances(inputs: Float64Array, out: Float64Array): void;
  /**
   * Adds the diagonal of the correlated parts (A C_eta A^T + C_mag + U U^T, mag^2) at inputs [alpha, beta, ...]
   * to out, so that fillVariances then addCorrelatedVariances gives diag C. O(N K + N).
   */
  addCorrelatedVariances(inputs: Float64Array, out: Float64Array): void;
  /**
   * Writes the lower triangle (diagonal included) of the row-major N x N matrix, mag^2; the strict upper triangle
   * is left as it was (the Cholesky factorization reads only the lower one). O(3 N^2) with light-curve matrices,
   * O(N^2 / 2) otherwise; the fixed parts (N x N matrices, U U^T) are summed once, at the first call.
   */
  fillDense(inputs: Float64Array, out: Float64Array): void;
}

function isBlockDiagonal(values: Float64Array, size: number, block: number): boolean {
  for (let i = 0; i < size; i++) {
    const blockStart = i - (i % block);
    const row = i * size;
    for (let j = 0; j < size; j++) if ((j < blockStart || j >= blockStart + block) && values[row + j] !== 0) return false;
  }
  return true;
}

function sumMatrices(matrices: CovarianceMatrix[]): Float64Array | null {
  if (matrices.length === 0) return null;
  if (matrices.length === 1) return matrices[0].values;
  const sum = new Float64Array(matrices[0].values.length);
  for (const matrix of matrices) for (let k = 0; k < sum.length; k++) sum[k] += matrix.values[k];
  return sum;
}

/** Table copy whose per-supernova light-curve errors include the 3x3 blocks of a block-diagonal C_eta. */
function foldBlocks(table: SupernovaTable, blocks: Float64Array): SupernovaTable {
  const n = table.count;
  const size = 3 * n;
  const zero = new Float64Array(n);
  const widen = (errors: Float64Array | undefined, k: number): Float64Array =>
    Float64Array.from({ length: n }, (_, i) => Math.sqrt((errors ?? zero)[i] ** 2 + blocks[(3 * i + k) * size + 3 * i + k]));
  const add = (cov: Float64Array | undefined, a: number, b: number): Float64Array =>
    Float64Array.from({ length: n }, (_, i) => (cov ?? zero)[i] + blocks[(3 * i + a) * size + 3 * i + b]);
  return {
    ...table,
    peakMagErr: widen(table.peakMagErr, 0), stretchErr: widen(table.stretchErr, 1), colorErr: widen(table.colorErr, 2),
    covPeakMagStretch: add(table.covPeakMagStretch, 0, 1), covPeakMagColor: add(table.covPeakMagColor, 0, 2), covStretchColor: add(table.covStretchColor, 1, 2),
  };
}

/**
 * Builds the covariance model. Cost: O(N^2) scans of the given matrices once
 * (O(9 N^2) for 3N x 3N ones); allocates the fixed variances and, with several
 * matrices of a kind, their sum.
 * @param table the sample (kind decides whether alpha and beta enter)
 * @param matrices extra covariance matrices (already scaled)
 * @param scatter lensing / peculiar-velocity / redshift-error terms
 * @param sampleOfRow sample index per row, for sigma_int (pass table.sampleIndex)
 * @param sampleCount number of intrinsic-scatter inputs (0 when off, 1 when global, else samples)
 * @param isCalibrator 1 for calibrator rows, whose variance gets no peculiar-velocity or redshift-error term
 * @param systematicModes optional N x K modes U (mag), adding U U^T
 * @throws CandelaError for a matrix or modes of the wrong size or target, a non-finite mode, and for missing magnitude errors
 */
export function createSupernovaCovarianceModel(
  table: SupernovaTable, matrices: CovarianceMatrix[], scatter: ScatterTerms, sampleOfRow: Int32Array, sampleCount: number,
  isCalibrator: Uint8Array, systematicModes?: SystematicModes,
): SupernovaCovarianceModel {
  const n = table.count;
  const modes = checkSystematicModes(systematicModes, n);
  const modeCount = modes ? modes.length / n : 0;
  const lightCurves = table.kind === 'light_curves';
  matrices.forEach((matrix, index) => {
    const expected = matrix.target === 'light_curves' ? 3 * n : n;
    if (matrix.size !== expected || matrix.values.length !== expected * expected || (matrix.target === 'light_curves' && !lightCurves)) {
      throw new CandelaError({
        code: 'likelihood.covariance_mismatch', file: matrix.sourceFile, path: `covariances[${index}]`,
        message: matrix.target === 'light_curves' && !lightCurves
          ? 'a light-curve (3N x 3N) covariance needs a table of light-curve parameters, but the table holds magnitudes'
          : `covariance size does not match the ${n} supernovae of the table`,
        expected: `${expected} x ${expected}`, found: `${matrix.size} x ${matrix.size}`,
        fix: 'apply the same cuts to the table and the covariance, or check the covariance target',
      });
    }
  });
  const parts: string[] = [];
  const fixedVariance = fixedScatterVariance(table, scatter, new Float64Array(n));
  parts.push('fixed scatter (lensing, peculiar velocity, redshift errors)');
  if (isCalibrator.includes(1)) {
    // A calibrator's distance comes from calibratorMu, not from its redshift: no peculiar-velocity or redshift-error term.
    const lensingOnly = fixedScatterVariance(table, { lensingPerRedshift: scatter.lensingPerRedshift, peculiarVelocityKmPerS: 0, includeRedshiftErrors: false }, new Float64Array(n));
    for (let i = 0; i < n; i++) if (isCalibrator[i]) fixedVariance[i] = lensingOnly[i];
    parts.push('(calibrators: lensing only)');
  }
  if (!lightCurves) {
    if (!table.magnitudeErr) throw new CandelaError({ code: 'likelihood.magnitude_errors_missing', file: table.sourceFile, message: 'a magnitude table needs magnitude errors', fix: 'map the magnitude error column' });
    for (let i = 0; i < n; i++) fixedVariance[i] += table.magnitudeErr[i] ** 2;
    parts.push('magnitude errors');
  }
  let magnitudeDense = sumMatrices(matrices.filter((m) => m.target === 'magnitudes'));
  if (magnitudeDense && isBlockDiagonal(magnitudeDense, n, 1)) {
    for (let i = 0; i < n; i++) fixedVariance[i] += magnitudeDense[i * n + i];
    magnitudeDense = null;
    parts.push('diagonal magnitude matrices');
  } else if (magnitudeDense) parts.push('dense N x N magnitude matrices');
  let lightCurveDense = sumMatrices(matrices.filter((m) => m.target === 'light_curves'));
  let varianceTable = table;
  if (lightCurveDense && isBlockDiagonal(lightCurveDense, 3 * n, 3)) {
    varianceTable = foldBlocks(table, lightCurveDense);
    lightCurveDense = null;
    parts.push('per-supernova 3x3 light-curve blocks');
  } else if (lightCurveDense) parts.push('dense 3N x 3N light-curve matrices propagated with (1, alpha, -beta)');
  if (lightCurves) {
    lightCurveVariance(varianceTable, 1, 1, new Float64Array(n)); // throws here, not in the hot path, when errors are missing
    parts.push('light-curve fit variances (alpha, beta)');
  }
  if (modes) parts.push(`${modeCount} systematic mode${modeCount === 1 ? '' : 's'} U U^T`);
  if (sampleCount > 0) parts.push(`intrinsic scatter (${sampleCount} parameter${sampleCount > 1 ? 's' : ''})`);

  const fillVariances = (inputs: Float64Array, out: Float64Array): void => {
    if (lightCurves) lightCurveVariance(varianceTable, inputs[0], inputs[1], out);
    else out.fill(0);
    for (let i = 0; i < n; i++) {
      let variance = out[i] + fixedVariance[i];
      if (sampleCount > 0) {
        const sigma = inputs[2 + (sampleCount === 1 ? 0 : sampleOfRow[i])];
        variance += sigma * sigma;
      }
      out[i] = variance;
    }
  };
  const diagonalScratch = new Float64Array(n);
  const noDense = magnitudeDense === null && lightCurveDense === null;
  // Built once (lower triangles): C_mu(alpha, beta) = A C_eta A^T as a fixed quadratic form in (alpha, beta)
  // (Betoule et al. 2014, eq. 13), and every part of C that does not depend on the inputs (the N x N magnitude
  // matrices and U U^T when modes are part of a dense C). A call then only combines them.
  const lightCurveParts = lightCurveDense ? splitLightCurveCovariance(lightCurveDense, n) : null;
  // Built at the first fillDense call only: a low-rank run of 10^5 supernovae never forms this N x N matrix.
  let fixedDense: Float64Array | null | undefined;
  const fixedDenseParts = (): Float64Array | null => {
    if (fixedDense !== undefined) return fixedDense;
    if (!magnitudeDense && !modes) return (fixedDense = null);
    const sums = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j <= i; j++) {
        let sum = magnitudeDense ? magnitudeDense[i * n + j] : 0;
        if (modes) for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] * modes[j * modeCount + k];
        sums[i * n + j] = sum;
      }
    }
    return (fixedDense = sums);
  };
  return {
    count: n,
    diagonal: noDense && !modes,
    structure: noDense ? (modes ? 'low_rank' : 'diagonal') : 'dense',
    modes,
    modeCount,
    inputCount: 2 + sampleCount,
    parts,
    fillVariances,
    addCorrelatedVariances(inputs, out) {
      const weights = [1, inputs[0], -inputs[1]];
      for (let i = 0; i < n; i++) {
        let sum = magnitudeDense ? magnitudeDense[i * n + i] : 0;
        if (lightCurveDense) {
          for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) sum += weights[a] * weights[b] * lightCurveDense[(3 * i + a) * 3 * n + 3 * i + b];
        }
        if (modes) for (let k = 0; k < modeCount; k++) sum += modes[i * modeCount + k] ** 2;
        out[i] += sum;
      }
    },
    fillDense(inputs, out) {
      // Lower triangle only: the Cholesky factorization that consumes C reads nothing else.
      if (lightCurveParts) combineLightCurveCovariance(lightCurveParts, inputs[0], inputs[1], out);
      const fixedDense = fixedDenseParts();
      if (fixedDense) {
        for (let i = 0; i < n; i++) {
          const row = i * n;
          if (lightCurveParts) for (let cell = row; cell <= row + i; cell++) out[cell] += fixedDense[cell];
          else for (let cell = row; cell <= row + i; cell++) out[cell] = fixedDense[cell];
        }
      } else if (!lightCurveParts) {
        out.fill(0);
      }
      fillVariances(inputs, diagonalScratch);
      for (let i = 0; i < n; i++) out[i * n + i] += diagonalScratch[i];
    },
  };
}
