import { describe, expect, it } from 'vitest';
import { loadConfigFile, readConfigFile } from '../../src/config/index.js';
import { CandelaError, isCandelaError } from '../../src/errors.js';

describe('loadConfigFile', () => {
  it('returns the configuration of a valid file', () => {
    const config = loadConfigFile('test/fixtures/config/minimal-light-curves.yaml');
    expect(config.supernovae[0].kind).toBe('light_curves');
    expect(config.source.file.written).toBe('test/fixtures/config/minimal-light-curves.yaml');
  });

  it('throws one CandelaError listing every problem of an invalid file', () => {
    let caught: unknown;
    try {
      loadConfigFile('test/fixtures/config/several-errors.yaml');
    } catch (error) {
      caught = error;
    }
    expect(isCandelaError(caught)).toBe(true);
    const issues = (caught as CandelaError).issues.filter((issue) => issue.severity !== 'warning');
    // The fixture holds four mistakes on lines 5, 9, 12 and 14 (see its comments); the
    // misspelt key on line 5 also leaves the required table.file missing.
    expect(issues.map((issue) => [issue.line, issue.path])).toEqual([
      [5, 'supernovae[0].table.delimter'],
      [5, 'supernovae[0].table.file'],
      [9, 'standardization.scatter.lensing_per_redshift'],
      [12, 'parameters.beta'],
      [14, 'sampler.walkers'],
    ]);
    expect(issues.every((issue) => issue.file === 'test/fixtures/config/several-errors.yaml')).toBe(true);
  });

  it('reports a missing file as a problem with a fix', () => {
    const result = readConfigFile('test/fixtures/config/does-not-exist.yaml');
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.issues[0]).toMatchObject({ code: 'config.unreadable', file: 'test/fixtures/config/does-not-exist.yaml' });
      expect(result.issues[0].fix).toContain('candela init');
    }
  });
});
