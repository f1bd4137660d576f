import { describe, expect, it } from 'vitest';
import { hostLogMassAsWritten, MOCK_TABLE_COLUMNS, mockTableCsv } from '../../../src/output/index.js';

const TABLE = {
  count: 2, ids: ['kt-1', 'kt,2'], samples: ['wide', 'wide'],
  redshift: Float64Array.of(0.1234567, 1), redshiftHelio: Float64Array.of(0.1234567, 1),
  peakMag: Float64Array.of(19.5, 24.25), hostLogMass: Float64Array.of(10.00004, 9.99996), covPeakMagColor: Float64Array.of(-0.0001, 0),
};

describe('mockTableCsv', () => {
  const lines = mockTableCsv(TABLE).trimEnd().split('\n');
  it('writes the header of MOCK_TABLE_COLUMNS and one line per supernova, missing columns as zeros', () => {
    expect(lines[0]).toBe(MOCK_TABLE_COLUMNS.join(','));
    expect(lines).toHaveLength(3);
    expect(lines[1]).toBe('kt-1,wide,0.123457,0.123457,19.500000,0.000000,0.000000,0.000000,0.000000,0.000000,0,-1.000000e-4,0,10.0000,0.0000');
  });

  it('quotes an id holding a comma (RFC 4180, section 2)', () => {
    expect(lines[2].startsWith('"kt,2",wide,')).toBe(true);
  });

  it('gives the host masses as written, so a split at 10 dex classifies them as a fit of the file does', () => {
    expect(Array.from(hostLogMassAsWritten(TABLE))).toEqual([10, 10]);
  });
});
