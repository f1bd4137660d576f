import { csvField } from '../density/csvField.js';
import { MOCK_MASS_DECIMALS, fixedDecimals, significantDigits } from './mockNumberText.js';

/** Columns of the mock table, in file order (the names a run configuration maps in `columns`). */
export const MOCK_TABLE_COLUMNS = [
  'id', 'sample', 'z_cmb', 'z_helio', 'm_b', 'm_b_err', 'x1', 'x1_err', 'color', 'color_err',
  'cov_m_b_x1', 'cov_m_b_color', 'cov_x1_color', 'host_log_mass', 'host_log_mass_err',
] as const;

/** The observed columns of a mock survey (the data layer's SupernovaTable has this shape); a missing column is written as zeros. */
export interface MockTableFacts {
  count: number;
  ids: readonly string[];
  samples: readonly string[];
  redshift: Float64Array;
  redshiftHelio: Float64Array;
  peakMag?: Float64Array;
  peakMagErr?: Float64Array;
  stretch?: Float64Array;
  stretchErr?: Float64Array;
  color?: Float64Array;
  colorErr?: Float64Array;
  covPeakMagStretch?: Float64Array;
  covPeakMagColor?: Float64Array;
  covStretchColor?: Float64Array;
  hostLogMass?: Float64Array;
  hostLogMassErr?: Float64Array;
}

/**
 * The mock table as CSV (RFC 4180): a header line of MOCK_TABLE_COLUMNS, then
 * one line per supernova; redshifts, magnitudes, x1, c and their errors with
 * 6 decimals, covariances with 7 significant digits, host masses with 4
 * decimals (dex). Cost O(N).
 * @param table the drawn table.
 * @returns the CSV text, ending in a line break.
 * @throws nothing.
 * @example mockTableCsv(table).split('\n')[0] // 'id,sample,z_cmb,z_helio,m_b,...'
 */
export function mockTableCsv(table: MockTableFacts): string {
  const t = table;
  const column = (values: Float64Array | undefined): Float64Array => values ?? new Float64Array(t.count);
  const [mB, mBErr, x1, x1Err, c, cErr] = [t.peakMag, t.peakMagErr, t.stretch, t.stretchErr, t.color, t.colorErr].map(column);
  const [covMX, covMC, covXC, mass, massErr] = [t.covPeakMagStretch, t.covPeakMagColor, t.covStretchColor, t.hostLogMass, t.hostLogMassErr].map(column);
  const fixed = fixedDecimals;
  const significant = significantDigits;
  const lines = [MOCK_TABLE_COLUMNS.join(',')];
  for (let i = 0; i < t.count; i++) {
    lines.push([
      csvField(t.ids[i]), csvField(t.samples[i]), fixed(t.redshift[i]), fixed(t.redshiftHelio[i]),
      fixed(mB[i]), fixed(mBErr[i]), fixed(x1[i]), fixed(x1Err[i]), fixed(c[i]), fixed(cErr[i]),
      significant(covMX[i]), significant(covMC[i]), significant(covXC[i]),
      fixed(mass[i], MOCK_MASS_DECIMALS), fixed(massErr[i], MOCK_MASS_DECIMALS),
    ].join(','));
  }
  return `${lines.join('\n')}\n`;
}

/**
 * The host log masses as the table writes them (rounded to 4 decimals, dex),
 * so that a computation on them classifies hosts as a fit of the file does.
 * @param table the drawn table (a missing column gives zeros).
 * @returns one mass per supernova, dex.
 * @throws nothing.
 * @example hostLogMassAsWritten({ count: 1, hostLogMass: Float64Array.of(10.00004), ... })[0] // 10
 */
export function hostLogMassAsWritten(table: Pick<MockTableFacts, 'count' | 'hostLogMass'>): Float64Array {
  return Float64Array.from(table.hostLogMass ?? new Float64Array(table.count), (mass) => Number(fixedDecimals(mass, MOCK_MASS_DECIMALS)));
}
