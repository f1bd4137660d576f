/**
 * The words every output of a blinded run carries (terminal, summary.md,
 * summary.json, table.tex, report.html, figures): one home, so that the
 * tests can look for them and every page says the same thing.
 */

/** The one-word mark (upper case, so it stands out on any page). */
export const BLINDED_MARK = 'BLINDED';

/**
 * One sentence for any page of a blinded run.
 * @param parameters the blinded parameter names, in the run's order.
 * @returns the sentence, e.g. 'BLINDED: w0, omega_m are shown as true value + a secret offset; candela unblind RUN shows the true values.'
 * @throws nothing.
 * @example blindingNotice(['w0']) // 'BLINDED: w0 is shown as true value + a secret offset; ...'
 */
export function blindingNotice(parameters: readonly string[]): string {
  const verb = parameters.length === 1 ? 'is' : 'are';
  return `${BLINDED_MARK}: ${parameters.join(', ')} ${verb} shown as true value + a secret offset (derived quantities, the Hubble-diagram model curve and probe model curves are withheld); candela unblind RUN shows the true values.`;
}
