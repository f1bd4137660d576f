import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readRedshiftFile } from '../../src/data/index.js';
import { isCandelaError } from '../../src/errors.js';

function issuesOf(action: () => unknown): { code: string; line?: number }[] {
  try { action(); } catch (error) { if (isCandelaError(error)) return error.issues; throw error; }
  throw new Error('expected a CandelaError');
}

describe('readRedshiftFile', () => {
  const directory = mkdtempSync(join(tmpdir(), 'candela-z-'));
  const write = (name: string, text: string): string => { const file = join(directory, name); writeFileSync(file, text); return file; };

  it('reads one redshift per line, skipping blanks and # comments', () => {
    expect(readRedshiftFile(write('list.txt', '# redshifts\n0.1\n\n0.5\n2\n'))).toEqual([0.1, 0.5, 2]);
  });

  it('reads a named column of a CSV table, or the column named z', () => {
    const file = write('table.csv', 'name,zcmb,z\nsn1,0.11,0.1\nsn2,0.52,0.5\n');
    expect(readRedshiftFile(file)).toEqual([0.1, 0.5]);
    expect(readRedshiftFile(file, 'zcmb')).toEqual([0.11, 0.52]);
  });

  it('reports the line of a bad cell, an unknown column and a missing file', () => {
    const bad = issuesOf(() => readRedshiftFile(write('bad.txt', '0.1\nabc\n')));
    expect(bad[0]).toMatchObject({ code: 'distances.bad_redshift', line: 2 });
    expect(issuesOf(() => readRedshiftFile(write('cols.csv', 'a,b\n1,2\n')))[0].code).toBe('distances.no_redshift_column');
    expect(issuesOf(() => readRedshiftFile(join(directory, 'missing.txt')))[0].code).toBe('distances.file_unreadable');
  });
});
