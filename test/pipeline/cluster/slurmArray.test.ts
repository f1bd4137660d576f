import { cpSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { main } from '../../../src/cli/main.js';
import { isCandelaError } from '../../../src/errors.js';
import { readChainRecordDraws } from '../../../src/output/run/chainRecordFile.js';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { mergeParts, runFit } from '../../../src/pipeline/index.js';

// A Slurm job array run without Slurm: the suite cannot rely on a scheduler
// (none on the CI machine, and starting slurmctld + slurmd needs root,
// munge and systemd), so it does what Slurm would do with the plan. It
// reads the generated batch script, takes the array range from its
// `#SBATCH --array` line and the task command from its last line, runs that
// command for every task id with SLURM_ARRAY_TASK_ID set (through the CLI
// entry point, in-process), then runs the merge script's commands. The
// reference is a single `candela fit` of the same configuration and seed:
// the merged chains.csv must equal its chains.csv byte for byte. Data:
// the Pantheon 2018 binned Hubble diagram (../shared/data-real/pantheon2018,
// Scolnic et al. 2018); target_ess is out of reach so every run stops at
// max_steps, and the merge must say that the merged run misses it.
// slurmCluster.test.ts runs the same scripts under a real one-node Slurm.
const scratch = resolve('.candela-tmp/slurm-array');
const STEPS = 150;

function writeConfig(name: string, seed = 11): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'cluster parts test', seed,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: `{ walkers: 8, ensembles: 2, max_steps: ${STEPS}, max_minutes: 30, check_every: 50, checkpoint_every: 50, target_ess: 1000000, workers: 1 }`,
    output: `{ dir: ${join(scratch, name)}, figures: [triangle, hubble, trace], png: false }`,
  }));
  return path;
}

/** Splits one shell command line into words: single quotes literal, double quotes expand $NAME and ${NAME:-default}; an unquoted expansion that is empty is no word. */
function shellWords(line: string, env: Record<string, string>): string[] {
  const expand = (text: string) => text.replace(/\$\{(\w+):-([^}]*)\}|\$(\w+)/g, (_, name: string, fallback: string, bare: string) => env[name ?? bare] ?? (name ? fallback : ''));
  const words: string[] = [];
  const pattern = /'([^']*)'|"((?:[^"\\]|\\.)*)"|([^\s'"]+)|(\s+)/g;
  let current: string | null = null;
  for (const match of line.matchAll(pattern)) {
    if (match[4] !== undefined) { if (current !== null) words.push(current); current = null; continue; }
    const piece = match[1] ?? expand(match[2] ?? match[3]);
    if (match[3] !== undefined && piece === '' && current === null) continue;
    current = (current ?? '') + piece;
  }
  if (current !== null) words.push(current);
  return words;
}

/** The arguments after the launcher (node + entry script, or npx candela) of a script line. */
function candelaArguments(words: string[], command: string): string[] {
  const at = words.indexOf(command);
  expect(at, `'${command}' in ${words.join(' ')}`).toBeGreaterThan(0);
  return words.slice(at);
}

async function runCli(argv: string[]): Promise<number> {
  const saved = process.exitCode;
  const code = await main(argv);
  process.exitCode = saved;
  return code;
}

const fullDir = join(scratch, 'full');
const clusterDir = join(scratch, 'cluster');
const mergedDir = join(clusterDir, 'flat_wcdm');
const partDir = (k: number) => join(clusterDir, 'parts', 'flat_wcdm', `ensemble-${k}`);

beforeAll(async () => {
  rmSync(scratch, { recursive: true, force: true });
  mkdirSync(scratch, { recursive: true });
  vi.spyOn(process.stdout, 'write').mockImplementation(() => true);
  vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
  await runFit({ configPath: writeConfig('full') });
}, 60_000);
afterAll(() => {
  vi.restoreAllMocks();
  rmSync(scratch, { recursive: true, force: true });
});

describe('candela fit --plan slurm, the array tasks, and merge.sh', () => {
  let batch = '';

  it('writes a batch script with one array task per part, the resources of the configuration and a log folder', async () => {
    expect(await runCli(['fit', writeConfig('cluster'), '--out', clusterDir, '--plan', 'slurm'])).toBe(0);
    batch = readFileSync(join(clusterDir, 'slurm', 'candela-parts.sbatch'), 'utf8');
    expect(batch.startsWith('#!/bin/bash\n')).toBe(true);
    expect(batch).toMatch(/^#SBATCH --array=0-1$/m); // 1 model x 2 ensembles
    expect(batch).toMatch(/^#SBATCH --cpus-per-task=1$/m); // sampler.workers
    expect(batch).toMatch(/^#SBATCH --time=00:43:00$/m); // 30 min x 1.1 + 10 min
    expect(batch).toMatch(/^#SBATCH --signal=B:TERM@600$/m); // SIGTERM to the batch shell 10 min before the limit (sbatch manual, --signal)
    expect(batch).not.toMatch(/^#SBATCH --(account|partition|mem)=/m); // none asked: the cluster's defaults
    expect(batch).toMatch(/^#SBATCH --job-name=candela-cluster$/m);
    expect(batch).toMatch(/^#SBATCH --output=.*\/slurm\/logs\/part-%A_%a\.log$/m);
    expect(existsSync(join(clusterDir, 'slurm', 'logs'))).toBe(true);
    // Slurm reads #SBATCH lines only before the first command (sbatch manual).
    const lines = batch.split('\n');
    const lastOption = Math.max(...lines.map((line, i) => (line.startsWith('#SBATCH') ? i : -1)));
    expect(lines.slice(1, lastOption).every((line) => line.startsWith('#'))).toBe(true);
    await expect(runCli(['fit', writeConfig('cluster'), '--out', clusterDir, '--plan', 'slurm'])).resolves.toBe(2); // exists, no --force
  });

  it('runs every array task command with SLURM_ARRAY_TASK_ID into its part folder', async () => {
    const range = /^#SBATCH --array=(\d+)-(\d+)$/m.exec(batch);
    expect(range).not.toBeNull();
    const command = batch.trim().split('\n').at(-1) as string;
    expect(command.startsWith('exec ')).toBe(true); // the batch shell becomes candela, so Slurm's signal reaches it
    const steps = /^steps="\$\{1:-(\d+)\}"$/m.exec(batch);
    expect(steps?.[1]).toBe(String(STEPS)); // sampler.max_steps when --steps-per-part is not given
    const cd = shellWords(batch.split('\n').find((line) => line.startsWith('cd ')) as string, {});
    expect(cd[1]).toBe(process.cwd());
    // The launcher is this node binary and candela's own entry script (src/cli/main.ts here, dist/src/cli/main.js when built).
    const launcher = shellWords(command, {}).slice(1, 3);
    expect(launcher[0]).toBe(process.execPath);
    expect(launcher[1]).toBe(resolve('src/cli/main.js'));
    for (let task = Number(range![1]); task <= Number(range![2]); task++) {
      // No checkpoint yet, so the script's `resume` is empty.
      const argv = candelaArguments(shellWords(command, { SLURM_ARRAY_TASK_ID: String(task), steps: steps![1], resume: '' }), 'fit');
      expect(argv).toContain('--part');
      expect(await runCli(argv)).toBe(0);
      const record = JSON.parse(readFileSync(join(partDir(task), 'run.json'), 'utf8'));
      expect(record.part.ensemble).toBe(task);
      expect(record.run.ensembles).toBe(1);
      expect(record.run.steps).toBe(STEPS);
      expect(record.part.steps_target).toBe(STEPS);
    }
  }, 60_000);

  it('merges the parts into chains.csv equal byte for byte to a single full fit, and says that it misses target_ess', async () => {
    const merge = readFileSync(join(clusterDir, 'slurm', 'merge.sh'), 'utf8');
    expect(merge).toMatch(/sbatch --dependency=afterok:<jobid>/);
    const commands = merge.split('\n').filter((line) => !line.startsWith('#') && / merge /.test(line));
    expect(commands).toHaveLength(1); // one model
    const stderrBefore = vi.mocked(process.stderr.write).mock.calls.length;
    for (const line of commands) {
      expect(line.endsWith(' || status=$?')).toBe(true);
      expect(await runCli(candelaArguments(shellWords(line.replace(/ \|\| status=\$\?$/, ''), {}), 'merge'))).toBe(3); // target_ess 10^6 is out of reach
    }
    const printed = vi.mocked(process.stderr.write).mock.calls.slice(stderrBefore).map((call) => String(call[0])).join('');
    expect(printed).toMatch(/^NOT CONVERGED: the merged run of flat_wcdm misses its targets \(target_ess 1000000, max_rhat 1\.01\):$/m);
    expect(printed).toMatch(/the bulk ESS of w0 is \d+, below target_ess 1000000/);
    expect(printed).toContain(`sbatch ${join(clusterDir, 'slurm', 'candela-parts.sbatch')} `);
    const merged = readFileSync(join(mergedDir, 'chains.csv'));
    const full = readFileSync(join(fullDir, 'chains.csv'));
    expect(merged.length).toBeGreaterThan(1000);
    expect(merged.equals(full)).toBe(true);
    // Same chains, burn-in and seed: the Hubble files agree too.
    for (const file of ['hubble_diagram.csv', 'hubble_model.csv']) expect(readFileSync(join(mergedDir, file)).equals(readFileSync(join(fullDir, file))), file).toBe(true);
    const record = JSON.parse(readFileSync(join(mergedDir, 'run.json'), 'utf8'));
    const partEvaluations = [0, 1].map((k) => JSON.parse(readFileSync(join(partDir(k), 'run.json'), 'utf8')).run.evaluations as number);
    expect(record.run.stop_reason).toBe('merged');
    expect(record.merge.targets_met).toBe(false);
    expect(record.merge.steps_suggested).toBeGreaterThan(STEPS);
    expect(record.merge.parts.map((part: { steps_target: number }) => part.steps_target)).toEqual([STEPS, STEPS]);
    expect(record.run.ensembles).toBe(2);
    expect(record.run.evaluations).toBe(partEvaluations[0] + partEvaluations[1]);
    expect(record.merge.parts.map((part: { ensemble: number }) => part.ensemble)).toEqual([0, 1]);
    const summary = JSON.parse(readFileSync(join(mergedDir, 'summary.json'), 'utf8'));
    const fullSummary = JSON.parse(readFileSync(join(fullDir, 'summary.json'), 'utf8'));
    expect(summary.diagnostics.w0.rhat).toBe(fullSummary.diagnostics.w0.rhat); // R-hat across the parts' ensembles
    for (const file of ['report.html', 'figures/triangle.svg', 'contours/omega_m__w0.geojson']) expect(existsSync(join(mergedDir, file)), file).toBe(true);
  }, 60_000);
});

describe('candela fit, cluster options out of place', () => {
  it('refuses plan options without --plan and --steps-per-part without --part or --plan (exit 2, nothing sampled)', async () => {
    const config = writeConfig('misplaced');
    expect(await runCli(['fit', config, '--cluster-queue', 'long'])).toBe(2);
    expect(await runCli(['fit', config, '--part-memory', '4G', '--stop-warning', '60'])).toBe(2);
    expect(await runCli(['fit', config, '--steps-per-part', '500'])).toBe(2);
    expect(await runCli(['fit', config, '--plan', 'slurm', '--part-memory', '4 GB'])).toBe(2);
    expect(await runCli(['fit', config, '--plan', 'slurm', '--part-minutes', 'soon'])).toBe(2);
    expect(existsSync(join(scratch, 'misplaced'))).toBe(false);
  });
});

describe('mergeParts', () => {
  const codeOf = (error: unknown) => (isCandelaError(error) ? error.issues.map((issue) => `${issue.code} ${issue.message}`).join('\n') : String(error));
  const copyPart = (k: number, name: string, edit: (record: Record<string, any>) => void): string => {
    const copy = join(scratch, name);
    cpSync(partDir(k), copy, { recursive: true });
    const record = JSON.parse(readFileSync(join(copy, 'run.json'), 'utf8'));
    edit(record);
    writeFileSync(join(copy, 'run.json'), JSON.stringify(record));
    return copy;
  };
  const refusal = async (dirs: string[], outDir = join(scratch, 'refused')) => {
    try {
      await mergeParts({ partDirs: dirs, outDir });
    } catch (error) {
      expect(existsSync(outDir)).toBe(false); // nothing written
      return codeOf(error);
    }
    throw new Error('the merge was expected to fail');
  };

  it('refuses two parts holding the same ensemble, naming both folders', async () => {
    const twin = copyPart(1, 'twin', () => undefined);
    const message = await refusal([partDir(0), partDir(1), twin]);
    expect(message).toMatch(/merge\.duplicate_ensemble/);
    expect(message).toContain(twin);
  });

  it('refuses a part sampled with another seed or another configuration, naming it', async () => {
    const reseeded = copyPart(1, 'reseeded', (record) => { record.run.seed = '12'; record.configuration.seed = 12; });
    expect(await refusal([partDir(0), reseeded])).toMatch(new RegExp(`merge\\.seed_differs .*${reseeded}`));
    const changed = copyPart(1, 'changed', (record) => { record.configuration.sampler.walkers = 10; });
    expect(await refusal([partDir(0), changed])).toMatch(new RegExp(`merge\\.configuration_differs .*${changed}`));
    const edited = copyPart(1, 'edited', (record) => { record.inputs[1].sha256 = '0'.repeat(64); });
    expect(await refusal([partDir(0), edited])).toMatch(/merge\.inputs_differ/);
  });

  it('notes a merge of fewer ensembles than the configuration has', async () => {
    const { record } = await mergeParts({ partDirs: [partDir(1)], outDir: join(scratch, 'one-of-two') });
    expect(record.merge.shortfalls).toContain("only 1 of the configuration's 2 ensembles were merged (ensembles 1)");
  }, 60_000);

  it('refuses a folder that is not a part, and an output folder that holds the parts', async () => {
    expect(await refusal([partDir(0), fullDir])).toMatch(/merge\.not_a_part/);
    await expect(mergeParts({ partDirs: [partDir(0), partDir(1)], outDir: clusterDir, force: true })).rejects.toSatisfy((error: unknown) => /merge\.out_holds_parts/.test(codeOf(error)));
    expect(existsSync(partDir(0))).toBe(true);
  });

  it('cuts every part to the shortest one', async () => {
    const controller = new AbortController();
    const shortDir = join(scratch, 'short');
    await runFit({ configPath: writeConfig('cluster'), outDir: shortDir, part: 1, signal: controller.signal, onProgress: (p) => { if (p.step >= 100) controller.abort(); } });
    const { record } = await mergeParts({ partDirs: [partDir(0), join(shortDir, 'parts', 'flat_wcdm', 'ensemble-1')], outDir: join(scratch, 'cut') });
    expect(record.run.steps).toBe(100);
    expect(record.merge.shortfalls).toContain(`the part ${join(shortDir, 'parts', 'flat_wcdm', 'ensemble-1')} stopped (interrupted) at step 100 of ${STEPS}; the merge cut every part to its length`);
    // Every value of the cut run equals the full run's at the same ensemble, walker and step: the merged folder's chain
    // record (every step, whatever chains.csv keeps) holds the full run's first 100 steps bit for bit.
    const shape = { ensembles: 2, walkers: 8, dimension: 2, blobCount: 2 + record.parameters.derived.length };
    const cut = readChainRecordDraws(join(scratch, 'cut'), shape, 100);
    const full = readChainRecordDraws(fullDir, shape, 100);
    for (let k = 0; k < 2; k++) {
      for (const key of ['positions', 'logProb', 'blobs'] as const) expect(Buffer.from(cut[k][key].buffer).equals(Buffer.from(full[k][key].buffer)), `${k} ${key}`).toBe(true);
    }
  }, 60_000);
});
