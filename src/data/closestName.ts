/**
 * "Did you mean" suggestions for misspelled column names: the candidate at the
 * smallest optimal-string-alignment distance (Levenshtein 1966 edits plus the
 * adjacent transpositions of Damerau 1964, so 'zcbm' is one edit from 'zcmb'),
 * compared case-insensitively.
 */

/** A suggestion farther than this many edits, or than a third of the name's length, is not offered. */
const MAX_SUGGESTION_EDITS = 3;

/**
 * The candidate closest to `name`, or undefined when none is close enough.
 * A case-insensitive exact match wins outright. Cost O(|candidates| * len^2).
 * @param name the name that was not found.
 * @param candidates the names that exist.
 * @example closestName('zcbm', ['zcmb', 'zhel', 'mb']) // 'zcmb'
 */
export function closestName(name: string, candidates: readonly string[]): string | undefined {
  const lower = name.toLowerCase();
  const exact = candidates.find((candidate) => candidate.toLowerCase() === lower);
  if (exact !== undefined) return exact;
  const limit = Math.min(MAX_SUGGESTION_EDITS, Math.max(1, Math.floor(name.length / 3)));
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    const distance = editDistance(lower, candidate.toLowerCase());
    if (distance < bestDistance) {
      bestDistance = distance;
      best = candidate;
    }
  }
  return bestDistance <= limit ? best : undefined;
}

function editDistance(a: string, b: string): number {
  const rows = a.length + 1;
  const cols = b.length + 1;
  const table = new Int32Array(rows * cols);
  for (let i = 0; i < rows; i++) table[i * cols] = i;
  for (let j = 0; j < cols; j++) table[j] = j;
  for (let i = 1; i < rows; i++) {
    for (let j = 1; j < cols; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(table[(i - 1) * cols + j] + 1, table[i * cols + j - 1] + 1, table[(i - 1) * cols + j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) best = Math.min(best, table[(i - 2) * cols + j - 2] + 1);
      table[i * cols + j] = best;
    }
  }
  return table[rows * cols - 1];
}
