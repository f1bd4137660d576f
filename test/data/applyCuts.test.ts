import { describe, expect, it } from 'vitest';
import { applyCuts, concatenateTables, formatCutReport, readCovarianceMatrix, readSupernovaTable, subsetCovariance } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';

const REAL = '../shared/data-real';
const readPantheonPlus = () => readSupernovaTable({
  file: `${REAL}/pantheonplus/Pantheon+SH0ES.dat`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
  columns: { id: 'CID', sample: 'IDSURVEY', z: 'zHD', z_helio: 'zHEL', magnitude: 'm_b_corr', magnitude_err: 'm_b_corr_err_DIAG', calibrator_mu: 'CEPH_DIST' },
  missingValues: { calibrator_mu: [-9] },
}).table;
const readJla = () => readSupernovaTable({
  file: `${REAL}/jla-rahman2021/jla_lcparams.txt`, kind: 'light_curves', delimiter: 'whitespace', indexColumn: 'auto',
  columns: { id: 'name', sample: 'survey', z: 'zcmb', z_helio: 'zhel', m_b: 'mb', m_b_err: 'dmb', x1: 'x1', x1_err: 'dx1', color: 'color', color_err: 'dcolor' },
}).table;

describe('applyCuts', () => {
  it('reproduces the Pantheon+ cosmology sample: z > 0.01 leaves 1590 rows, 1657 with the Cepheid calibrators', () => {
    const table = readPantheonPlus();
    // SOURCE.md (paper, recalled from memory): 1590 rows with zHD > 0.01; 1657 = zHD > 0.01 or calibrator.
    // No row has zHD exactly 0.01, so the inclusive bound gives the same count.
    expect(applyCuts(table, { redshiftMin: 0.01 }).table.count).toBe(1590);
    const withCalibrators = applyCuts(table, { redshiftMin: 0.01, exemptCalibratorsFromRedshiftCuts: true });
    expect(withCalibrators.table.count).toBe(1657);
    expect(withCalibrators.report.steps).toEqual([{ name: 'redshiftMin', description: 'z >= 0.01 or calibrator', removed: 44, remaining: 1657 }]);
  });

  it('reports removals per cut in order and what is left per sample', () => {
    const table = readJla();
    const { table: cut, keptIndices, report } = applyCuts(table, { keepSamples: ['SNLS', 'SDSS'], redshiftMax: 0.4, maxAbsColor: 0.3, maxErrors: { x1_err: 1 } });
    expect(report.steps.map((s) => s.name)).toEqual(['keepSamples', 'redshiftMax', 'maxAbsColor', 'maxErrors.x1_err']);
    expect(report.steps[0]).toMatchObject({ removed: 118 + 9, remaining: 239 + 374 }); // SOURCE.md sample sizes
    const last = report.steps.at(-1);
    expect(cut.count).toBe(last?.remaining);
    expect(report.finalCount).toBe(cut.count);
    // every kept row satisfies every cut, and the kept indices point back to the same supernovae
    keptIndices.forEach((index, k) => {
      expect(table.ids[index]).toBe(cut.ids[k]);
      expect(['SNLS', 'SDSS']).toContain(cut.samples[k]);
      expect(cut.redshift[k]).toBeLessThanOrEqual(0.4);
      expect(Math.abs(cut.color?.[k] ?? NaN)).toBeLessThanOrEqual(0.3);
      expect(cut.stretchErr?.[k]).toBeLessThanOrEqual(1);
    });
    expect(cut.sampleNames).toEqual(['SNLS', 'SDSS']);
    expect(report.perSample.find((s) => s.sample === 'HST')).toEqual({ sample: 'HST', before: 9, after: 0 });
    const lines = formatCutReport(report);
    expect(lines[0]).toBe('740 supernovae before cuts');
    expect(lines[1]).toMatch(/^ {2}keep samples SNLS, SDSS +removed +127, 613 left$/);
  });

  it('warns about unknown samples and ids, suggesting the closest id', () => {
    const { report } = applyCuts(readJla(), { keepSamples: ['SNLS', 'Pan-STARRS'], dropIds: ['03D1aw', '03D1ua'] });
    expect(report.warnings.map((w) => w.code)).toEqual(['cuts.unknown_id', 'cuts.unknown_sample']);
    expect(report.warnings[0].fix).toBe("did you mean '03D1au'?");
    expect(report.steps[0]).toMatchObject({ name: 'dropIds', removed: 1 });
  });

  it('refuses a cut on a column the table does not have, and cuts that remove everything', () => {
    const table = readPantheonPlus();
    const codes = (cuts: Parameters<typeof applyCuts>[1]) => {
      try {
        applyCuts(table, cuts);
      } catch (error) {
        if (isCandelaError(error)) return error.issues.map((i) => i.code);
      }
      return [];
    };
    expect(codes({ maxAbsStretch: 3 })).toEqual(['cuts.column_absent']);
    expect(codes({ redshiftMin: 5 })).toEqual(['cuts.nothing_left']);
    expect(codes({ redshiftMax: Number.NaN })).toEqual(['cuts.bad_value']);
  });

  it('keeps the covariance aligned with the cut table through keptIndices', () => {
    const { table } = readSupernovaTable({
      file: `${REAL}/pantheon2018/Binned_data/lcparam_DS17f.txt`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' },
    });
    const cov = readCovarianceMatrix({ file: `${REAL}/pantheon2018/Binned_data/sys_DS17f.txt`, target: 'magnitudes', expectedSupernovae: 40, scale: 1 });
    const { table: cut, keptIndices } = applyCuts(table, { redshiftMin: 0.1 });
    const sub = subsetCovariance(cov, keptIndices);
    expect(sub.size).toBe(cut.count);
    const first = keptIndices[0];
    expect(sub.values[0]).toBe(cov.values[first * 40 + first]);
    expect(sub.values[1]).toBe(cov.values[first * 40 + keptIndices[1]]);
  });
});

describe('concatenateTables', () => {
  it('joins data sets keeping their sample labels and source files, filling absent columns', () => {
    const low = readSupernovaTable({
      file: 'test/fixtures/data/good-magnitudes.txt', kind: 'magnitudes', delimiter: 'auto', indexColumn: 'auto', sampleLabel: 'fixture',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' },
    }).table;
    const binned = readSupernovaTable({
      file: `${REAL}/pantheon2018/Binned_data/lcparam_DS17f.txt`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no', sampleLabel: 'bins',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb', host_log_mass: '3rdvar' },
    }).table;
    const { table, warnings } = concatenateTables([low, binned]);
    expect(warnings).toEqual([]);
    expect(table.count).toBe(43);
    expect(table.sampleNames).toEqual(['fixture', 'bins']);
    expect(table.sampleIndex[2]).toBe(0);
    expect(table.sampleIndex[3]).toBe(1);
    expect(table.sourceFiles).toHaveLength(2);
    expect(table.sourceFileIndex?.[3]).toBe(1);
    expect(Number.isNaN(table.hostLogMass?.[0])).toBe(true); // absent in the first file -> unknown
    expect(table.hostLogMass?.[3]).toBe(0);
    expect(table.magnitude?.[3]).toBe(14.57001926);
    const twice = concatenateTables([low, low]);
    expect(twice.warnings.map((w) => w.code)).toEqual(['data.duplicate_id_across_tables', 'data.duplicate_id_across_tables', 'data.duplicate_id_across_tables']);
  });
});
