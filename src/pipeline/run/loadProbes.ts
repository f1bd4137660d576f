import type { CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';
import { probeDefinition, type LoadedProbe, type ProbeBlock } from '../../probes/index.js';
import { pointAtConfigKey } from './pointAtConfigKey.js';

/** One configured probe with its data loaded. */
export interface ProbeData {
  block: ProbeBlock;
  loaded: LoadedProbe;
}

const cache = new WeakMap<CandelaConfig, ProbeData[]>();

/**
 * Reads the data of every probe of a configuration (once per configuration
 * object: every model and every worker thread's copy reuses it).
 * @throws CandelaError from a probe's loader, naming file, row and fix; a
 *   missing, folder or binary file is named by its key (`probes.bao.table`) and line.
 */
export function loadProbes(config: CandelaConfig): ProbeData[] {
  const known = cache.get(config);
  if (known) return known;
  const loaded = config.probes.map((block) => ({ block, loaded: loadProbe(config, block) }));
  cache.set(config, loaded);
  return loaded;
}

/** Every file the probes read, as written and resolved (for checksums). */
export function probeInputFiles(config: CandelaConfig): Array<{ written: string; resolved: string }> {
  return config.probes.flatMap((block) => Object.entries(block.writtenPaths).map(([key, written]) => ({ written, resolved: String(block.settings[key]) })));
}

/** One probe's data; a whole-file problem is moved to the configuration key that names the file. */
function loadProbe(config: CandelaConfig, block: ProbeBlock): LoadedProbe {
  try {
    return probeDefinition(block.key).load(block);
  } catch (error) {
    if (!(error instanceof CandelaError)) throw error;
    throw new CandelaError(error.issues.map((issue) => {
      const key = Object.keys(block.writtenPaths).find((name) => block.writtenPaths[name] === issue.file);
      return key ? pointAtConfigKey(issue, config, `${block.key} ${key}`, [`probes.${block.key}.${key}`]) : issue;
    }));
  }
}
