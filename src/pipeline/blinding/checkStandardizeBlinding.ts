import type { CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';

/**
 * `candela standardize` fits every parameter not given with --at and prints
 * the best fit and the model column: for a blinded configuration that would
 * show the true values of the blinded parameters. It is refused unless each
 * blinded parameter the model samples is given with --at (then nothing
 * blinded is fitted).
 * Cost: O(parameters).
 * @param config the configuration.
 * @param sampled the model's sampled parameter names.
 * @param given the names given with --at.
 * @throws CandelaError `blinding.standardize_refused` at key `blinding`, naming the parameters and the fix.
 * @example checkStandardizeBlinding(config, ['omega_m', 'w0'], ['omega_m', 'w0']) // no throw
 */
export function checkStandardizeBlinding(config: CandelaConfig, sampled: readonly string[], given: readonly string[]): void {
  const fitted = (config.blinding?.parameters ?? []).filter((name) => sampled.includes(name) && !given.includes(name));
  if (fitted.length === 0) return;
  const position = config.source.positions.blinding;
  throw new CandelaError({
    code: 'blinding.standardize_refused', file: config.source.file.written, ...(position ? { line: position.line, column: position.column } : {}), path: 'blinding',
    message: `this configuration is blinded: standardize would fit and print the true best fit of ${fitted.join(', ')}`,
    fix: `give them with ${fitted.map((name) => `--at ${name}=...`).join(' ')}, or run standardize on a copy without the blinding block once the analysis may be unblinded`,
  });
}
