import type { ComparisonJson } from './comparisonJson.js';

function fixed(value: number | null, digits = 2): string {
  return value === null ? '-' : value.toFixed(digits);
}

/**
 * A notice that comparison.md puts first when any model has no DIC: one
 * line per such model with the reason, so a missing DIC is never silent.
 * Cost: O(models).
 * @param document comparison.json's content.
 * @returns Markdown text ending in a blank line, or '' when every model has its DIC.
 * @throws nothing.
 * @example dicMissingNotice(document) // '> **Warning: DIC missing** for flat_wcdm: ...\n\n'
 */
export function dicMissingNotice(document: ComparisonJson): string {
  const missing = document.models.filter((model) => model.dic_missing !== null);
  if (missing.length === 0) return '';
  const lines = missing.map((model) => `> **Warning: DIC missing** for ${model.label}: ${model.dic_missing}.`);
  return `${lines.join('\n>\n')}\n\n`;
}

/**
 * The parts of comparison.md that follow the compare layer's tables: the
 * absolute criteria per model (N, k, chi-square, AIC, BIC, DIC, p_D; a
 * missing DIC reads MISSING), the Bayes factor of each nested pair two ways
 * (Savage-Dickey and evidences, with their difference in units of the
 * combined error), and the changed input files and warnings.
 *
 * Cost: O(models + pairs).
 * @param document comparison.json's content.
 * @returns Markdown text starting with a blank line and ending in a newline.
 * @throws nothing.
 * @example comparisonMarkdownDetails(document).includes('## Criteria') // true
 */
export function comparisonMarkdownDetails(document: ComparisonJson): string {
  const lines = ['', '## Criteria', '', '| Model | N | k | chi2 (best fit) | AIC | BIC | DIC | p_D | sampler |', '| :-- | --: | --: | --: | --: | --: | --: | --: | :-- |'];
  for (const model of document.models) {
    lines.push(`| ${model.label} | ${model.n_data} | ${model.k_free} | ${fixed(model.chi_square_best_fit)} | ${fixed(model.aic)} | ${fixed(model.bic)} | ${model.dic_missing === null ? fixed(model.dic) : 'MISSING'} | ${fixed(model.dic_effective_parameters)} | ${model.sampler} |`);
  }
  if (document.nested_pairs.length > 0) {
    lines.push('', '## Nested pairs: ln B01 two ways', '', '| Pair | fixed in base | Savage-Dickey ln B01 | evidences ln B01 | difference / error |', '| :-- | :-- | --: | --: | --: |');
    for (const pair of document.nested_pairs) {
      const fixedValues = Object.entries(pair.fixed_in_base).map(([name, value]) => `${name} = ${value}`).join(', ');
      const sd = 'log_bayes_factor_01' in pair.savage_dickey ? pair.savage_dickey : null;
      const evidence = pair.evidence_log_bayes_factor_01;
      const combined = sd && evidence ? Math.hypot(sd.error, evidence.error) : null;
      const pull = sd && evidence && combined ? `${((sd.log_bayes_factor_01 - evidence.value) / combined).toFixed(2)}` : '-';
      lines.push(`| ${pair.extended} over ${pair.base} | ${fixedValues} | ${sd ? `${sd.log_bayes_factor_01.toFixed(2)} ± ${sd.error.toFixed(2)}` : `- (${'unavailable' in pair.savage_dickey ? pair.savage_dickey.unavailable : ''})`} | ${evidence ? `${evidence.value.toFixed(2)} ± ${evidence.error.toFixed(2)}` : '-'} | ${pull} |`);
      if (pair.prior_mismatches.length > 0) lines.push('', `Priors of ${pair.prior_mismatches.join(', ')} differ between ${pair.base} and ${pair.extended}: the Savage-Dickey ratio then does not equal the Bayes factor exactly.`);
    }
  }
  if (document.changed_inputs.length > 0) {
    lines.push('', '## Changed input files', '');
    for (const change of document.changed_inputs) lines.push(`- ${change.model}: ${change.path} has SHA-256 ${change.current}, the fit recorded ${change.recorded ?? 'none'}`);
  }
  if (document.warnings.length > 0) {
    lines.push('', '## Warnings', '');
    for (const warning of document.warnings) lines.push(`- ${warning}`);
  }
  return `${lines.join('\n')}\n`;
}
