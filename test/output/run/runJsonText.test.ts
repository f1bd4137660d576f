import { describe, expect, it } from 'vitest';
import { runJsonText } from '../../../src/output/index.js';

describe('runJsonText', () => {
  it('indents by two spaces, keeps the key order and ends in one line break', () => {
    expect(runJsonText({ run: { seed: 7, stop_reason: 'converged' }, best_fit: null })).toBe('{\n  "run": {\n    "seed": 7,\n    "stop_reason": "converged"\n  },\n  "best_fit": null\n}\n');
  });

  it('reads back (JSON.parse) to the same record', () => {
    const record = { model: { label: 'flat_lcdm' }, parameters: { sampled: ['omega_m'], fixed: { w0: -1 } }, evidence: { log_z: -21.25, log_z_error: 0.125 } };
    expect(JSON.parse(runJsonText(record))).toEqual(record);
  });
});
