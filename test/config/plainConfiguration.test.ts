import { describe, expect, it } from 'vitest';
import { configToPlainObject, loadConfigFile, plainConfiguration } from '../../src/config/index.js';

// The typed view of a stored configuration must name the keys the writer writes (identity check of candela's own
// run.json format: the readers of report and compare get the demo's values, not their defaults).
describe('plainConfiguration', () => {
  it('reads back the keys configToPlainObject writes for the Kestrel demo, with their values', () => {
    const config = loadConfigFile('configs/demo.yaml');
    const stored = plainConfiguration(JSON.parse(JSON.stringify(configToPlainObject(config))));
    expect(stored.models?.map((model) => model.label)).toEqual(config.models.map((model) => model.label));
    expect(stored.supernovae?.[0].table?.file).toBe(config.supernovae[0].table.file.resolved);
    expect(stored.output?.png).toBe(config.output.png);
    expect(stored.output?.figures).toEqual(config.output.figures);
    expect(stored.output?.smoothing?.factor).toBe(config.output.smoothing.factor);
    expect(stored.output?.contour_pairs).toEqual(config.output.contourPairs === 'auto' ? 'auto' : config.output.contourPairs);
    expect(stored.standardization?.host_mass_step?.split_log_mass).toBe(config.standardization.hostMassStep.splitLogMass);
    expect(stored.output?.chain_memory_mb).toBeUndefined(); // not set in the demo: the reader's default applies
  });

  it('reads anything that is not an object as an empty configuration', () => {
    expect(plainConfiguration(null)).toEqual({});
    expect(plainConfiguration([1, 2])).toEqual({});
    expect(plainConfiguration('text')).toEqual({});
  });
});
