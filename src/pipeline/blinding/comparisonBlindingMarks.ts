import { BLINDED_MARK } from '../../output/index.js';
import { blindedParametersOf, type RunBlindingSection } from './runBlinding.js';

/** How the comparison files say that some compared runs are blinded; unchanged texts when none is. */
export interface ComparisonBlindingMarks {
  /** The notice (which runs, which parameters, what is withheld), or null when no run is blinded. */
  notice: string | null;
  /** comparison.json: a `blinding` entry appended (the blinded runs and their parameters, what is withheld). */
  document<T extends object>(document: T): T;
  /** comparison.md: the notice as a first paragraph. */
  markdown(text: string): string;
  /** comparison.tex: the notice as a first comment line. */
  latex(text: string): string;
}

/**
 * The marks of `candela compare`'s files when any compared run is blinded
 * (docs/blinding.md): which runs, which parameters, and what the comparison
 * withholds for them (the Savage-Dickey ratio of a blinded extra parameter,
 * their DIC, the dark-energy figures).
 * Cost: O(runs).
 * @param records the compared runs' records, as read back.
 * @returns the marks.
 * @throws nothing.
 * @example comparisonBlindingMarks([record]).markdown('x') // '> BLINDED: flat_wcdm (omega_m, w0) ...\n\nx'
 */
export function comparisonBlindingMarks(records: ReadonlyArray<{ model: { label: string }; blinding?: RunBlindingSection }>): ComparisonBlindingMarks {
  const blinded = records.map((record) => ({ model: record.model.label, parameters: blindedParametersOf(record) })).filter((entry) => entry.parameters.length > 0);
  if (blinded.length === 0) return { notice: null, document: (document) => document, markdown: (text) => text, latex: (text) => text };
  const withheld = [
    'the Savage-Dickey ratio of a nested pair whose extra parameter is blinded',
    'the DIC of a blinded run (it needs the likelihood at the true posterior mean)',
    'the dark-energy figures',
  ];
  const notice = `${BLINDED_MARK}: ${blinded.map((entry) => `${entry.model} (${entry.parameters.join(', ')})`).join('; ')} shown as true value + a secret offset; withheld: ${withheld.join('; ')}. Chi-square, AIC and BIC do not depend on the offsets. \`candela unblind RUN\` shows the true values.`;
  return {
    notice,
    document: (document) => ({ ...document, blinding: { runs: blinded, notice, withheld } }),
    markdown: (text) => `> ${notice}\n\n${text}`,
    latex: (text) => `% ${notice}\n${text}`,
  };
}
