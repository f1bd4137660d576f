import type { ParameterSummary } from '../summaries/runSummary.js';

/** One model of a multi-model fit, as a column of the side-by-side tables (modelsLatex, modelsIndexHtml). */
export interface ModelColumn {
  /** The model's label (its run folder's name). */
  label: string;
  /** Link to the model's own report page, relative to the index page (e.g. 'flat_wcdm/report.html'). */
  link: string;
  /** The model's summary rows (one-sided limits and notes included). */
  parameters: readonly ParameterSummary[];
  /** Chi-square at the best fit (dimensionless), or null. */
  chiSquare: number | null;
  degreesOfFreedom: number;
  /** Probability of a larger chi-square for these degrees of freedom, or null. */
  pValue: number | null;
  /** Akaike (1974) and Bayesian (Schwarz 1978) information criteria, from the best fit's deviance; null without it. */
  aic: number | null;
  bic: number | null;
  /** Number of warnings of the run. */
  warningCount: number;
}

/**
 * The parameter names of several models in order of first appearance, so
 * that shared parameters line up in one row and a model without one shows a
 * dash.
 * @param models the columns.
 * @returns the union of parameter names.
 * @example parameterRowsOf([{ parameters: [a, b] }, { parameters: [a, c] }]) // ['a', 'b', 'c'] by name
 */
export function parameterRowsOf(models: readonly ModelColumn[]): string[] {
  const names: string[] = [];
  for (const model of models) for (const p of model.parameters) if (!names.includes(p.name)) names.push(p.name);
  return names;
}
