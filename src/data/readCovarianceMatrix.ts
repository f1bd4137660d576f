import { CandelaError } from '../errors.js';
import { createIssueList } from './issueList.js';
import { parseMatrixText } from './parseMatrixText.js';
import { readTextLines } from './readTextLines.js';
import { CANONICAL_BLOCK_ORDER, isBlockOrder, reorderLightCurveCovariance, type LightCurveParameter } from './reorderLightCurveCovariance.js';
import type { CovarianceMatrix } from './supernovaTable.js';

/**
 * Default relative symmetry tolerance: |C_ij - C_ji| <= tol sqrt(|C_ii C_jj|).
 * Files written with 6-8 significant digits agree to ~1e-8 of the diagonal
 * scale when they are symmetric at all (common practice).
 */
export const DEFAULT_SYMMETRY_TOLERANCE = 1e-8;

/** How to read one covariance file. */
export interface CovarianceReadOptions {
  /** Path to read. */
  file: string;
  /** How to name the file in messages (default: `file`). */
  displayName?: string;
  /** `magnitudes`: N x N on standardized magnitudes; `light_curves`: 3N x 3N on (m_B, x1, c). */
  target: 'magnitudes' | 'light_curves';
  /** Number of supernovae N of the table, before any cut. */
  expectedSupernovae: number;
  /** For light_curves: the file's parameter order (a permutation of m_b, x1, color; default m_b, x1, color). */
  blockOrder?: readonly LightCurveParameter[];
  /** For light_curves: 3x3 blocks per supernova (`interleaved`, default) or one N x N block per parameter pair (`grouped`). */
  layout?: 'interleaved' | 'grouped';
  /** Factor applied to every entry (e.g. 1 to keep mag^2). Must be finite and positive. */
  scale: number;
  /** Relative symmetry tolerance (default {@link DEFAULT_SYMMETRY_TOLERANCE}). */
  symmetryTolerance?: number;
}

/**
 * Reads a covariance matrix (see parseMatrixText for the accepted text forms:
 * optional dimension line, one value per line or one row per line,
 * whitespace or comma separated), checks its size against the table and its
 * symmetry, averages C and C^T (removing rounding asymmetry below the
 * tolerance), multiplies by `scale` and, for light curves, reorders to the
 * canonical interleaved (m_B, x1, c) order. Positive definiteness is checked
 * separately ({@link checkPositiveDefinite}) because a systematic-only matrix
 * need not be positive definite before the statistical part is added.
 *
 * Cost O(n^2) for n = N or 3N.
 * @throws CandelaError `covariance.non_numeric` / `not_finite` (with line and
 *   column), `covariance.not_square`, `covariance.wrong_size` (expected and
 *   found dimension), `covariance.not_symmetric` (the worst pair, both values
 *   and the tolerance), `covariance.bad_option`.
 * @example
 * readCovarianceMatrix({ file: '../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt',
 *   target: 'magnitudes', expectedSupernovae: 40, scale: 1 }).size // 40
 */
export function readCovarianceMatrix(options: CovarianceReadOptions): CovarianceMatrix {
  const displayName = options.displayName ?? options.file;
  const tolerance = options.symmetryTolerance ?? DEFAULT_SYMMETRY_TOLERANCE;
  const blockOrder = options.blockOrder ?? CANONICAL_BLOCK_ORDER;
  const issues = createIssueList();
  const bad = (path: string, message: string, found: string) =>
    issues.add({ code: 'covariance.bad_option', file: displayName, path, message, found, fix: 'correct the covariance options' });
  if (!(Number.isFinite(options.scale) && options.scale > 0)) bad('scale', 'the scale factor must be a finite positive number', String(options.scale));
  if (!(tolerance >= 0)) bad('symmetryTolerance', 'the symmetry tolerance must be zero or positive', String(tolerance));
  if (!isBlockOrder(blockOrder as string[])) bad('blockOrder', 'the block order must be a permutation of m_b, x1, color', blockOrder.join(', '));
  if (issues.hasErrors()) throw new CandelaError(issues.finish());

  const parsed = parseMatrixText(readTextLines(options.file, displayName), displayName, issues);
  if (!parsed || issues.hasErrors()) throw new CandelaError(issues.finish());
  const { size, values } = parsed;
  const count = options.expectedSupernovae;
  const expected = options.target === 'magnitudes' ? count : 3 * count;
  if (size !== expected) {
    const other = options.target === 'magnitudes' ? 3 * count : count;
    throw new CandelaError({
      code: 'covariance.wrong_size', file: displayName,
      message: `the covariance is ${size} x ${size} but the table has ${count} supernovae`,
      expected: `${expected} x ${expected} (${options.target === 'magnitudes' ? 'N' : '3N'} for target ${options.target})`,
      found: `${size} x ${size}`,
      fix: size === other
        ? `this size fits target ${options.target === 'magnitudes' ? 'light_curves' : 'magnitudes'}; change the target`
        : 'check that the covariance belongs to this table, read before any cut',
    });
  }

  let worst = { ratio: 0, i: 0, j: 0 };
  let violations = 0;
  for (let i = 0; i < size; i++) {
    for (let j = i + 1; j < size; j++) {
      const upper = values[i * size + j];
      const lower = values[j * size + i];
      const difference = Math.abs(upper - lower);
      if (difference === 0) continue;
      const reference = Math.sqrt(Math.abs(values[i * size + i] * values[j * size + j])) || Math.max(Math.abs(upper), Math.abs(lower));
      const ratio = difference / reference;
      if (ratio > tolerance) violations++;
      if (ratio > worst.ratio) worst = { ratio, i, j };
    }
  }
  if (worst.ratio > tolerance) {
    const { i, j } = worst;
    throw new CandelaError({
      code: 'covariance.not_symmetric', file: displayName, row: i + 1, column: j + 1,
      message: `the matrix is not symmetric: entry (row ${i + 1}, column ${j + 1}) differs from (row ${j + 1}, column ${i + 1}) by ${worst.ratio.toPrecision(3)} of sqrt(C_ii C_jj); ${violations} pair(s) exceed the tolerance`,
      expected: `relative difference <= ${tolerance}`,
      found: `C[${i + 1},${j + 1}] = ${values[i * size + j]}, C[${j + 1},${i + 1}] = ${values[j * size + i]}`,
      fix: 'check that the file is a covariance written row by row (not one triangle), or raise the symmetry tolerance',
    });
  }
  for (let i = 0; i < size; i++) {
    values[i * size + i] *= options.scale;
    for (let j = i + 1; j < size; j++) {
      const mean = 0.5 * (values[i * size + j] + values[j * size + i]) * options.scale;
      values[i * size + j] = mean;
      values[j * size + i] = mean;
    }
  }
  const canonical = options.target === 'light_curves'
    ? reorderLightCurveCovariance(values, count, blockOrder, options.layout ?? 'interleaved')
    : values;
  return { target: options.target, size, values: canonical, sourceFile: displayName };
}
