// Test helper (not a test): runs the built `candela` (dist/) as a real process, sends it real signals, and reads
// what an interrupted run leaves in its folder. Shared by the signal tests of candela fit.
import { spawn } from 'node:child_process';
import { existsSync, readFileSync, readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { decodeBinaryState } from '../../src/output/run/binaryState.js';

/** The built command line (npm run build writes it). */
export const CANDELA_COMMAND = resolve('dist/src/cli/main.js');

/** The line a fit prints when a signal has stopped its sampling: an ensemble run, one still placing its walkers, or nested sampling. */
const STOP_LINE = /stopped at step \d+ on the signal|interrupted while the walkers|nested sampling stopped on the signal/g;

/** What an interrupted process did, times in seconds after the first signal (null when no signal was sent). */
export interface Finished {
  code: number | null;
  killedBy: NodeJS.Signals | null;
  stderr: string;
  secondsAfterSignal: number | null;
  /** The first "stopped at step N on the signal" (or start-up or nested-sampling interrupt) line. */
  secondsToStop: number | null;
  /** Every such line, in the order they came. */
  secondsToEachStop: number[];
}

/**
 * Spawns `candela <args>` detached (its own process group) and sends `signals` once `ready()` holds (polled every
 * 10 ms), the second one `gapMs` after the first: to the whole group, as a terminal or a batch scheduler does, or with
 * `toGroup: false` to the process alone, as `kill PID` does.
 */
export function runAndSignal(args: string[], signals: NodeJS.Signals[], ready: (stderr: string) => boolean, options: { gapMs?: number; toGroup?: boolean } = {}): Promise<Finished> {
  const { gapMs = 0, toGroup = true } = options;
  return new Promise((resolvePromise, reject) => {
    const child = spawn(process.execPath, [CANDELA_COMMAND, ...args], { detached: true, stdio: ['ignore', 'ignore', 'pipe'] });
    const target = () => (toGroup ? -(child.pid as number) : (child.pid as number));
    let stderr = '';
    let sentAt: number | null = null;
    const stops: number[] = [];
    child.stderr.on('data', (chunk) => {
      const before = (stderr.match(STOP_LINE) ?? []).length;
      stderr += String(chunk);
      const after = (stderr.match(STOP_LINE) ?? []).length;
      for (let k = before; k < after; k++) stops.push(Date.now());
    });
    const poll = setInterval(() => {
      if (sentAt !== null || signals.length === 0 || !ready(stderr)) return;
      sentAt = Date.now();
      clearInterval(poll);
      process.kill(target(), signals[0]);
      if (signals[1]) setTimeout(() => { try { process.kill(target(), signals[1]); } catch { /* already gone */ } }, gapMs);
    }, 10);
    child.on('error', reject);
    child.on('exit', (code, killedBy) => {
      clearInterval(poll);
      const since = (time: number | null) => (sentAt === null || time === null ? null : (time - sentAt) / 1000);
      resolvePromise({
        code, killedBy, stderr, secondsAfterSignal: since(Date.now()), secondsToStop: since(stops[0] ?? null),
        secondsToEachStop: stops.map((time) => since(time) as number),
      });
    });
  });
}

/** The step of the run folder's checkpoint, or -1 while there is none (a checkpoint is replaced by a rename, so it is read whole). */
export function checkpointStep(runDir: string): number {
  const path = join(runDir, 'checkpoint.bin');
  if (!existsSync(path)) return -1;
  return decodeBinaryState<{ snapshot: { stepCount: number } }>(readFileSync(path)).snapshot.stepCount;
}

/** The steps a run folder's run.json records. */
export function stepsInRunRecord(runDir: string): number {
  return (JSON.parse(readFileSync(join(runDir, 'run.json'), 'utf8')) as { run: { steps: number } }).run.steps;
}

/** Temporary files (of atomic writes) left anywhere under `dir`. */
export function temporaryFiles(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir, { recursive: true }).map(String).filter((name) => /\.tmp(-\d+)?$|tmp-\d+$/.test(name));
}
