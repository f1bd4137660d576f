import type { CandelaConfig } from '../config/index.js';
import { probeDefinition, type LoadedProbe, type ProbeBlock } from '../probes/index.js';

/** One configured probe with its data loaded. */
export interface ProbeData {
  block: ProbeBlock;
  loaded: LoadedProbe;
}

const cache = new WeakMap<CandelaConfig, ProbeData[]>();

/**
 * Reads the data of every probe of a configuration (once per configuration
 * object: every model and every worker thread's copy reuses it).
 * @throws CandelaError from a probe's loader, naming file, row and fix.
 */
export function loadProbes(config: CandelaConfig): ProbeData[] {
  const known = cache.get(config);
  if (known) return known;
  const loaded = config.probes.map((block) => ({ block, loaded: probeDefinition(block.key).load(block) }));
  cache.set(config, loaded);
  return loaded;
}

/** Every file the probes read, as written and resolved (for checksums). */
export function probeInputFiles(config: CandelaConfig): Array<{ written: string; resolved: string }> {
  return config.probes.flatMap((block) => Object.entries(block.writtenPaths).map(([key, written]) => ({ written, resolved: String(block.settings[key]) })));
}
