import { describe, expect, it } from 'vitest';
import { readSupernovaTable } from '../../src/data/index.js';

// Row counts, column meanings and quirks come from the SOURCE.md file next to each release in
// ../shared/data-real; spot values are copied from the files themselves (first/last data rows).
const REAL = '../shared/data-real';

describe('readSupernovaTable on Pantheon (Scolnic et al. 2018)', () => {
  it('reads the 1048 unbinned rows by position although the header names 19 columns and rows have 18 fields', () => {
    const { table, warnings } = readSupernovaTable({
      file: `${REAL}/pantheon2018/lcparam_full_long_zhel.txt`, kind: 'magnitudes', delimiter: 'auto', indexColumn: 'auto',
      columns: { id: 'name', z: 'zcmb', z_helio: 'zhel', z_err: 'dz', magnitude: 'mb', magnitude_err: 'dmb' },
    });
    expect(table.count).toBe(1048); // SOURCE.md: 1048 rows
    expect(warnings.filter((w) => w.code === 'data.header_surplus_names')).toHaveLength(1); // warned once
    expect(warnings.find((w) => w.code === 'data.header_surplus_names')?.message).toContain("'biascor'");
    // first data row of the file: 03D1au 0.50349 0.504299 0.0 22.93445 0.12605
    expect(table.ids[0]).toBe('03D1au');
    expect(table.redshift[0]).toBe(0.50349);
    expect(table.redshiftHelio[0]).toBe(0.504299);
    expect(table.magnitude?.[0]).toBe(22.93445);
    expect(table.magnitudeErr?.[0]).toBe(0.12605);
    // last data row: SCP06C0 1.092 1.093202 ... 24.63835 0.26405
    expect(table.ids[1047]).toBe('SCP06C0');
    expect(table.redshiftHelio[1047]).toBe(1.093202);
    expect(table.magnitude?.[1047]).toBe(24.63835);
    expect(table.sourceLine[0]).toBe(2);
    expect(table.samples.every((s) => s === 'all')).toBe(true);
  });

  it('reads the 40-bin compressed Hubble diagram', () => {
    const { table } = readSupernovaTable({
      file: `${REAL}/pantheon2018/Binned_data/lcparam_DS17f.txt`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' },
    });
    expect(table.count).toBe(40); // SOURCE.md: 40 bins, 0.014 <= z <= 1.61
    expect(table.magnitude?.[0]).toBe(14.57001926); // first row of the file
    expect(table.redshift[39]).toBe(1.6123); // last row of the file
    expect(table.magnitude?.[39]).toBe(25.9259729107);
    expect(Array.from(table.redshiftHelio)).toEqual(Array.from(table.redshift)); // no z_helio mapped -> equals z
  });
});

describe('readSupernovaTable on JLA as re-released by Rahman et al. (2022)', () => {
  const read = () => readSupernovaTable({
    file: `${REAL}/jla-rahman2021/jla_lcparams.txt`, kind: 'light_curves', delimiter: 'whitespace', indexColumn: 'auto',
    columns: {
      id: 'name', sample: 'survey', z: 'zcmb', z_helio: 'zhel', m_b: 'mb', m_b_err: 'dmb', x1: 'x1', x1_err: 'dx1',
      color: 'color', color_err: 'dcolor', host_log_mass: '3rdvar', host_log_mass_err: 'd3rdvar',
      cov_m_b_x1: 'cov_m_s', cov_m_b_color: 'cov_m_c', cov_x1_color: 'cov_s_c',
    },
    missingValues: { host_log_mass: [5.0] },
  });

  it('detects the unnamed leading index column under a header without a comment prefix', () => {
    const { table } = read();
    expect(table.count).toBe(740); // SOURCE.md: 740 rows of 24 fields, header of 23 names
    // first data row: 0 03D1au 0.503084 0.5043 0.0 23.001698 0.088031 1.273191 0.150058 -0.012353 0.030011 9.517 0.1105 0.00079 0.00044 -3e-05
    expect(table.ids[0]).toBe('03D1au');
    expect(table.redshift[0]).toBe(0.503084);
    expect(table.redshiftHelio[0]).toBe(0.5043);
    expect(table.peakMag?.[0]).toBe(23.001698);
    expect(table.stretch?.[0]).toBe(1.273191);
    expect(table.color?.[0]).toBe(-0.012353);
    expect(table.hostLogMass?.[0]).toBe(9.517);
    expect(table.covPeakMagStretch?.[0]).toBe(0.00079);
    expect(table.covStretchColor?.[0]).toBe(-3e-5);
    expect(table.ids[739]).toBe('sn2008bf'); // last data row
    expect(table.biasCorrectionMag?.every((b) => b === 0)).toBe(true); // biascor not mapped (SOURCE.md: do not add blindly)
  });

  it('turns the placeholder host mass 5.0 into unknown (NaN) and keeps the four samples', () => {
    const { table } = read();
    // 27 rows hold exactly 5.0 in 3rdvar (counted in the file with a one-line script)
    expect(table.hostLogMass?.filter(Number.isNaN).length).toBe(27);
    // SOURCE.md: set 1 SNLS (239), 2 SDSS (374), 3 low-z (118), 4 HST (9)
    const counts = Object.fromEntries(table.sampleNames.map((name) => [name, table.samples.filter((s) => s === name).length]));
    expect(counts).toEqual({ SNLS: 239, SDSS: 374, LOWZ: 118, HST: 9 }); // labels as written in the 'survey' column
  });
});

describe('readSupernovaTable on DES-SN5YR (DES Collaboration 2024)', () => {
  it('reads the 1829 comma-separated Hubble-diagram rows and flags the huge inflated errors once', () => {
    const { table, warnings } = readSupernovaTable({
      file: `${REAL}/des-sn5yr/DES-SN5YR_HD.csv`, kind: 'magnitudes', delimiter: 'auto', indexColumn: 'auto',
      columns: { id: 'CID', sample: 'IDSURVEY', z: 'zHD', z_helio: 'zHEL', magnitude: 'MU', magnitude_err: 'MUERR_FINAL' },
    });
    expect(table.count).toBe(1829); // SOURCE.md
    expect(table.ids[0]).toBe('1246275'); // first row: 1246275,10,0.24605,0.24605,0.24651,40.5938,0.0968
    expect(table.magnitude?.[0]).toBe(40.5938);
    expect(table.magnitudeErr?.[0]).toBe(0.0968);
    expect(table.ids[1828]).toBe('iPTF17dz'); // last row
    expect(table.samples.filter((s) => s === '10')).toHaveLength(1635); // SOURCE.md: 1635 DES
    // SOURCE.md: MUERR_FINAL up to 449.6 mag; 61 rows exceed 10 mag (counted in the file)
    const huge = warnings.filter((w) => w.code === 'data.huge_uncertainty');
    expect(huge).toHaveLength(1);
    expect(huge[0].message).toMatch(/^61 /);
  });
});

describe('readSupernovaTable on Pantheon+ (Brout et al. 2022)', () => {
  it('reads 1701 rows with -9 markers as unknown host masses and calibrator distances', () => {
    const { table, warnings } = readSupernovaTable({
      file: `${REAL}/pantheonplus/Pantheon+SH0ES.dat`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
      columns: {
        id: 'CID', sample: 'IDSURVEY', z: 'zHD', z_helio: 'zHEL', z_err: 'zHDERR', magnitude: 'm_b_corr',
        magnitude_err: 'm_b_corr_err_DIAG', host_log_mass: 'HOST_LOGMASS', host_log_mass_err: 'HOST_LOGMASS_ERR', calibrator_mu: 'CEPH_DIST',
      },
      missingValues: { host_log_mass: [-9], host_log_mass_err: [-9], calibrator_mu: [-9] },
    });
    expect(table.count).toBe(1701); // SOURCE.md
    expect(table.hostLogMass?.filter(Number.isNaN).length).toBe(1); // SOURCE.md: -9 = missing (1 row)
    expect(table.calibratorMu?.filter(Number.isFinite).length).toBe(77); // SOURCE.md: 77 calibrators
    // first row: 2011fe 51 0.00122 0.00084 ... m_b_corr 9.74571, CEPH_DIST 29.177
    expect(table.ids[0]).toBe('2011fe');
    expect(table.redshift[0]).toBe(0.00122);
    expect(table.magnitude?.[0]).toBe(9.74571);
    expect(table.calibratorMu?.[0]).toBe(29.177);
    // SOURCE.md: 1543 distinct names on 1701 rows -> 158 rows repeat a name (one per extra survey):
    // expected in this release, so one warning with the count, and no row is an exact copy
    const repeated = warnings.filter((w) => w.code === 'data.repeated_ids');
    expect(repeated).toHaveLength(1);
    expect(repeated[0].message).toMatch(/^158 row\(s\) repeat .*\(\d+ supernova\(e\) measured more than once, e\.g\. '2011fe'/);
    expect(warnings.filter((w) => w.code === 'data.duplicate_row')).toHaveLength(0);
  });
});
