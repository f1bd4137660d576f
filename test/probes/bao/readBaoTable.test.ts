import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { readBaoTable } from '../../../src/probes/bao/readBaoTable.js';

const DESI = '../shared/data-real/desi-dr2-bao';

function issuesOf(action: () => unknown): Array<{ code: string; line?: number; fix?: string; file?: string }> {
  try {
    action();
  } catch (error) {
    if (isCandelaError(error)) return error.issues;
    throw error;
  }
  throw new Error('expected a CandelaError');
}

function folder(files: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'candela-bao-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  return dir;
}

describe('readBaoTable', () => {
  it('reads the DESI DR2 table: 13 rows at 7 effective redshifts with their correlations', () => {
    // Source: ../shared/data-real/desi-dr2-bao/SOURCE.md (13 rows, 7 redshifts; D_M-D_H correlation -0.459 at z = 0.510).
    const table = readBaoTable(`${DESI}/measurements.csv`, 'measurements.csv', `${DESI}/covariance.txt`, 'covariance.txt');
    expect(table.values.length).toBe(13);
    expect(new Set(table.redshifts).size).toBe(7);
    expect(table.kinds[0]).toBe('volume_averaged');
    const [i, j] = [1, 2];
    const correlation = table.covariance[i * 13 + j] / Math.sqrt(table.covariance[i * 13 + i] * table.covariance[j * 13 + j]);
    expect(correlation).toBeCloseTo(-0.459, 3);
  });

  it('uses the sigma column as independent errors without a covariance file', () => {
    const table = readBaoTable(`${DESI}/measurements.csv`, 'measurements.csv', undefined, undefined);
    expect(table.covariance[0]).toBeCloseTo(0.075 ** 2, 12);
    expect(table.covariance[1]).toBe(0);
  });

  it('names the line and offers a did-you-mean for an unknown quantity', () => {
    const dir = folder({ 't.csv': 'z_eff,quantity,value,sigma\n0.5,DM_over_rd,13.5,0.2\n0.7,DN_over_rd,17.3,0.2\n' });
    const [issue] = issuesOf(() => readBaoTable(join(dir, 't.csv'), 't.csv', undefined, undefined));
    expect(issue).toMatchObject({ code: 'bao.unknown_quantity', file: 't.csv', line: 3 });
    expect(issue.fix).toMatch(/DM_over_rd|DH_over_rd/);
  });

  it('rejects a covariance of the wrong size and one that is not positive definite, naming the file', () => {
    const dir = folder({
      't.csv': 'z_eff,quantity,value\n0.5,DM_over_rd,13.5\n0.5,DH_over_rd,21.8\n',
      'small.txt': '0.04\n',
      'bad.txt': '0.04 0.05\n0.05 0.04\n',
    });
    expect(issuesOf(() => readBaoTable(join(dir, 't.csv'), 't.csv', join(dir, 'small.txt'), 'small.txt'))[0]).toMatchObject({ code: 'covariance.wrong_size', file: 'small.txt' });
    expect(issuesOf(() => readBaoTable(join(dir, 't.csv'), 't.csv', join(dir, 'bad.txt'), 'bad.txt'))[0]).toMatchObject({ code: 'covariance.not_positive_definite', file: 'bad.txt' });
  });

  it('rejects missing columns, non-numeric and non-positive cells with their line', () => {
    const dir = folder({ 'a.csv': 'z,value\n0.5,13\n', 'b.csv': 'z_eff,quantity,value,sigma\n0.5,DM_over_rd,abc,0.1\n-0.2,DM_over_rd,13,0.1\n' });
    expect(issuesOf(() => readBaoTable(join(dir, 'a.csv'), 'a.csv', undefined, undefined)).map((i) => i.code)).toContain('bao.missing_column');
    const lines = issuesOf(() => readBaoTable(join(dir, 'b.csv'), 'b.csv', undefined, undefined)).map((i) => i.line);
    expect(lines).toEqual([2, 3]);
  });
});
