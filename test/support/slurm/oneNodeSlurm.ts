// Test helper (not a test): a one-node Slurm cluster on this machine, started from a configuration
// written into a scratch folder and stopped again by the test that started it. Needs root and Debian's
// slurm-wlm package (.ci/run installs it); no systemd and no munge: the daemons run in the foreground
// as children of the test process, with AuthType=auth/none and CredType=cred/none.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';

/** The Slurm commands the tests run; looked up in PATH and the system folders Debian installs them into. */
const COMMANDS = ['slurmctld', 'slurmd', 'sbatch', 'squeue', 'scontrol', 'scancel', 'sinfo'] as const;
const SYSTEM_FOLDERS = ['/usr/sbin', '/usr/bin', '/usr/local/sbin', '/usr/local/bin'];
/** Seconds to wait for the node to report itself idle after the daemons start. */
const START_SECONDS = 30;
/** Name of the one partition. */
export const TEST_PARTITION = 'candela-test';

/** A running one-node cluster. */
export interface OneNodeSlurm {
  /** Environment for the Slurm commands (SLURM_CONF points at this cluster's configuration). */
  env: NodeJS.ProcessEnv;
  /** Runs a Slurm command against this cluster; throws with its stderr when it fails. */
  run(command: (typeof COMMANDS)[number], args: string[]): string;
  /** Stops the two daemons this helper started (SIGTERM, then SIGKILL after 10 s). */
  stop(): Promise<void>;
}

function findCommand(name: string): string | null {
  const folders = [...(process.env.PATH ?? '').split(':').filter(Boolean), ...SYSTEM_FOLDERS];
  for (const folder of folders) if (existsSync(join(folder, name))) return join(folder, name);
  return null;
}

/**
 * Why a one-node Slurm cannot be started here, or null when it can: the
 * daemons need Linux, root (they run as SlurmUser=root) and the slurm-wlm
 * commands.
 */
export function slurmUnavailableReason(): string | null {
  if (process.platform !== 'linux') return `Slurm needs Linux (this is ${process.platform})`;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) return 'starting slurmctld and slurmd needs root';
  const missing = COMMANDS.filter((name) => findCommand(name) === null);
  if (missing.length > 0) return `the Slurm commands ${missing.join(', ')} are not installed (apt-get install slurm-wlm)`;
  return null;
}

/** A TCP port nobody listens on now (the kernel's choice). */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

function configuration(dir: string, controllerPort: number, nodePort: number): string {
  return [
    'ClusterName=candelatest',
    'SlurmctldHost=localhost',
    `SlurmctldPort=${controllerPort}`,
    `SlurmdPort=${nodePort}`,
    'AuthType=auth/none',
    'CredType=cred/none',
    'ProctrackType=proctrack/linuxproc',
    'TaskPlugin=task/none',
    'SelectType=select/cons_tres',
    'SelectTypeParameters=CR_Core_Memory',
    'SchedulerType=sched/backfill',
    'MpiDefault=none',
    'JobCompType=jobcomp/none',
    'AccountingStorageType=accounting_storage/none',
    'SlurmUser=root',
    'SlurmdUser=root',
    'ReturnToService=2',
    // Keep finished jobs visible to scontrol for the whole test (the default is 300 s).
    'MinJobAge=3600',
    `StateSaveLocation=${join(dir, 'state')}`,
    `SlurmdSpoolDir=${join(dir, 'spool')}`,
    `SlurmctldPidFile=${join(dir, 'slurmctld.pid')}`,
    `SlurmdPidFile=${join(dir, 'slurmd.pid')}`,
    `SlurmctldLogFile=${join(dir, 'slurmctld.log')}`,
    `SlurmdLogFile=${join(dir, 'slurmd.log')}`,
    'NodeName=localhost CPUs=2 RealMemory=2000 State=UNKNOWN',
    `PartitionName=${TEST_PARTITION} Nodes=localhost Default=YES MaxTime=INFINITE State=UP`,
    '',
  ].join('\n');
}

function waitForExit(child: ChildProcess, seconds: number): Promise<boolean> {
  if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve(true);
  return new Promise((resolve) => {
    const timer = setTimeout(() => resolve(false), seconds * 1000);
    child.once('exit', () => { clearTimeout(timer); resolve(true); });
  });
}

/**
 * Writes slurm.conf into `dir` (ports chosen free, state and spool folders
 * inside `dir`), starts slurmctld and slurmd in the foreground as children of
 * this process, and waits until the node is idle.
 * @param dir scratch folder (created).
 * @returns the running cluster; call stop() when done.
 * @throws Error when the node is not idle after 30 s (the daemons are stopped first).
 */
export async function startOneNodeSlurm(dir: string): Promise<OneNodeSlurm> {
  for (const sub of ['state', 'spool']) mkdirSync(join(dir, sub), { recursive: true });
  const confPath = join(dir, 'slurm.conf');
  writeFileSync(confPath, configuration(dir, await freePort(), await freePort()));
  const env = { ...process.env, SLURM_CONF: confPath };
  const path = (name: string) => findCommand(name) as string;
  const daemons = [
    spawn(path('slurmctld'), ['-D', '-i'], { env, stdio: 'ignore' }),
    spawn(path('slurmd'), ['-D', '-N', 'localhost'], { env, stdio: 'ignore' }),
  ];
  const run = (command: (typeof COMMANDS)[number], args: string[]): string => {
    const result = spawnSync(path(command), args, { env, encoding: 'utf8' });
    if (result.status !== 0) throw new Error(`${command} ${args.join(' ')} failed (${result.status}): ${result.stderr}`);
    return result.stdout;
  };
  // Should the test process end without calling stop() (a crash, a killed runner), the daemons go with it.
  const killOnExit = () => { for (const daemon of daemons) if (daemon.exitCode === null && daemon.signalCode === null) daemon.kill('SIGKILL'); };
  process.once('exit', killOnExit);
  const stop = async () => {
    process.off('exit', killOnExit);
    for (const daemon of daemons) if (daemon.exitCode === null && daemon.signalCode === null) daemon.kill('SIGTERM');
    for (const daemon of daemons) if (!(await waitForExit(daemon, 10))) daemon.kill('SIGKILL');
  };
  const deadline = Date.now() + START_SECONDS * 1000;
  while (Date.now() < deadline) {
    const state = spawnSync(path('sinfo'), ['-h', '-n', 'localhost', '-o', '%T'], { env, encoding: 'utf8' });
    if (state.status === 0 && state.stdout.trim() === 'idle') return { env, run, stop };
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  await stop();
  throw new Error(`the one-node Slurm in ${dir} did not become idle within ${START_SECONDS} s (see slurmctld.log and slurmd.log there)`);
}
