/**
 * Splitting one text line into fields, remembering where each field starts so
 * that messages can point at `file:line:column`. Hand-written rather than
 * built on a CSV package because the readers are synchronous, must keep the
 * original line numbers (comment and blank lines included) and also need a
 * whitespace splitter; quoted CSV fields (RFC 4180 quoting, no line breaks
 * inside quotes) are handled here.
 */

/** How fields are separated on a line. */
export type Delimiter = 'comma' | 'tab' | 'whitespace';

/** One field of a line: its text (unquoted, trimmed) and 1-based character column. */
export interface Field {
  text: string;
  column: number;
}

/**
 * Guesses the delimiter of a line: a tab anywhere -> tab, else a comma
 * anywhere -> comma, else whitespace. Cost O(line length).
 * @param line one line of text (a header line is the best sample).
 * @example detectDelimiter('CID,zHD,MU') // 'comma'
 */
export function detectDelimiter(line: string): Delimiter {
  if (line.includes('\t')) return 'tab';
  if (line.includes(',')) return 'comma';
  return 'whitespace';
}

/**
 * Splits `line` into fields. Whitespace: runs of blanks separate fields and
 * leading/trailing blanks are ignored. Tab and comma: every separator counts
 * (two in a row give an empty field) and each field is trimmed; for comma a
 * field may be wrapped in double quotes, with `""` standing for one quote.
 * Cost O(line length). Never throws.
 * @param line the text of one line, without its line break.
 * @param delimiter the separator kind.
 * @example splitFields('a, "b,c" ,d', 'comma').map((f) => f.text) // ['a', 'b,c', 'd']
 */
export function splitFields(line: string, delimiter: Delimiter): Field[] {
  if (delimiter === 'whitespace') {
    const fields: Field[] = [];
    for (const match of line.matchAll(/\S+/g)) fields.push({ text: match[0], column: (match.index ?? 0) + 1 });
    return fields;
  }
  if (delimiter === 'tab') return splitOnCharacter(line, '\t');
  return splitQuotedCsv(line);
}

function splitOnCharacter(line: string, separator: string): Field[] {
  const fields: Field[] = [];
  let start = 0;
  for (;;) {
    const end = line.indexOf(separator, start);
    const piece = line.slice(start, end < 0 ? line.length : end);
    const lead = piece.length - piece.trimStart().length;
    fields.push({ text: piece.trim(), column: start + lead + 1 });
    if (end < 0) return fields;
    start = end + 1;
  }
}

function splitQuotedCsv(line: string): Field[] {
  const fields: Field[] = [];
  let position = 0;
  for (;;) {
    while (position < line.length && (line[position] === ' ' || line[position] === '\t')) position++;
    const column = position + 1;
    let text = '';
    if (line[position] === '"') {
      position++;
      while (position < line.length) {
        if (line[position] === '"') {
          if (line[position + 1] === '"') {
            text += '"';
            position += 2;
            continue;
          }
          position++;
          break;
        }
        text += line[position++];
      }
      const comma = line.indexOf(',', position);
      position = comma < 0 ? line.length : comma;
    } else {
      const comma = line.indexOf(',', position);
      const end = comma < 0 ? line.length : comma;
      text = line.slice(position, end).trim();
      position = end;
    }
    fields.push({ text, column });
    if (position >= line.length) return fields;
    position++; // skip the comma
  }
}
