/**
 * Labels of data sets and models: they name output folders, files and
 * per-sample parameters, so they are restricted to safe characters.
 */
import type { ConfigReader, Located } from './configReader.js';

/** Labels name output files and per-sample parameters: letters, digits, `_`, `.`, `-`. */
export const LABEL_PATTERN = /^[A-Za-z0-9][A-Za-z0-9_.-]*$/;

/**
 * Reads a label (data set or model): text matching LABEL_PATTERN. A label
 * that does not match is reported with a cleaned-up suggestion.
 * @param reader the document reader.
 * @param at the `label` value (absent: the fallback).
 * @param fallback the label used when absent or invalid.
 * @example readLabel(reader, at, 'main') // 'jla'
 */
export function readLabel(reader: ConfigReader, at: Located | undefined, fallback: string): string {
  const label = reader.text(at, { numbersAsText: true });
  if (typeof label !== 'string') return fallback;
  if (!LABEL_PATTERN.test(label)) {
    reader.report(at!, 'config.bad_label', `label "${label}" cannot name files and parameters`, {
      expected: 'letters, digits, "_", "." or "-", starting with a letter or digit', found: `"${label}"`,
      fix: `write e.g. "${label.replace(/[^A-Za-z0-9_.-]+/g, '_').replace(/^[_.-]+/, '') || fallback}"`,
    });
    return fallback;
  }
  return label;
}
