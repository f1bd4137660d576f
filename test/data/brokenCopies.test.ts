import { readFileSync, writeFileSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSupernovaTable, readTextLines, readCovarianceMatrix, readSystematicModes, type TableReadOptions } from '../../src/data/index.js';
import { isCandelaError, type Issue } from '../../src/errors.js';
import { useScratchFolder } from '../support/scratchFolder.js';

// Broken copies of a real table: the first rows of the DES-SN5YR Hubble diagram (DES Collaboration 2024,
// ../shared/data-real/des-sn5yr, SOURCE.md) with one cell or row spoiled. The intact copy reads cleanly,
// so each refusal below is caused by the spoiled cell alone.
const REAL = '../shared/data-real/des-sn5yr/DES-SN5YR_HD.csv';
const scratch = useScratchFolder('data-broken-copies');
const HEAD = readFileSync(REAL, 'utf8').split('\n').slice(0, 11); // header + 10 rows

function copyWith(name: string, change: (lines: string[]) => string[]): TableReadOptions {
  mkdirSync(scratch, { recursive: true });
  writeFileSync(join(scratch, name), `${change([...HEAD]).join('\n')}\n`);
  return {
    file: join(scratch, name), displayName: name, kind: 'magnitudes', delimiter: 'auto', indexColumn: 'auto',
    columns: { id: 'CID', sample: 'IDSURVEY', z: 'zHD', z_helio: 'zHEL', magnitude: 'MU', magnitude_err: 'MUERR_FINAL' },
  };
}

/** Replaces field `k` (0-based) of data line `line` (1-based file line). */
function spoil(line: number, k: number, text: string): (lines: string[]) => string[] {
  return (lines) => lines.map((l, i) => (i === line - 1 ? l.split(',').map((f, j) => (j === k ? text : f)).join(',') : l));
}

function problems(read: () => unknown): Issue[] {
  try {
    read();
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

describe('readSupernovaTable refuses values no supernova can have', () => {
  it('reads the intact copy of the first ten DES-SN5YR rows without a problem', () => {
    const { table, warnings } = readSupernovaTable(copyWith('intact.csv', (l) => l));
    expect(table.count).toBe(10);
    expect(warnings).toEqual([]);
  });

  it('refuses a magnitude error of 1e200 with file, line, row and column', () => {
    const issues = problems(() => readSupernovaTable(copyWith('huge-error.csv', spoil(4, 6, '1e200'))));
    const [issue] = issues.filter((i) => i.severity !== 'warning');
    expect(issues.filter((i) => i.severity !== 'warning')).toHaveLength(1);
    expect(issues.map((i) => i.code)).not.toContain('data.huge_uncertainty'); // counted once, as the error
    expect(issue).toMatchObject({ code: 'data.absurd_value', file: 'huge-error.csv', line: 4, row: 3, path: 'MUERR_FINAL', found: '1e200' });
    expect(issue.severity).toBeUndefined(); // an error, not a warning
  });

  it('refuses a distance modulus of 1e300 and one of -150 mag', () => {
    const issues = problems(() => readSupernovaTable(copyWith('huge-mu.csv', (l) => spoil(9, 5, '-150')(spoil(3, 5, '1e300')(l)))));
    expect(issues.map((i) => [i.code, i.line, i.path])).toEqual([['data.absurd_value', 3, 'MU'], ['data.absurd_value', 9, 'MU']]);
  });

  it('keeps the inflated errors of probable non-Ia objects readable: DES-SN5YR goes up to 449.6 mag (SOURCE.md)', () => {
    const { table, warnings } = readSupernovaTable(copyWith('inflated.csv', spoil(5, 6, '449.6')));
    expect(table.magnitudeErr?.[3]).toBe(449.6);
    expect(warnings.map((w) => w.code)).toEqual(['data.huge_uncertainty']);
  });

  it('refuses a redshift of 1e300 (no value of any column may exceed a million in size)', () => {
    const [issue] = problems(() => readSupernovaTable(copyWith('huge-z.csv', (l) => spoil(6, 4, '1e300')(spoil(6, 3, '1e300')(l)))));
    expect(issue).toMatchObject({ code: 'data.absurd_value', line: 6, path: 'zHD' });
  });

  it('refuses a row copied twice, naming both lines', () => {
    const [issue, ...rest] = problems(() => readSupernovaTable(copyWith('copied-row.csv', (l) => [...l, l[3]])));
    expect(rest).toEqual([]);
    expect(issue).toMatchObject({ code: 'data.duplicate_row', file: 'copied-row.csv', line: 12, row: 11 });
    expect(issue.found).toBe("id '1246314' on lines 4 and 12");
  });

  it('warns once when an id repeats with other values (one supernova, two surveys)', () => {
    const { warnings } = readSupernovaTable(copyWith('two-surveys.csv', (l) => [...l, l[3].replace(',10,', ',5,'), l[2].replace('41.2263', '41.2300')]));
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatchObject({ code: 'data.repeated_ids', severity: 'warning', path: 'CID' });
    expect(warnings[0].message).toMatch(/^2 row\(s\) repeat .*\(2 supernova\(e\)/);
  });
});

describe('readTextLines names the file and never prints its bytes', () => {
  it('says where a missing file was looked for', () => {
    const [issue] = problems(() => readTextLines(join(scratch, 'absent.txt'), 'absent.txt'));
    expect(issue).toMatchObject({ code: 'data.file_not_found', file: 'absent.txt', found: `nothing at ${join(scratch, 'absent.txt')}` });
    expect(issue.fix).toContain('folder of the configuration file');
  });

  it('refuses a folder given as a file', () => {
    const [issue] = problems(() => readTextLines(scratch, 'data-dir'));
    expect(issue).toMatchObject({ code: 'data.not_a_file', file: 'data-dir' });
  });

  it('refuses a gzip file given as a covariance without showing its bytes', () => {
    // RFC 1952: a gzip member starts with the bytes 1f 8b 08; a NUL byte follows in the header's flags and time fields
    const gz = join(scratch, 'cov.txt.gz');
    writeFileSync(gz, Buffer.from([0x1f, 0x8b, 0x08, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x03, 0x33, 0xe2, 0x02, 0x00]));
    const issues = problems(() => readCovarianceMatrix({ file: gz, displayName: 'cov.txt.gz', target: 'magnitudes', expectedSupernovae: 1, scale: 1 }));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ code: 'data.not_text', file: 'cov.txt.gz' });
    expect(issues[0].message).toContain('gzip');
    expect(issues[0].fix).toContain('gunzip cov.txt.gz');
    expect(JSON.stringify(issues[0])).not.toMatch(/[\u0000-\u0008\u001f\u008b]/);
  });

  it('refuses any file with a NUL byte as binary', () => {
    writeFileSync(join(scratch, 'blob.bin'), Buffer.from('1 2 3\n\u0000\u0001\n'));
    expect(problems(() => readTextLines(join(scratch, 'blob.bin'), 'blob.bin'))[0].code).toBe('data.not_text');
  });
});

describe('covariance and mode files refuse absurd entries', () => {
  // A broken copy of the Pantheon 2018 binned systematic matrix (Scolnic et al. 2018,
  // ../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt: a line "40", then 1600 values one per line).
  it('reads the intact copy and refuses one entry of 1e300 with its line', () => {
    const source = readFileSync('../shared/data-real/pantheon2018/Binned_data/sys_DS17f.txt', 'utf8').split('\n');
    const read = (name: string, lines: string[]) => {
      writeFileSync(join(scratch, name), lines.join('\n'));
      return () => readCovarianceMatrix({ file: join(scratch, name), displayName: name, target: 'magnitudes', expectedSupernovae: 40, scale: 1 });
    };
    expect(read('sys-intact.txt', source)().size).toBe(40);
    const broken = [...source];
    broken[42] = '1e300'; // line 43: entry (1, 1) of the row-by-row list after the "40" line
    const issues = problems(read('sys-broken.txt', broken));
    expect(issues).toHaveLength(1);
    expect(issues[0]).toMatchObject({ code: 'covariance.absurd_value', file: 'sys-broken.txt', line: 43, found: '1e300' });
  });

  it('refuses a systematic mode shift of 1e200 mag with its row', () => {
    writeFileSync(join(scratch, 'modes.csv'), '0.01,0.02\n1e200,0.0\n');
    const issues = problems(() => readSystematicModes({ file: join(scratch, 'modes.csv'), displayName: 'modes.csv', expectedSupernovae: 2, scale: 1 }));
    expect(issues[0]).toMatchObject({ code: 'modes.absurd_value', line: 2, row: 2, found: '1e200' }); // common practice: no shift comes near 1e4 mag
  });
});
