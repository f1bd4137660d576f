import { copyFileSync, existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { configToPlainObject, loadConfigFile, parseConfigText } from '../../../src/config/index.js';
import type { RunOnDisk } from '../../../src/pipeline/run/runFiles.js';
import { storedConfiguration } from '../../../src/pipeline/run/storedConfiguration.js';
import { writeResolvedConfig } from '../../../src/pipeline/run/writeResolvedConfig.js';
import { runCommandLine } from '../../support/runCommandLine.js';
import { PANTHEON_BINNED_FOLDER } from '../../support/pantheonBinnedConfig.js';
import { useScratchFolder } from '../../support/scratchFolder.js';
import { writePantheonProject } from '../../support/pantheonProject.js';

// The resolved configuration stored in a run folder names its files relative
// to that folder. Data: the Pantheon 2018 binned Hubble diagram and its
// systematic matrix (Scolnic et al. 2018, ApJ 859, 101), copied next to a
// configuration that names them by relative paths, as most users write them.
const scratch = useScratchFolder('write-resolved-config');

afterEach(() => { process.exitCode = undefined; });

function writeProject(): string {
  const project = join(scratch, 'project');
  const path = writePantheonProject(project, 'run.yaml', '    covariances:\n      - { file: data/sys_DS17f.txt, applies_to: magnitudes }\n', 'models:\n  - { label: flat_lcdm, dark_energy: lambda }\noutput: { dir: out }\n');
  copyFileSync(join(PANTHEON_BINNED_FOLDER, 'sys_DS17f.txt'), join(project, 'data', 'sys_DS17f.txt'));
  // Loaded by a path relative to the working folder, as `candela fit configs/x.yaml` does.
  return relative(process.cwd(), path);
}

describe('writeResolvedConfig', () => {
  it('writes paths relative to the run folder, so `candela check RUN/config.resolved.yaml` passes from any folder', async () => {
    const config = loadConfigFile(writeProject());
    const runDir = relative(process.cwd(), join(scratch, 'project', 'out', 'flat_lcdm'));
    mkdirSync(runDir, { recursive: true });
    writeResolvedConfig(runDir, config);
    const stored = join(runDir, 'config.resolved.yaml');
    const text = readFileSync(stored, 'utf8');
    expect(text).toContain('file: ../../data/lcparam_DS17f.txt');
    expect(text).toContain('file: ../../data/sys_DS17f.txt');
    expect(text).toContain('dir: ..');
    const check = await runCommandLine(['check', stored]);
    expect(check.stderr).not.toMatch(/error/);
    expect(check.code).toBe(0);
    // Read back, the copy names the same files and the same output folder as the original.
    const again = parseConfigText(text, stored);
    if (!again.ok) throw new Error('the stored copy does not parse');
    expect(again.value.supernovae[0].table.file.resolved).toBe(config.supernovae[0].table.file.resolved);
    expect(again.value.supernovae[0].covariances[0].file.resolved).toBe(config.supernovae[0].covariances[0].file.resolved);
    expect(again.value.output.dir.resolved).toBe(config.output.dir.resolved);
  });

  it('lets storedConfiguration read the copy, so a run folder moved with its data still finds its files', () => {
    const config = loadConfigFile(writeProject());
    const runDir = join(scratch, 'project', 'out', 'flat_lcdm');
    mkdirSync(runDir, { recursive: true });
    writeResolvedConfig(runDir, config);
    const moved = join(scratch, 'moved');
    renameSync(join(scratch, 'project'), moved);
    // A stand-in for a run folder read back: run.json's configuration keeps the paths of the original place.
    const run = { dir: join(moved, 'out', 'flat_lcdm'), record: { configuration: configToPlainObject(config) } } as unknown as RunOnDisk;
    const stored = storedConfiguration(run);
    if (!stored.ok) throw new Error(stored.issues.map((issue) => issue.message).join('; '));
    const table = resolve(stored.value.supernovae[0].table.file.resolved);
    expect(table).toBe(join(moved, 'data', 'lcparam_DS17f.txt'));
    expect(existsSync(table)).toBe(true);
    // Without the note (a copy written before), run.json's paths are used.
    writeFileSync(join(run.dir, 'config.resolved.yaml'), '# old copy\n');
    const old = storedConfiguration({ ...run } as RunOnDisk);
    expect(old.ok && resolve(old.value.supernovae[0].table.file.resolved)).toBe(resolve(config.supernovae[0].table.file.resolved));
  });
});
