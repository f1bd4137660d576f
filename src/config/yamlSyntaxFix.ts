/**
 * The fix to print for a YAML syntax error. The yaml package reports several
 * different mistakes under one code (a wrongly indented key and an unclosed
 * quote are both MISSING_CHAR), so the hint looks at the code, the
 * package's message and the offending line, and names the likely mistake.
 */

/** What the hint needs to know about one error of the yaml package. */
export interface YamlSyntaxError {
  /** The yaml package's error code, e.g. `MISSING_CHAR`, `BAD_INDENT`. */
  code: string;
  /** The yaml package's message (first line). */
  message: string;
  /** The text of the line the error starts on. */
  lineText: string;
  /** The text of the nearest non-blank, non-comment line above it ('' for none). */
  previousText: string;
}

/** Leading spaces of a line. */
function indentOf(text: string): number {
  return text.length - text.trimStart().length;
}

/** Words for an indentation mismatch between this line and the one above. */
function indentationFix(error: YamlSyntaxError): string {
  const here = indentOf(error.lineText);
  const above = indentOf(error.previousText.replace(/^(\s*)- /, '$1  '));
  const compared = here > above ? `indented more (${here} spaces) than the line above (${above})`
    : here < above ? `indented less (${here} spaces) than the line above (${above})` : `indented by ${here} spaces`;
  return `this line is ${compared}: give keys of one block the same indentation (spaces only), start a new list item with "- ", `
    + 'and nest a key under a parent only when the parent has no value on its own line';
}

/**
 * The fix for one YAML syntax error, in words.
 * @param error the error, with the line it starts on and the line above.
 * @returns one sentence saying what to change.
 * @example yamlSyntaxFix({ code: 'MISSING_CHAR', message: 'Sequence item without - indicator', lineText: '   table: x', previousText: '    kind: magnitudes' })
 * // 'this line is indented less (3 spaces) than the line above (4): ...'
 */
export function yamlSyntaxFix(error: YamlSyntaxError): string {
  const { code, message } = error;
  if (code === 'TAB_AS_INDENT') return 'indent with spaces, not tabs';
  if (code === 'DUPLICATE_KEY') return 'keep only one of the two entries with this key';
  if (code === 'MULTIPLE_DOCS') return 'keep one document per file (remove the extra "---")';
  if (/quote/i.test(message)) return 'close the quote opened on this line with the same quote character';
  if (/end with a \]/.test(message)) return 'close the "[" opened on this line with "]" before the next key';
  if (/end with a \}/.test(message)) return 'close the "{" opened on this line with "}" before the next key';
  const trimmed = error.lineText.trim();
  if (/followed by map values/.test(message) || (code === 'MULTILINE_IMPLICIT_KEY' && trimmed !== '' && !trimmed.includes(':') && !trimmed.startsWith('-'))) {
    return 'write each setting as "key: value", with a colon and a space after the key';
  }
  if (/indent|without - indicator|compact mappings|implicit key/i.test(message) || code === 'BAD_INDENT') return indentationFix(error);
  if (code === 'MISSING_CHAR') return 'close the bracket, brace or quote that was opened on this line';
  return 'check the indentation, the ":" after each key and matching quotes and brackets near this position';
}

/**
 * The line a key-nesting error really belongs to. For `walkers: 8` followed
 * by a more indented `max_steps: 10`, the yaml package points at the value
 * `8`; the mistake is the indentation of the next line, so that line is
 * returned. Otherwise `line` itself.
 * @param lines the text's lines (index 0 is line 1).
 * @param line the 1-based line the yaml package reported.
 * @param code the yaml package's error code.
 * @example lineOfNestingError(['sampler:', '  walkers: 8', '    max_steps: 10'], 2, 'BLOCK_AS_IMPLICIT_KEY') // 3
 */
export function lineOfNestingError(lines: readonly string[], line: number, code: string): number {
  if (code !== 'BLOCK_AS_IMPLICIT_KEY' && code !== 'MULTILINE_IMPLICIT_KEY') return line;
  const here = lines[line - 1] ?? '';
  if (!/:\s*\S/.test(here)) return line;
  for (let k = line; k < lines.length; k++) {
    if (lines[k].trim() === '' || lines[k].trimStart().startsWith('#')) continue;
    return indentOf(lines[k]) > indentOf(here) ? k + 1 : line;
  }
  return line;
}
