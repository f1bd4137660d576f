import { closestWord } from '../math/index.js';

/**
 * "Did you mean" suggestions for misspelled column names and supernova ids:
 * a case-insensitive exact match wins outright (a column written `ZCMB` for
 * `zcmb`), otherwise the one "did you mean" rule of candela
 * (math/text/closestWord.ts: optimal-string-alignment distance, Levenshtein
 * 1966 edits plus the adjacent transpositions of Damerau 1964).
 * Cost O(|candidates| * len^2).
 * @param name the name that was not found.
 * @param candidates the names that exist.
 * @example closestName('zcbm', ['zcmb', 'zhel', 'mb']) // 'zcmb'
 */
export function closestName(name: string, candidates: readonly string[]): string | undefined {
  const lower = name.toLowerCase();
  const exact = candidates.find((candidate) => candidate.toLowerCase() === lower);
  return exact ?? closestWord(name, candidates) ?? undefined;
}
