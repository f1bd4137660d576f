// readSystematicModes: the plain-text format of docs/configuration.md (`systematic_modes`).
// Every expected value below is read off the file text the test writes (the format is the reference).
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readSystematicModes, type SystematicModeReadOptions } from '../../src/data/index.js';
import { isCandelaError, type Issue } from '../../src/errors.js';

const scratch = resolve('.candela-tmp/read-systematic-modes');

beforeAll(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** Writes `text` to a scratch file and returns read options for `rows` supernovae. */
function modesFile(name: string, text: string, rows: number, scale = 1): SystematicModeReadOptions {
  const file = join(scratch, name);
  writeFileSync(file, text);
  return { file, displayName: name, expectedSupernovae: rows, scale };
}

function problems(options: SystematicModeReadOptions): Issue[] {
  try {
    readSystematicModes(options);
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

describe('readSystematicModes', () => {
  it('reads comma-separated rows after comments, blank lines and a header of mode names', () => {
    const text = '# Kestrel deep fields\n\nzero_point_g,zero_point_r,dust\n0.01,-0.02,0\n# mid-file comment\n0.03,0.04,-0.05\n';
    const modes = readSystematicModes(modesFile('header.csv', text, 2));
    expect(modes.count).toBe(2);
    expect(modes.modeCount).toBe(3);
    expect(Array.from(modes.values)).toEqual([0.01, -0.02, 0, 0.03, 0.04, -0.05]); // the file's numbers, row major
    expect(modes.sourceFile).toBe('header.csv');
    expect(modes.columnNames).toEqual(['zero_point_g', 'zero_point_r', 'dust']); // the header, for the budget's per-column rows
  });

  it('reads the same numbers separated by tabs or by runs of spaces, with Windows line breaks', () => {
    const expected = [0.01, -0.02, 0.03, 0.04];
    const tabs = readSystematicModes(modesFile('tabs.tsv', 'a\tb\r\n0.01\t-0.02\r\n0.03\t0.04\r\n', 2));
    const spaces = readSystematicModes(modesFile('spaces.txt', '   0.01   -0.02\n 0.03 0.04  \n', 2));
    expect(Array.from(tabs.values)).toEqual(expected);
    expect(Array.from(spaces.values)).toEqual(expected);
    expect([tabs.modeCount, spaces.modeCount]).toEqual([2, 2]);
  });

  it('takes the separator from the first data row, whatever the header uses', () => {
    const modes = readSystematicModes(modesFile('mixed.csv', 'calib dust\n0.01,-0.02\n0.03,0.04\n', 2));
    expect(Array.from(modes.values)).toEqual([0.01, -0.02, 0.03, 0.04]);
  });

  it('reads a single mode without a header', () => {
    const modes = readSystematicModes(modesFile('one.txt', '1e-3\n-2.5E-3\n+.5\n', 3));
    expect(modes.modeCount).toBe(1);
    expect(Array.from(modes.values)).toEqual([0.001, -0.0025, 0.5]);
    expect(modes.columnNames).toBeUndefined();
  });

  it('multiplies every shift by the scale (so U U^T scales by its square)', () => {
    // scale 2 and the shifts are powers of two times small integers: the products are exact in binary
    const modes = readSystematicModes(modesFile('scaled.csv', '0.25,-0.5\n0.125,1\n', 2, 2));
    expect(Array.from(modes.values)).toEqual([0.5, -1, 0.25, 2]);
  });

  it('reports a ragged row with its line and the expected count', () => {
    const issues = problems(modesFile('ragged.csv', 'a,b,c\n1,2,3\n4,5\n6,7,8\n', 3));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ code: 'modes.ragged_row', file: 'ragged.csv', line: 3, row: 2, expected: '3 values (one per mode)', found: '2 values' });
    expect(issues[0].fix).toBeTruthy();
  });

  it('reports non-numeric, non-finite and empty cells with line, column and mode name', () => {
    const text = 'calib,dust\n0.1,abc\nnan,0.2\n0.3,1e999\n0.4,\n';
    const issues = problems(modesFile('cells.csv', text, 4));
    expect(issues.map((i) => [i.code, i.line, i.column, i.path, i.found])).toEqual([
      ['modes.non_numeric', 2, 5, 'dust', 'abc'],
      ['modes.not_finite', 3, 1, 'calib', 'nan'],
      ['modes.not_finite', 4, 5, 'dust', '1e999'], // 1e999 overflows a double
      ['modes.non_numeric', 5, 5, 'dust', 'an empty cell'], // trailing comma: an empty fifth-column cell
    ]);
    for (const issue of issues) expect(issue.fix).toBeTruthy();
  });

  it('names modes by number when the file has no header', () => {
    const [issue] = problems(modesFile('unnamed.txt', '0.1 0.2\n0.3 x\n', 2));
    expect(issue).toMatchObject({ code: 'modes.non_numeric', line: 2, column: 5, path: 'mode 2' });
  });

  it('reports too few rows at the last row and too many at the first extra row', () => {
    const few = problems(modesFile('few.csv', '# two rows\n0.1\n0.2\n', 3));
    expect(few).toHaveLength(1);
    expect(few[0]).toMatchObject({ code: 'modes.wrong_row_count', line: 3, found: '2 rows' });
    expect(few[0].expected).toContain('3 rows');
    const many = problems(modesFile('many.csv', 'm\n0.1\n0.2\n0.3\n0.4\n', 2));
    expect(many[0]).toMatchObject({ code: 'modes.wrong_row_count', line: 4, found: '4 rows' });
  });

  it('reports a file without rows (zero mode columns), header or not', () => {
    const empty = problems(modesFile('empty.csv', '# nothing here\n\n', 5));
    expect(empty).toHaveLength(1);
    expect(empty[0]).toMatchObject({ code: 'modes.no_modes', file: 'empty.csv' });
    const headerOnly = problems(modesFile('names.csv', '# names only\ncalib,dust\n', 5));
    expect(headerOnly[0]).toMatchObject({ code: 'modes.no_modes', line: 2 });
  });

  it('collects every problem of the file before throwing', () => {
    const issues = problems(modesFile('many-problems.csv', '0.1,0.2\n0.3\nfoo,0.4\n', 4));
    expect(issues.map((i) => i.code).sort()).toEqual(['modes.non_numeric', 'modes.ragged_row', 'modes.wrong_row_count']);
  });

  it('reports a missing file and a non-positive scale', () => {
    const [missing] = problems({ file: join(scratch, 'absent.csv'), displayName: 'absent.csv', expectedSupernovae: 1, scale: 1 });
    expect(missing).toMatchObject({ code: 'data.file_not_found', file: 'absent.csv' });
    const [scale] = problems(modesFile('fine.csv', '0.1\n', 1, 0));
    expect(scale).toMatchObject({ code: 'modes.bad_option', path: 'scale', found: '0' });
  });
});
