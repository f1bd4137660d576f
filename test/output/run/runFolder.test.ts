import { existsSync, mkdirSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { prepareRunFolder } from '../../../src/output/run/runFolder.js';

// The rules of a run folder (common practice for resumable jobs): never overwrite without --force, resume only
// what holds a checkpoint, start afresh where an interrupted start-up left nothing, and clear the temporary
// files of writes that a hard stop cut short, never a finished file.
const scratch = resolve('.candela-tmp/run-folder');
const codeOf = (action: () => void): string | null => {
  try {
    action();
    return null;
  } catch (error) {
    return isCandelaError(error) ? error.issues[0].code : `not a CandelaError: ${String(error)}`;
  }
};

beforeEach(() => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
});
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('prepareRunFolder', () => {
  it('creates a missing folder, and with --resume starts afresh in a missing or empty one', () => {
    expect(codeOf(() => prepareRunFolder(join(scratch, 'new', 'run'), { force: false, resume: false }))).toBeNull();
    expect(existsSync(join(scratch, 'new', 'run'))).toBe(true);
    expect(codeOf(() => prepareRunFolder(join(scratch, 'never-started'), { force: false, resume: true }))).toBeNull();
    mkdirSync(join(scratch, 'empty'));
    expect(codeOf(() => prepareRunFolder(join(scratch, 'empty'), { force: false, resume: true }))).toBeNull();
    expect(readdirSync(join(scratch, 'empty'))).toEqual([]); // the write probe is removed again
  });

  it('refuses to resume a folder with files but no checkpoint, and to overwrite one without --force', () => {
    const dir = join(scratch, 'finished');
    mkdirSync(dir);
    writeFileSync(join(dir, 'chains.csv'), 'ensemble\n');
    expect(codeOf(() => prepareRunFolder(dir, { force: false, resume: true }))).toBe('run.no_checkpoint');
    expect(codeOf(() => prepareRunFolder(dir, { force: false, resume: false }))).toBe('run.folder_not_empty');
    expect(readdirSync(dir)).toEqual(['chains.csv']);
    expect(codeOf(() => prepareRunFolder(dir, { force: true, resume: false }))).toBeNull();
    expect(readdirSync(dir)).toEqual([]);
  });

  it('on --resume removes the temporary files of cut-short writes in every subfolder and keeps every other file', () => {
    const dir = join(scratch, 'cut');
    mkdirSync(join(dir, 'contours'), { recursive: true });
    const kept = ['checkpoint.bin', 'chains.csv', 'contours/omega_m__w0.grid.csv', '.hidden-note'];
    const temporary = ['.chains.csv.4242.0.tmp', 'contours/.omega_m__w0.grid.csv.4242.7.tmp'];
    for (const name of [...kept, ...temporary]) writeFileSync(join(dir, name), 'x');
    expect(codeOf(() => prepareRunFolder(dir, { force: false, resume: true }))).toBeNull();
    for (const name of kept) expect(existsSync(join(dir, name)), name).toBe(true);
    for (const name of temporary) expect(existsSync(join(dir, name)), name).toBe(false);
  });

  it('says the output path is a file, not a folder', () => {
    writeFileSync(join(scratch, 'file'), 'x');
    expect(codeOf(() => prepareRunFolder(join(scratch, 'file'), { force: true, resume: false }))).toBe('run.not_a_folder');
  });
});
