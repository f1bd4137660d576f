import { BAO_PROBE } from './bao/index.js';
import { CMB_PROBE } from './cmb/index.js';
import type { ProbeDefinition } from './probeDefinition.js';

/**
 * Every probe candela can combine with (or use instead of) the supernovae.
 * Adding one is a folder with its definition plus one line here; the
 * configuration accepts exactly these keys under `probes:`.
 */
export const PROBES: readonly ProbeDefinition[] = [
  BAO_PROBE,
  CMB_PROBE,
];

/**
 * The definition of a probe by its key.
 * @throws RangeError for a key outside the registry (validated configurations never have one).
 * @example probeDefinition('bao').title // 'BAO distances'
 */
export function probeDefinition(key: string): ProbeDefinition {
  const found = PROBES.find((probe) => probe.key === key);
  if (!found) throw new RangeError(`unknown probe '${key}'`);
  return found;
}
