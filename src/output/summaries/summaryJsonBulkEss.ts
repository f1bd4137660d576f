/**
 * The smallest bulk effective sample size among `parameters` in the text of
 * a summary.json (its `diagnostics.<name>.ess_bulk`, as summaryJsonDocument
 * writes it), counting only positive numbers; null when the text is not
 * JSON or no named parameter has one (e.g. a nested-sampling run, whose
 * diagnostics are null).
 *
 * Cost: one JSON parse of the text.
 * @param text the summary.json text.
 * @param parameters parameter names to look at.
 * @returns the smallest positive bulk ESS, draws, or null.
 * @throws nothing.
 * @example smallestBulkEssInSummaryJson('{"diagnostics":{"omega_m":{"ess_bulk":2500},"w0":{"ess_bulk":2100}}}', ['omega_m', 'w0']) // 2100
 */
export function smallestBulkEssInSummaryJson(text: string, parameters: readonly string[]): number | null {
  let summary: { diagnostics?: Record<string, { ess_bulk?: unknown } | null> } | null;
  try {
    summary = JSON.parse(text) as typeof summary;
  } catch {
    return null;
  }
  const values = parameters.map((name) => summary?.diagnostics?.[name]?.ess_bulk).filter((value): value is number => typeof value === 'number' && value > 0);
  return values.length > 0 ? Math.min(...values) : null;
}
