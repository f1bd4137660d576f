// Test helper (not a test): a scratch folder for one test file.
import { mkdirSync, rmSync } from 'node:fs';
import { resolve } from 'node:path';
import { afterAll, beforeAll } from 'vitest';

/** `.candela-tmp/<name>`, emptied before the file's tests and removed after them; call at the top level of a test file. */
export function useScratchFolder(name: string): string {
  const dir = resolve('.candela-tmp', name);
  beforeAll(() => {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
  });
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  return dir;
}
