/**
 * The true parameter values recorded in a mock survey's truth.json (as
 * mockTruthJson writes it): the finite numbers under `truth`, by parameter
 * name (omega_m, w0, wa, h0, alpha, ...); the words beside them
 * (dark_energy, curvature) and anything not a finite number are left out.
 *
 * Cost: one JSON parse of the text.
 * @param text the truth.json text.
 * @returns the values by parameter name (empty when there is no `truth`).
 * @throws SyntaxError when the text is not JSON; Error when it is JSON but not an object.
 * @example mockTruthValues('{"truth":{"dark_energy":"cpl","omega_m":0.315}}') // { omega_m: 0.315 }
 */
export function mockTruthValues(text: string): Record<string, number> {
  const document = JSON.parse(text) as unknown;
  if (typeof document !== 'object' || document === null || Array.isArray(document)) throw new Error('the truth file holds no JSON object');
  const truth = (document as { truth?: Record<string, unknown> }).truth ?? {};
  return Object.fromEntries(Object.entries(truth).filter((entry): entry is [string, number] => typeof entry[1] === 'number' && Number.isFinite(entry[1])));
}
