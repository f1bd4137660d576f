import { editDistance } from '../math/index.js';

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
