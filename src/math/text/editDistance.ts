/**
 * Edit distance with adjacent transpositions, in the restricted
 * ("optimal string alignment") form of Damerau (1964, "A technique for
 * computer detection and correction of spelling errors", Comm. ACM 7, 171)
 * and Levenshtein (1966, "Binary codes capable of correcting deletions,
 * insertions, and reversals", Soviet Physics Doklady 10, 707): insertions,
 * deletions, substitutions and swaps of two neighbours each cost 1, and no
 * substring is edited twice. Case-sensitive: callers fold case first when
 * they want to ignore it.
 *
 * Cost: O(|a| |b|) time, O(|b|) memory (three rolling rows).
 * @param a first word.
 * @param b second word.
 * @returns the number of edits turning a into b (a count, >= 0).
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
