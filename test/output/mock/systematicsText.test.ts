import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCovarianceMatrix, readSystematicModes } from '../../../src/data/index.js';
import { covarianceMatrixText, systematicModesCsv } from '../../../src/output/index.js';

// Seven significant digits round a value to within half a unit in the seventh digit:
// a relative error of at most 5e-7 (common practice for decimal rounding).
const SEVEN_DIGITS = 5e-7;
const directory = mkdtempSync(join(tmpdir(), 'candela-systematics-'));
const write = (name: string, text: string): string => { const file = join(directory, name); writeFileSync(file, text); return file; };

describe('covarianceMatrixText', () => {
  it('writes N, then N rows of N values, and reads back through readCovarianceMatrix to seven digits', () => {
    const values = Float64Array.of(0.0123456789, -0.001, -0.001, 0.0456);
    const text = covarianceMatrixText(values, 2);
    expect(text).toBe('2\n1.234568e-2 -1.000000e-3\n-1.000000e-3 4.560000e-2\n');
    const read = readCovarianceMatrix({ file: write('c.txt', text), target: 'magnitudes', expectedSupernovae: 2, scale: 1 });
    read.values.forEach((value, i) => expect(Math.abs(value / values[i] - 1)).toBeLessThanOrEqual(SEVEN_DIGITS));
  });
});

describe('systematicModesCsv', () => {
  it('writes a header of names and one row of K shifts per supernova, read back by readSystematicModes', () => {
    const modes = { count: 3, modeCount: 2, values: Float64Array.of(0.01, 0, -0.02, 0.5, 0, 1e-9) };
    const text = systematicModesCsv(modes, ['calibration_a', 'drift']);
    expect(text.split('\n')[0]).toBe('calibration_a,drift');
    const read = readSystematicModes({ file: write('u.csv', text), displayName: 'u.csv', expectedSupernovae: 3, scale: 1 });
    expect(read.columnNames).toEqual(['calibration_a', 'drift']);
    read.values.forEach((value, i) => expect(value === 0 ? modes.values[i] : Math.abs(value / modes.values[i] - 1)).toBeLessThanOrEqual(SEVEN_DIGITS));
  });

  it('quotes a name holding a comma or a quote (RFC 4180, section 2)', () => {
    expect(systematicModesCsv({ count: 0, modeCount: 2, values: new Float64Array(0) }, ['a,b', 'say "x"']).split('\n')[0]).toBe('"a,b","say ""x"""');
  });
});
