import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pantheonBinnedConfig } from '../../support/pantheonBinnedConfig.js';
import { slurmUnavailableReason, startOneNodeSlurm, TEST_PARTITION, type OneNodeSlurm } from '../../support/slurm/oneNodeSlurm.js';

// A cluster run end to end, through the built command (dist/, as a cluster node runs it):
// `candela fit --plan slurm` writes the job array and the merge script; the array is submitted; part 0
// is sent SIGTERM in the middle of its sampling, as Slurm does `--stop-warning` seconds before a time
// limit (#SBATCH --signal=B:TERM@S); it must checkpoint and exit 130, so that the dependent merge never
// starts (afterok); the array is submitted again for part 0 only, which continues from its checkpoint.
// At 2 x 8 walkers x 1000 steps the merged bulk ESS is below target_ess although each part ran to the end: the
// merge must say NOT CONVERGED, exit 3 and name a step count; the array submitted again with that count
// continues both parts, and the merge then meets its targets and its chains.csv equals byte for byte
// that of one `candela fit` run to that step count.
//
// Where root and Debian's slurm-wlm are present (.ci/run installs it), a one-node Slurm cluster is
// started for the test (slurmctld and slurmd on localhost, see test/support/slurm/oneNodeSlurm.ts),
// the scripts are submitted with sbatch, the signal is sent with `scancel --batch --signal=TERM`, and
// the daemons are stopped afterwards. Elsewhere the test says why and runs the same scripts with bash,
// one process per array task, sending SIGTERM to the part's process itself. (slurmArray.test.ts
// runs the array tasks in-process as well.)
//
// Data: the Pantheon 2018 binned Hubble diagram with its systematic matrix (../shared/data-real/pantheon2018,
// Scolnic et al. 2018). The reference fit differs from the cluster configuration only in target_ess and
// max_steps, which decide when a run stops and never what it samples.

const ENTRY = resolve('dist/src/cli/main.js');
const scratch = resolve('.candela-tmp/slurm-cluster');
/** Steps of the first submission; too few for the merged run's targets (bulk ESS 800 with R-hat across the ensembles <= 1.01). */
const STEPS = 1000;
const WALKERS = 8;
const TARGET_ESS = 800;
const SUITE_SECONDS = 300;

const slurmMissing = slurmUnavailableReason();
const distMissing = existsSync(ENTRY) ? null : `${ENTRY} is not built (npm run build)`;
if (distMissing) console.log(`slurmCluster.test: skipped: ${distMissing}`);
else if (slurmMissing) console.log(`slurmCluster.test: no Slurm here (${slurmMissing}); running the array tasks and merge.sh with bash instead`);

function writeConfig(name: string, sampler: string): string {
  const path = join(scratch, `${name}.yaml`);
  writeFileSync(path, pantheonBinnedConfig({
    title: 'cluster run test', seed: 23,
    models: '  - { label: flat_wcdm, dark_energy: constant_w, curvature: flat }',
    parameters: '  w0: { prior: uniform, min: -2.5, max: -0.3 }',
    sampler: `{ walkers: ${WALKERS}, ensembles: 2, max_minutes: 30, check_every: 100, checkpoint_every: 50, workers: 1, ${sampler} }`,
    output: `{ dir: ${join(scratch, name)}, figures: [triangle], png: false }`,
  }));
  return path;
}

function candela(args: string[]): { status: number | null; stdout: string; stderr: string } {
  const result = spawnSync(process.execPath, [ENTRY, ...args], { encoding: 'utf8' });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const sleep = (ms: number) => new Promise((done) => setTimeout(done, ms));

async function waitFor(what: string, seconds: number, test: () => boolean): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  while (!test()) {
    if (Date.now() > deadline) throw new Error(`waited ${seconds} s for ${what}`);
    await sleep(20);
  }
}

/** What the test asks of a scheduler: the array (or some of its tasks), a signal to one task, the dependent merge. */
interface Scheduler {
  /** Starts the array tasks (all when `tasks` is omitted), with the step count as the script's argument when given; returns a handle. */
  submitParts(tasks?: number[], steps?: number): string;
  /** Sends SIGTERM to the candela process of one running task. */
  signalPart(handle: string, task: number): void;
  /** Waits until every task of the handle has ended; exit code per task. */
  waitParts(handle: string): Promise<Map<number, number>>;
  /** Runs merge.sh after the handle's tasks if all succeeded (afterok); its exit code and log, or null when it never started. */
  mergeAfter(handle: string): Promise<{ code: number; log: string } | null>;
}

function slurmScheduler(slurm: OneNodeSlurm, batch: string, merge: string, logs: string): Scheduler {
  const jobs = (id: string) => slurm.run('squeue', ['-h', '-j', id, '-o', '%i']).trim();
  const records = (id: string) => slurm.run('scontrol', ['-o', 'show', 'job', id]).trim().split('\n');
  return {
    submitParts: (tasks, steps) => slurm.run('sbatch', ['--parsable', ...(tasks ? [`--array=${tasks.join(',')}`] : []), batch, ...(steps ? [String(steps)] : [])]).trim(),
    signalPart: (handle, task) => { slurm.run('scancel', ['--batch', '--signal=TERM', `${handle}_${task}`]); },
    waitParts: async (handle) => {
      await waitFor(`the array job ${handle}`, SUITE_SECONDS, () => jobs(handle) === '');
      const codes = new Map<number, number>();
      for (const line of records(handle)) {
        const task = /ArrayTaskId=(\d+)/.exec(line);
        const exit = /ExitCode=(\d+):/.exec(line);
        if (task && exit) codes.set(Number(task[1]), Number(exit[1]));
      }
      return codes;
    },
    mergeAfter: async (handle) => {
      const id = slurm.run('sbatch', ['--parsable', `--dependency=afterok:${handle}`, merge]).trim();
      let reason = '';
      await waitFor(`the merge job ${id}`, SUITE_SECONDS, () => {
        reason = slurm.run('squeue', ['-h', '-j', id, '-o', '%r']).trim();
        return reason === '' || reason === 'DependencyNeverSatisfied';
      });
      if (reason === 'DependencyNeverSatisfied') {
        slurm.run('scancel', [id]);
        return null;
      }
      const exit = /ExitCode=(\d+):/.exec(records(id)[0]);
      return { code: Number(exit?.[1]), log: readFileSync(join(logs, `merge-${id}.log`), 'utf8') };
    },
  };
}

function bashScheduler(batch: string, merge: string, partCount: number): Scheduler {
  const running = new Map<string, Map<number, ChildProcess>>();
  let next = 0;
  return {
    submitParts: (tasks, steps) => {
      const handle = String(++next);
      const children = new Map<number, ChildProcess>();
      for (const task of tasks ?? Array.from({ length: partCount }, (_, i) => i)) {
        children.set(task, spawn('bash', [batch, ...(steps ? [String(steps)] : [])], { env: { ...process.env, SLURM_ARRAY_TASK_ID: String(task), SLURM_CPUS_PER_TASK: '1' }, stdio: 'ignore' }));
      }
      running.set(handle, children);
      return handle;
    },
    signalPart: (handle, task) => { running.get(handle)?.get(task)?.kill('SIGTERM'); },
    waitParts: async (handle) => {
      const codes = new Map<number, number>();
      for (const [task, child] of running.get(handle) ?? []) {
        codes.set(task, await new Promise<number>((done) => (child.exitCode !== null ? done(child.exitCode) : child.once('exit', (code) => done(code ?? -1)))));
      }
      return codes;
    },
    mergeAfter: async (handle) => {
      const children = [...(running.get(handle)?.values() ?? [])];
      if (children.some((child) => child.exitCode !== 0)) return null;
      const result = spawnSync('bash', [merge], { encoding: 'utf8' });
      return { code: result.status ?? -1, log: result.stdout + result.stderr };
    },
  };
}

describe.skipIf(distMissing !== null)(`a cluster run ${slurmMissing ? 'with the array tasks run by bash (no Slurm here)' : 'on a one-node Slurm cluster'}`, () => {
  const clusterDir = join(scratch, 'cluster');
  const referenceDir = join(scratch, 'reference');
  const partDir = (k: number) => join(clusterDir, 'parts', 'flat_wcdm', `ensemble-${k}`);
  const batch = join(clusterDir, 'slurm', 'candela-parts.sbatch');
  const merge = join(clusterDir, 'slurm', 'merge.sh');
  let slurm: OneNodeSlurm | null = null;
  let scheduler: Scheduler;
  let configPath = '';

  beforeAll(async () => {
    rmSync(scratch, { recursive: true, force: true });
    mkdirSync(scratch, { recursive: true });
    configPath = writeConfig('cluster', `max_steps: 50000, target_ess: ${TARGET_ESS}`);
    if (!slurmMissing) slurm = await startOneNodeSlurm(join(scratch, 'slurm-daemons'));
  }, 60_000);
  afterAll(async () => {
    await slurm?.stop();
    rmSync(scratch, { recursive: true, force: true });
  }, 30_000);

  it('writes the array with the account, partition, memory, time limit and stop signal it was given', () => {
    const planned = candela(['fit', configPath, '--out', clusterDir, '--plan', 'slurm', '--steps-per-part', String(STEPS),
      '--cluster-queue', TEST_PARTITION, '--cluster-account', 'cosmo', '--part-memory', '500M', '--part-minutes', '20', '--stop-warning', '120']);
    expect(planned.status, planned.stderr).toBe(0);
    const text = readFileSync(batch, 'utf8');
    // #SBATCH option names and value formats: Slurm sbatch manual.
    for (const line of ['--array=0-1', `--partition=${TEST_PARTITION}`, '--account=cosmo', '--mem=500M', '--time=00:20:00', '--signal=B:TERM@120']) expect(text).toContain(`#SBATCH ${line}\n`);
    expect(text).toContain(`exec ${process.execPath} ${ENTRY} fit`);
    expect(text).toContain(`--steps-per-part "$steps"`);
    expect(readFileSync(merge, 'utf8')).toContain(`#SBATCH --partition=${TEST_PARTITION}\n`);
    scheduler = slurm ? slurmScheduler(slurm, batch, merge, join(clusterDir, 'slurm', 'logs')) : bashScheduler(batch, merge, 2);
  });

  it('stops a part that is sent SIGTERM with a checkpoint and exit code 130, and the merge after it never starts', async () => {
    const handle = scheduler.submitParts();
    await waitFor('the first checkpoint of part 0', SUITE_SECONDS, () => existsSync(join(partDir(0), 'checkpoint.bin')));
    scheduler.signalPart(handle, 0);
    const codes = await scheduler.waitParts(handle);
    expect(codes.get(0)).toBe(130); // 128 + SIGINT: the interrupted-fit exit code (README)
    expect(codes.get(1)).toBe(0);
    const stopped = JSON.parse(readFileSync(join(partDir(0), 'run.json'), 'utf8'));
    expect(stopped.run.stop_reason).toBe('interrupted');
    expect(stopped.run.steps).toBeLessThan(STEPS);
    const finished = JSON.parse(readFileSync(join(partDir(1), 'run.json'), 'utf8'));
    expect(finished.run.stop_reason).toBe('max_steps'); // a part never stops on its own ensemble's diagnostics
    expect(finished.run.steps).toBe(STEPS);
    expect(await scheduler.mergeAfter(handle)).toBeNull(); // afterok: a failed task holds the merge back
  }, SUITE_SECONDS * 1000);

  let suggested = 0;

  it('continues the signalled part from its checkpoint; the merge then says loudly that the merged run has not converged', async () => {
    const handle = scheduler.submitParts([0]);
    expect((await scheduler.waitParts(handle)).get(0)).toBe(0);
    const resumed = JSON.parse(readFileSync(join(partDir(0), 'run.json'), 'utf8'));
    expect(resumed.run.steps).toBe(STEPS);
    const merged = await scheduler.mergeAfter(handle);
    expect(merged, 'the merge job ran').not.toBeNull();
    expect(merged!.code, merged!.log).toBe(3);
    expect(merged!.log).toMatch(/NOT CONVERGED: the merged run of flat_wcdm misses its targets/);
    expect(merged!.log).toMatch(/the (bulk ESS of (omega_m|w0) is \d+, below target_ess 800|R-hat of (omega_m|w0) is 1\.\d+, above max_rhat 1\.01)/);
    const record = JSON.parse(readFileSync(join(clusterDir, 'flat_wcdm', 'run.json'), 'utf8'));
    expect(record.merge.targets_met).toBe(false);
    suggested = record.merge.steps_suggested;
    expect(suggested).toBeGreaterThan(STEPS);
    expect(merged!.log).toContain(`sbatch ${batch} ${suggested}`);
    const summary = JSON.parse(readFileSync(join(clusterDir, 'flat_wcdm', 'summary.json'), 'utf8'));
    expect(summary.convergence.passed).toBe(false);
  }, SUITE_SECONDS * 1000);

  it('follows the remedy: both parts continue to the suggested steps, and the merge meets its targets with the chains of one fit', async () => {
    const handle = scheduler.submitParts(undefined, suggested);
    const codes = await scheduler.waitParts(handle);
    expect([codes.get(0), codes.get(1)]).toEqual([0, 0]);
    const merged = await scheduler.mergeAfter(handle);
    expect(merged, 'the merge job ran').not.toBeNull();
    expect(merged!.code, merged!.log).toBe(0);
    expect(merged!.log).toMatch(new RegExp(`merged 2 parts of flat_wcdm \\(${suggested} steps each.*: converged`));
    const record = JSON.parse(readFileSync(join(clusterDir, 'flat_wcdm', 'run.json'), 'utf8'));
    expect(record.merge.targets_met).toBe(true);
    const summary = JSON.parse(readFileSync(join(clusterDir, 'flat_wcdm', 'summary.json'), 'utf8'));
    expect(summary.convergence.passed).toBe(true);
    for (const name of ['omega_m', 'w0']) {
      expect(summary.diagnostics[name].ess_bulk).toBeGreaterThanOrEqual(TARGET_ESS);
      expect(summary.diagnostics[name].rhat).toBeLessThanOrEqual(1.01); // max_rhat default
    }
    // The reference: one fit of the same data, seed and sampler, run to the same step count.
    const reference = candela(['fit', writeConfig('reference', `max_steps: ${suggested}, target_ess: 100000000`), '--out', referenceDir, '--quiet']);
    expect(reference.status, reference.stderr).toBe(0);
    const mergedChains = readFileSync(join(clusterDir, 'flat_wcdm', 'chains.csv'));
    // chains.csv keeps the steps after the burn-in, thinned to half a tau (output.chains default): still many rows.
    expect(mergedChains.toString('utf8').trimEnd().split('\n').length).toBeGreaterThan(WALKERS * 2 * 10);
    expect(mergedChains.equals(readFileSync(join(referenceDir, 'chains.csv')))).toBe(true);
  }, SUITE_SECONDS * 1000);

  // Slurm's own warning, not one sent by hand: a part with a 2-minute limit and far more steps than fit in it
  // asks for SIGTERM 50 s before the limit (#SBATCH --signal=B:TERM@50). Slurm may send it up to 60 s early (the
  // resolution of its event handling, sbatch(1) --signal), so 10 to 70 s after the start: with a 1-minute limit it
  // could come during the part's start-up, before any step exists to checkpoint. Slurm delivers it to the batch
  // shell, which is candela (exec); the part must write its checkpoint and exit 130 before the limit (state
  // FAILED, not TIMEOUT). The bash fallback has no time limit to warn of, so this runs under Slurm only.
  it.skipIf(slurmMissing !== null)('receives the SIGTERM the batch script asks Slurm for before the time limit, and stops with a checkpoint', async () => {
    const signalDir = join(scratch, 'warned');
    const planned = candela(['fit', configPath, '--out', signalDir, '--plan', 'slurm', '--steps-per-part', '100000000',
      '--cluster-queue', TEST_PARTITION, '--part-memory', '500M', '--part-minutes', '2', '--stop-warning', '50']);
    expect(planned.status, planned.stderr).toBe(0);
    const started = Date.now();
    const id = slurm!.run('sbatch', ['--parsable', '--array=0', join(signalDir, 'slurm', 'candela-parts.sbatch')]).trim();
    await waitFor(`the warned job ${id}`, 180, () => slurm!.run('squeue', ['-h', '-j', id, '-o', '%i']).trim() === '');
    expect(Date.now() - started).toBeLessThan(120_000 + 30_000); // ended by the signal, not killed at the limit plus KillWait
    const state = slurm!.run('scontrol', ['-o', 'show', 'job', id]);
    expect(state).toMatch(/JobState=FAILED /);
    expect(state).toMatch(/ExitCode=130:0/);
    const record = JSON.parse(readFileSync(join(signalDir, 'parts', 'flat_wcdm', 'ensemble-0', 'run.json'), 'utf8'));
    expect(record.run.stop_reason).toBe('interrupted');
    expect(existsSync(join(signalDir, 'parts', 'flat_wcdm', 'ensemble-0', 'checkpoint.bin'))).toBe(true);
    expect(readFileSync(join(signalDir, 'slurm', 'logs', `part-${id}_0.log`), 'utf8')).toMatch(/^SIGTERM: stopping/m);
  }, 240_000);
});
