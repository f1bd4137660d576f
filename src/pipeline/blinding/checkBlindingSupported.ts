import type { CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';

/**
 * Refuses a blinded fit that candela cannot blind yet: nested sampling
 * (its weighted chains are written by another path) and cluster parts
 * (`fit --part`, merged by `candela merge`). Checked before any file is touched.
 * Cost: O(1).
 * @param config the configuration.
 * @param isPart whether this fit runs one part of a cluster plan.
 * @throws CandelaError `blinding.unsupported` at key `blinding`, with the fix.
 * @example checkBlindingSupported(config, false) // no throw for an ensemble fit
 */
export function checkBlindingSupported(config: CandelaConfig, isPart: boolean): void {
  if (!config.blinding) return;
  const position = config.source.positions.blinding;
  const where = { file: config.source.file.written, ...(position ? { line: position.line, column: position.column } : {}), path: 'blinding' };
  if (config.sampler.method === 'nested') {
    throw new CandelaError({
      code: 'blinding.unsupported', ...where, message: 'blinding is not supported with nested sampling yet',
      expected: 'sampler.method: ensemble with a blinding block', found: 'sampler.method: nested', fix: 'use sampler.method: ensemble, or remove the blinding block',
    });
  }
  if (isPart) {
    throw new CandelaError({
      code: 'blinding.unsupported', ...where, message: 'blinding is not supported for cluster parts (fit --part, candela merge) yet',
      found: '--part with a blinding block', fix: 'fit the blinded configuration in one run (without --part), or remove the blinding block',
    });
  }
}
