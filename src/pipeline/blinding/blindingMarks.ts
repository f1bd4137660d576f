import { BLINDED_MARK, blindingNotice, escapeLatexText, markSvgBlinded } from '../../output/index.js';
import { blindedParametersOf, WITHHELD_WHILE_BLINDED, type RunBlindingSection } from './runBlinding.js';

/** How each page of a run's outputs says that it is blinded; every function returns its input unchanged for a run that is not. */
export interface BlindingMarks {
  /** summary.json: a `blinding` entry appended (parameters, notice, what is withheld). */
  summaryJson<T extends object>(document: T): T;
  /** summary.md: the notice as a first paragraph. */
  markdown(text: string): string;
  /** table.tex: the notice as a first comment line and in the table's last row note. */
  latex(text: string): string;
  /** A figure: the BLINDED stamp (markSvgBlinded). */
  svg(text: string): string;
  /** The report page's title: "(BLINDED)" appended. */
  title(text: string): string;
}

/**
 * The marks of a run's outputs: while run.json's `blinding.state` is
 * `blinded`, every page says so (docs/blinding.md); otherwise nothing
 * changes, so an unblinded run's outputs are those of a run never blinded.
 * Cost: O(1) to build; each mark is one pass over its text.
 * @param record run.json as read back.
 * @returns the marks.
 * @throws nothing.
 * @example blindingMarks(record).markdown('| a |') // '> BLINDED: ...\n\n| a |' for a blinded run
 */
export function blindingMarks(record: { blinding?: RunBlindingSection }): BlindingMarks {
  const parameters = blindedParametersOf(record);
  if (parameters.length === 0) {
    return { summaryJson: (document) => document, markdown: (text) => text, latex: (text) => text, svg: (text) => text, title: (text) => text };
  }
  const notice = blindingNotice(parameters);
  return {
    summaryJson: (document) => ({ ...document, blinding: { state: 'blinded', parameters, notice, withheld: [...WITHHELD_WHILE_BLINDED] } }),
    markdown: (text) => `> ${notice}\n\n${text}`,
    latex: (text) => `% ${notice}\n${latexRow(text, parameters)}`,
    svg: (text) => markSvgBlinded(text, parameters),
    title: (text) => `${text} (${BLINDED_MARK})`,
  };
}

/** A visible last row of the LaTeX table (a comment alone would vanish from a pasted table). */
function latexRow(text: string, parameters: readonly string[]): string {
  const columns = /\\begin\{tabular\}\{([a-z|]+)\}/.exec(text)?.[1].replace(/\|/g, '').length;
  const end = text.lastIndexOf('\\end{tabular}');
  if (!columns || end < 0) return text;
  const row = `\\multicolumn{${columns}}{l}{\\footnotesize \\textbf{${BLINDED_MARK}}: ${escapeLatexText(parameters.join(', '))} shown as true value + a secret offset} \\\\\n`;
  return `${text.slice(0, end)}${row}${text.slice(end)}`;
}

/**
 * The marks of a page that shows several runs (the models index, the overlay
 * of `candela report` with several folders): blinded when any of them is,
 * listing every parameter blinded in one of them.
 * Cost: O(runs x parameters).
 * @param records the runs' records, as read back.
 * @returns the marks (unchanged texts when no run is blinded).
 * @throws nothing.
 * @example blindingMarksOfRuns([lcdm, wcdm]).title('Models') // 'Models (BLINDED)' when wcdm is blinded
 */
export function blindingMarksOfRuns(records: ReadonlyArray<{ blinding?: RunBlindingSection }>): BlindingMarks {
  const parameters = [...new Set(records.flatMap((record) => blindedParametersOf(record)))];
  const first = records.find((record) => blindedParametersOf(record).length > 0)?.blinding;
  return blindingMarks(first ? { blinding: { ...first, parameters } } : {});
}
