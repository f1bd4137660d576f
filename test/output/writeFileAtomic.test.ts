import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../src/errors.js';
import { writeFileAtomic } from '../../src/output/index.js';

describe('writeFileAtomic', () => {
  const folder = mkdtempSync(join(tmpdir(), 'candela-write-'));
  afterAll(() => rmSync(folder, { recursive: true, force: true }));

  it('replaces the whole file and leaves no temporary file behind', () => {
    const path = join(folder, 'summary.md');
    writeFileSync(path, 'old content that is longer than the new one\n');
    writeFileAtomic(path, '# new\n');
    expect(readFileSync(path, 'utf8')).toBe('# new\n');
    writeFileAtomic(join(folder, 'bytes.bin'), Uint8Array.of(0, 255, 7));
    expect(Array.from(readFileSync(join(folder, 'bytes.bin')))).toEqual([0, 255, 7]);
    expect(readdirSync(folder).sort()).toEqual(['bytes.bin', 'summary.md']);
  });

  it('reports a missing folder as output.write_failed naming the file', () => {
    const path = join(folder, 'missing', 'table.tex');
    try {
      writeFileAtomic(path, 'x');
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error)).toBe(true);
      if (isCandelaError(error)) expect(error.issues[0]).toMatchObject({ code: 'output.write_failed', file: path });
    }
    expect(readdirSync(folder).sort()).toEqual(['bytes.bin', 'summary.md']);
  });
});
