/**
 * "Did you mean ...?" for misspelt keys, enum values and parameter names.
 */

/**
 * Edit distance with adjacent transpositions, in the restricted
 * ("optimal string alignment") form of Damerau (1964) / Levenshtein (1966):
 * insertions, deletions, substitutions and swaps of two neighbours each
 * cost 1, and no substring is edited twice. Case-sensitive.
 * Cost: O(|a| |b|) time, O(|b|) memory (three rolling rows).
 * @param a first word.
 * @param b second word.
 * @returns the number of edits turning a into b.
 * @example editDistance('walkres', 'walkers') // 1 (one swap)
 * @example editDistance('ca', 'abc') // 3 (restricted form; unrestricted gives 2)
 */
export function editDistance(a: string, b: string): number {
  const width = b.length + 1;
  let beforePrevious = new Int32Array(width);
  let previous = new Int32Array(width);
  let current = new Int32Array(width);
  for (let j = 0; j < width; j++) previous[j] = j;
  for (let i = 1; i <= a.length; i++) {
    current[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const substitution = a[i - 1] === b[j - 1] ? 0 : 1;
      let best = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + substitution);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) {
        best = Math.min(best, beforePrevious[j - 2] + 1);
      }
      current[j] = best;
    }
    [beforePrevious, previous, current] = [previous, current, beforePrevious];
  }
  return previous[b.length];
}

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
