import { fixedText, pValueText, shortReading, signedText, valueAndError } from './formatComparisonCells.js';
import type { ModelComparison } from './modelComparison.js';

const DASH = '-';

function cell(text: string | null): string {
  return text === null ? DASH : text.replace(/\|/g, '\\|');
}

function table(header: string[], alignment: string[], body: string[][]): string[] {
  return [`| ${header.join(' | ')} |`, `| ${alignment.join(' | ')} |`, ...body.map((row) => `| ${row.join(' | ')} |`)];
}

/**
 * A model comparison as Markdown: the model table (model, k, chi2_min,
 * delta AIC, delta BIC, delta DIC, ln Z +- error, ln B against the base with
 * error, a short reading), then the nested-pair table when there are pairs
 * (delta chi2, p-value, Gaussian equivalent, Savage-Dickey ln B_01), then the
 * notes as a bullet list. Absent values print as "-". Layout is candela's own.
 *
 * Cost: O(models + pairs).
 * @param comparison From compareModels.
 * @returns GitHub-flavoured Markdown text ending in a newline.
 * @example comparisonMarkdown(report.comparison).split('\n')[0] // '| Model | k | chi2_min | ...'
 */
export function comparisonMarkdown(comparison: ModelComparison): string {
  const base = comparison.baseLabel;
  const lines = table(
    ['Model', 'k', 'chi2_min', 'Delta AIC', 'Delta BIC', 'Delta DIC', 'ln Z', `ln B vs ${cell(base)}`, 'Reading'],
    [':--', '--:', '--:', '--:', '--:', '--:', '--:', '--:', ':--'],
    comparison.rows.map((row) => {
      const evidence = valueAndError(row.logZ, row.logZError);
      const factor = row.isBase ? null : valueAndError(row.logBayesFactor, row.logBayesFactorError);
      const marker = row.bayesFactorSource === 'savage-dickey' ? ' (Savage-Dickey)' : '';
      return [
        cell(row.isBase ? `${row.label} (base)` : row.label),
        String(row.freeParameterCount),
        cell(fixedText(row.chiSquareMinimum)),
        cell(signedText(row.deltaAic)),
        cell(signedText(row.deltaBic)),
        cell(signedText(row.deltaDic)),
        evidence ? `${evidence[0]} ± ${evidence[1]}` : DASH,
        factor ? `${signedText(row.logBayesFactor)} ± ${factor[1]}${marker}` : DASH,
        cell(shortReading(row, base)),
      ];
    }),
  );
  if (comparison.nested.length > 0) {
    lines.push('');
    lines.push(
      ...table(
        ['Nested pair', 'm', 'Delta chi2', 'p-value', 'Gaussian equivalent', 'Savage-Dickey ln B01'],
        [':--', '--:', '--:', '--:', '--:', '--:'],
        comparison.nested.map((pair) => [
          cell(`${pair.extended} over ${pair.base}`),
          String(pair.extraParameters),
          pair.deltaChiSquare.toFixed(2),
          pValueText(pair.pValue),
          `${pair.sigma.toFixed(2)} sigma`,
          pair.savageDickeyLogBayesFactor === null ? DASH : `${signedText(pair.savageDickeyLogBayesFactor)} ± ${(pair.savageDickeyError ?? 0).toFixed(2)}`,
        ]),
      ),
    );
  }
  lines.push('', ...comparison.notes.map((note) => `- ${note}`));
  return `${lines.join('\n')}\n`;
}
