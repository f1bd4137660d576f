/**
 * Householder QR of a tall row-major matrix, applied to one extra vector
 * (Golub & Van Loan, Matrix Computations, 4th ed., algorithms 5.1.1 and 5.2.1).
 * Used to turn a whitened linear model e ~ Z q into the exact identity
 *
 *   |e - Z q|^2 = rho^2 + |f - R q|^2,   f = (Q^T e)[0..P),  rho^2 = |(Q^T e)[P..N)|^2,
 *
 * with R upper triangular P x P. Each chi-square is then a sum of squares of
 * P numbers, with no cancellation between large terms. Rank-deficient Z is
 * fine: R then has zero rows, and the identity still holds because Q is orthogonal.
 */

/** Result of {@link householderReduce}. */
export interface ReducedLeastSquares {
  /** Number of columns P. */
  columns: number;
  /** Row-major P x P upper-triangular R. */
  upper: Float64Array;
  /** f = first P entries of Q^T e. */
  projected: Float64Array;
  /** rho^2 = squared norm of the rest of Q^T e (the part no q can fit). */
  residualSquare: number;
}

/**
 * Reduces (Z, e) in place: `design` (rows x columns, row-major) is destroyed,
 * `target` (length rows) is overwritten by Q^T e.
 * Cost: 2 rows columns^2 multiply-adds. Requires rows >= columns.
 * @param design Z, row-major rows x columns
 * @param rows N
 * @param columns P
 * @param target e, length N
 * @example householderReduce(Float64Array.of(1, 1), 2, 1, Float64Array.of(1, 3)) // residualSquare 2, |f| = 2 sqrt 2
 */
export function householderReduce(design: Float64Array, rows: number, columns: number, target: Float64Array): ReducedLeastSquares {
  const vector = new Float64Array(rows);
  for (let col = 0; col < columns; col++) {
    let norm = 0;
    let scale = 0;
    for (let i = col; i < rows; i++) scale = Math.max(scale, Math.abs(design[i * columns + col]));
    if (scale === 0) continue; // zero column below the diagonal: nothing to reflect
    for (let i = col; i < rows; i++) {
      const value = design[i * columns + col] / scale;
      vector[i] = value;
      norm += value * value;
    }
    norm = Math.sqrt(norm);
    const head = vector[col];
    const alpha = head > 0 ? -norm : norm;
    vector[col] = head - alpha;
    const vectorNormSquare = norm * norm - head * head + vector[col] * vector[col];
    if (vectorNormSquare === 0) continue;
    // Apply H = I - 2 v v^T / (v^T v) to the remaining columns and to the target.
    for (let j = col; j < columns; j++) {
      let dot = 0;
      for (let i = col; i < rows; i++) dot += vector[i] * design[i * columns + j];
      const factor = (2 * dot) / vectorNormSquare;
      for (let i = col; i < rows; i++) design[i * columns + j] -= factor * vector[i];
    }
    let dot = 0;
    for (let i = col; i < rows; i++) dot += vector[i] * target[i];
    const factor = (2 * dot) / vectorNormSquare;
    for (let i = col; i < rows; i++) target[i] -= factor * vector[i];
  }
  const upper = new Float64Array(columns * columns);
  for (let i = 0; i < columns; i++) for (let j = i; j < columns; j++) upper[i * columns + j] = design[i * columns + j];
  let residualSquare = 0;
  let compensation = 0;
  for (let i = columns; i < rows; i++) {
    const term = target[i] * target[i];
    const next = residualSquare + term;
    compensation += residualSquare >= term ? residualSquare - next + term : term - next + residualSquare;
    residualSquare = next;
  }
  return { columns, upper, projected: target.slice(0, columns), residualSquare: residualSquare + compensation };
}
