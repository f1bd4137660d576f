import { editDistance } from './editDistance.js';

/**
 * "Did you mean ...?" for misspelt keys, enum values and parameter names,
 * by the edit distance of math/text/editDistance.ts.
 */

/**
 * Largest distance still offered as a suggestion: one edit for words of up to
 * four letters, then one more per four letters (common practice in
 * command-line tools: close enough to be a typo, far enough to avoid noise).
 */
function acceptedDistance(length: number): number {
  return Math.max(1, Math.floor(length / 4));
}

/**
 * The candidate closest to `word` (compared case-insensitively, `-` and
 * space read as `_`), or null when none is close enough to be a typo.
 * Ties go to the earlier candidate. Cost: O(k |word| L) for k candidates of
 * length at most L.
 * @param word what the user wrote.
 * @param candidates the valid words.
 * @example closestWord('walker', ['walkers', 'ensembles']) // 'walkers'
 * @example closestWord('colour', ['color', 'x1']) // 'color'
 * @example closestWord('banana', ['walkers']) // null
 */
export function closestWord(word: string, candidates: readonly string[]): string | null {
  const normalized = word.toLowerCase().replace(/[-\s]/g, '_');
  let best: string | null = null;
  let bestDistance = Infinity;
  for (const candidate of candidates) {
    const distance = editDistance(normalized, candidate.toLowerCase());
    if (distance < bestDistance) {
      best = candidate;
      bestDistance = distance;
    }
  }
  return best !== null && bestDistance <= acceptedDistance(Math.max(normalized.length, 1)) ? best : null;
}
