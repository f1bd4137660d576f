import { describe, expect, it } from 'vitest';
import { readSupernovaTable, type TableReadOptions } from '../../src/data/index.js';
import { formatIssue, isCandelaError, type Issue } from '../../src/errors.js';

// One small broken file per bad-input case (test/fixtures/data). Each check asserts that the
// problem is reported as data naming the file, the line (and row), the column and a fix.
const FIXTURES = 'test/fixtures/data';

function options(file: string, extra: Partial<TableReadOptions> = {}): TableReadOptions {
  return {
    file: `${FIXTURES}/${file}`, displayName: file, kind: 'magnitudes', delimiter: 'auto', indexColumn: 'auto',
    columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' }, ...extra,
  };
}

function problems(read: TableReadOptions): Issue[] {
  try {
    readSupernovaTable(read);
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

describe('readSupernovaTable reports bad input', () => {
  it('names a missing mapped column with a did-you-mean from the header', () => {
    const [issue] = problems(options('missing-column.txt', { columns: { id: 'name', z: 'zcmb', z_helio: 'zhel', magnitude: 'mb', magnitude_err: 'dmb' } }));
    expect(issue).toMatchObject({ code: 'data.missing_column', file: 'missing-column.txt', line: 1, path: 'columns.z' });
    expect(issue.fix).toBe("did you mean 'zcbm'?");
    expect(formatIssue(issue)).toContain("missing-column.txt:1: error at columns.z: column 'zcmb'");
  });

  it('refuses a mapped column that appears twice in the header', () => {
    const [issue] = problems(options('duplicate-column.csv'));
    expect(issue).toMatchObject({ code: 'data.duplicate_column', file: 'duplicate-column.csv', line: 1, column: 14, path: 'mb' }); // 'name,zcmb,mb,mb,dmb': second 'mb' starts at character 14
    expect(issue.found).toBe('positions 3, 4');
    expect(issue.fix).toBeTruthy();
  });

  it('reports a non-numeric cell with its line, column and row', () => {
    const [issue] = problems(options('non-numeric.txt'));
    expect(issue).toMatchObject({ code: 'data.non_numeric', file: 'non-numeric.txt', line: 3, row: 2, column: 11, path: 'mb', found: 'twenty' });
    expect(issue.fix).toContain('correct the value');
    expect(formatIssue(issue)).toMatch(/^non-numeric\.txt:3:11: error at mb:/);
  });

  it('reports NaN in a required field as not finite', () => {
    const [issue] = problems(options('nan-cell.txt'));
    expect(issue).toMatchObject({ code: 'data.not_finite', file: 'nan-cell.txt', line: 3, row: 2, path: 'dmb', found: 'NaN' });
    expect(issue.fix).toBeTruthy();
  });

  it('reports an empty cell of a tab-separated file', () => {
    const [issue] = problems(options('empty-cell.tsv'));
    expect(issue).toMatchObject({ code: 'data.empty_cell', file: 'empty-cell.tsv', line: 3, row: 2, path: 'mb' });
  });

  it('reports a negative uncertainty', () => {
    const [issue] = problems(options('negative-error.txt'));
    expect(issue).toMatchObject({ code: 'data.bad_uncertainty', file: 'negative-error.txt', line: 3, path: 'dmb', expected: '> 0', found: '-0.15' });
    expect(issue.fix).toBeTruthy();
  });

  it('reports every redshift that is not positive', () => {
    const issues = problems(options('nonpositive-redshift.txt'));
    expect(issues.map((i) => [i.code, i.line, i.path, i.found])).toEqual([
      ['data.redshift_not_positive', 3, 'zcmb', '0'],
      ['data.redshift_not_positive', 4, 'zcmb', '-0.01'],
    ]);
    expect(issues.every((i) => i.file === 'nonpositive-redshift.txt' && i.fix)).toBe(true);
  });

  it('reports heliocentric and Hubble-diagram redshifts too far apart', () => {
    const [issue] = problems(options('redshift-mismatch.txt', { columns: { id: 'name', z: 'zcmb', z_helio: 'zhel', magnitude: 'mb', magnitude_err: 'dmb' } }));
    expect(issue).toMatchObject({ code: 'data.redshift_mismatch', file: 'redshift-mismatch.txt', line: 3, path: 'zhel', expected: '|z_helio - z| <= 0.02' });
    expect(issue.fix).toContain('z_helio');
  });

  it('reports a row with the wrong number of fields', () => {
    const [issue] = problems(options('field-count.txt'));
    expect(issue).toMatchObject({ code: 'data.field_count', file: 'field-count.txt', line: 3, row: 2, expected: '4 fields', found: '3' });
  });

  it('reports an unmapped required field', () => {
    const issues = problems(options('good-magnitudes.txt', { columns: { z: 'zcmb', magnitude: 'mb' } }));
    expect(issues.map((i) => [i.code, i.path])).toEqual([['data.field_not_mapped', 'columns.magnitude_err']]);
  });

  it('reports a table with a header but no rows', () => {
    const [issue] = problems(options('empty-table.txt'));
    expect(issue).toMatchObject({ code: 'data.empty_table', file: 'empty-table.txt', line: 2 });
    expect(issue.fix).toBeTruthy();
  });

  it('reports rows with more fields than header names when the index column is declared absent (JLA quirk, SOURCE.md)', () => {
    const issues = problems({
      file: '../shared/data-real/jla-rahman2021/jla_lcparams.txt', displayName: 'jla_lcparams.txt', kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no',
      columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' },
    });
    expect(issues[0]).toMatchObject({ code: 'data.more_fields_than_names', file: 'jla_lcparams.txt', line: 1, expected: '23 fields per row', found: '24' });
    expect(issues[0].fix).toContain('index column');
  });

  it('reports a file that does not exist', () => {
    expect(problems(options('no-such-file.txt'))[0]).toMatchObject({ code: 'data.file_not_found', file: 'no-such-file.txt' });
  });

  it('warns once, but reads, when an id repeats with other values', () => {
    const { table, warnings } = readSupernovaTable(options('duplicate-id.txt'));
    expect(table.count).toBe(3);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ code: 'data.repeated_ids', severity: 'warning', file: 'duplicate-id.txt', line: 4, row: 3, path: 'name' });
    expect(warnings[0].message).toContain("'sn-a' on lines 2 and 4");
  });

  it('lists every problem of a file at once', () => {
    const issues = problems(options('nonpositive-redshift.txt', { columns: { id: 'name', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb', host_log_mass: 'mass' } }));
    expect(issues.map((i) => i.code)).toEqual(['data.missing_column']); // structure problems stop before cell checks
  });
});

describe('readSupernovaTable layouts', () => {
  it('reads a header with a leading comment prefix, z_err and defaults', () => {
    const { table, warnings } = readSupernovaTable(options('good-magnitudes.txt', { columns: { id: 'name', z: 'zcmb', z_helio: 'zhel', z_err: 'dz', magnitude: 'mb', magnitude_err: 'dmb' } }));
    expect(warnings).toEqual([]);
    expect(table.ids).toEqual(['sn-a', 'sn-b', 'sn-c']);
    expect(Array.from(table.redshiftErr)).toEqual([0.001, 0, 0]);
    expect(Array.from(table.sourceLine)).toEqual([3, 4, 5]);
  });

  it('strips a row prefix word and a header prefix word; other lines are skipped with a warning', () => {
    const { table, warnings } = readSupernovaTable({
      file: `${FIXTURES}/row-prefix.txt`, kind: 'magnitudes', delimiter: 'whitespace', indexColumn: 'no', rowPrefix: 'ENTRY:', headerPrefix: 'COLUMNS:',
      columns: { id: 'id', z: 'redshift', magnitude: 'peak', magnitude_err: 'peak_err' },
    });
    expect(table.ids).toEqual(['sn-a', 'sn-b']);
    expect(Array.from(table.magnitude ?? [])).toEqual([16.2, 20.9]);
    expect(warnings.map((w) => w.code)).toEqual(['data.lines_skipped']);
  });

  it('reads quoted CSV fields with commas and doubled quotes (RFC 4180)', () => {
    const { table } = readSupernovaTable(options('quoted.csv', { columns: { id: 'name', sample: 'survey', z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' } }));
    expect(table.samples).toEqual(['north, wide', 'south "deep"']);
    expect(table.sampleNames).toEqual(['north, wide', 'south "deep"']);
    expect(Array.from(table.sampleIndex)).toEqual([0, 1]);
  });

  it('numbers the rows when no id column is mapped', () => {
    const { table } = readSupernovaTable(options('good-magnitudes.txt', { columns: { z: 'zcmb', magnitude: 'mb', magnitude_err: 'dmb' }, sampleLabel: 'north' }));
    expect(table.ids).toEqual(['1', '2', '3']);
    expect(table.sampleNames).toEqual(['north']);
  });
});
