import { existsSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { loadConfigFile, type CandelaConfig } from '../../config/index.js';
import { EXIT_BAD_INPUT, EXIT_INTERNAL } from '../../errors.js';
import { RUN_FILES } from '../../output/index.js';
import { modelsPageIsCurrent, writeFinalModelsIndex, type OutputsWindow } from './finalModelsIndex.js';
import { startModelProcess, type ModelProcess, type ModelProcessEnd } from './modelProcess.js';
import { isFitInterrupted, runFit, runFolderFor } from './runFit.js';
import { planSideBySide, type SideBySidePlan } from './sideBySidePlan.js';

/** Exit code of an interrupted fit (128 + SIGINT, the shell convention). */
const EXIT_INTERRUPTED = 130;

/** What the caller asks of a side-by-side fit: the options of `candela fit` that concern it. */
export interface SideBySideRequest {
  configPath: string;
  /** Replaces output.dir. */
  outDir?: string;
  force?: boolean;
  resume?: boolean;
  /** The thread budget (replaces sampler.workers). */
  workers?: number;
  /** The models print nothing but errors. */
  quiet?: boolean;
  /** The words that start this candela: the node binary and the entry script. */
  launcher: readonly string[];
  /**
   * Aborted on the first stop signal, with the signal's name as reason: each
   * running model is sent that signal (it stops within a second and writes
   * its checkpoint and summaries), and no waiting model starts.
   */
  stop?: AbortSignal;
  /**
   * Aborted on a second stop signal: each running model is ended at once
   * (SIGKILL: a model that got both signals before it could act on the first
   * would not take the second as "leave"). Every file is written to a
   * temporary name and renamed, so nothing is corrupted: the last checkpoint
   * stays, and --resume clears the temporary files left behind.
   */
  leave?: AbortSignal;
  /** A line of the conductor (none when quiet), or of a model's process prefixed with "[label] " (with quiet, its errors only). */
  onLine?: (line: string) => void;
  /** What a model's process printed on standard output (its run report), when it ends. */
  onReport?: (label: string, text: string) => void;
}

/** How one model's fit ended. */
export interface SideBySideModel {
  label: string;
  runDir: string;
  /** finished (exit 0), interrupted (exit 130, or ended by the stop signal), not_started (a stop or a failure came first), failed. */
  state: 'finished' | 'interrupted' | 'not_started' | 'failed';
  exitCode: number | null;
  /** The signal that ended its process, if one did. */
  endSignal: string | null;
}

/** The result of a side-by-side fit. */
export interface SideBySideOutcome {
  plan: SideBySidePlan;
  /** In the configuration's order. */
  models: SideBySideModel[];
  /** 0 every model finished; 130 interrupted; 2 or 1 as the first failed model's bad input or internal error. */
  exitCode: number;
}

/**
 * The plan of a side-by-side fit for `request`, or null when the models are
 * to be fitted in turn: one model (or --model, --part), or a thread budget
 * below two (see planSideBySide).
 * @param request the fit's configuration path, thread budget, and the options that pick one model or part.
 * @returns the plan, or null.
 * @throws CandelaError when the configuration is invalid (the error a fit in turn would give).
 * @example sideBySidePlanFor({ configPath: 'configs/pantheon2018-binned.yaml', workers: 2 }) // { slots: 2, threadsPerSlot: [1, 1] }
 */
export function sideBySidePlanFor(request: { configPath: string; workers?: number; model?: string; part?: number }): SideBySidePlan | null {
  if (request.model !== undefined || request.part !== undefined) return null;
  const config = loadConfigFile(request.configPath);
  return planSideBySide(config.models.length, threadBudget(config, request.workers));
}

/** The worker threads a fit may use, as runFit counts them: --workers, else sampler.workers ('auto' = the available cores). */
function threadBudget(config: CandelaConfig, workers: number | undefined): number {
  if (workers !== undefined) return workers;
  return config.sampler.workers === 'auto' ? availableParallelism() : config.sampler.workers;
}

/**
 * Runs every check a fit in turn makes before it samples (configuration,
 * data, every model, the run folders, emptied with `force` or checked for a
 * checkpoint with `resume`) and stops there: runFit is given a signal
 * aborted from the start, which it honours before the first model (FitRequest.signal),
 * and one thread, so that no worker pool starts.
 * @throws CandelaError for bad input, as runFit would throw it.
 */
async function checkBeforeFitting(request: SideBySideRequest): Promise<void> {
  try {
    await runFit({ configPath: request.configPath, outDir: request.outDir, force: request.force, resume: request.resume, workers: 1, signal: AbortSignal.abort() });
  } catch (error) {
    if (isFitInterrupted(error) && error.outcomes.length === 0) return;
    throw error;
  }
  throw new Error('runFit sampled although its signal was aborted before it started');
}

/**
 * Fits the models of a configuration side by side: each model runs as
 * `candela fit CONFIG --model LABEL --workers k` in a process of its own
 * (the same run folder and chains as in a fit in turn, byte for byte, since
 * --model guarantees that and the chains do not depend on k), up to
 * `plan.slots` at once; a waiting model starts in the slot that frees.
 * Processes rather than worker threads: each model keeps a heap and a
 * garbage collector of its own, a crash ends one model only, and each
 * writes its files under its own process id.
 *
 * First, everything a fit in turn checks before it samples is checked here
 * (configuration, data, every model, the run folders, emptied with `force`),
 * so bad input stops the fit before any model starts. When every model has
 * ended, the multi-model pages (index.html, models.tex) are written once
 * from the run folders, unless the page the models' processes left is
 * already that (modelsPageIsCurrent: reading every folder back costs seconds).
 * @param request what to fit, the launcher, the stop signals and where lines go.
 * @param plan how many models run at once and their threads (sideBySidePlanFor).
 * @returns how each model ended and the exit code.
 * @throws CandelaError for bad input found before any model starts.
 * @example await fitSideBySide({ configPath: 'c.yaml', launcher: [process.execPath, 'dist/src/cli/main.js'] }, { slots: 2, threadsPerSlot: [1, 1] })
 */
export async function fitSideBySide(request: SideBySideRequest, plan: SideBySidePlan): Promise<SideBySideOutcome> {
  const config = loadConfigFile(request.configPath);
  await checkBeforeFitting(request);
  const say = request.onLine ?? (() => undefined);
  const models: SideBySideModel[] = config.models.map((model, index) => ({ label: model.label, runDir: runFolderFor(config, index, request.outDir), state: 'not_started', exitCode: null, endSignal: null }));
  const threads = plan.threadsPerSlot;
  const even = threads.every((count) => count === threads[0]);
  if (!request.quiet) say(`${models.length} models side by side, ${plan.slots} at a time with ${even ? threads[0] : threads.join(', ')} worker thread${threads[0] === 1 && even ? '' : 's'} each (--in-turn fits them one after another with every thread)`);
  const running = new Map<number, ModelProcess>();
  const windows: OutputsWindow[] = models.map(() => ({ finished: false, outputsFromMs: null, endedAtMs: 0 }));
  let failed = false;
  const stopping = () => Boolean(request.stop?.aborted);
  const reasonOf = (signal: AbortSignal): NodeJS.Signals => (signal.reason === 'SIGTERM' ? 'SIGTERM' : 'SIGINT');
  const passOn = (signal: () => NodeJS.Signals) => () => { for (const child of running.values()) child.send(signal()); };
  const stop = request.stop;
  stop?.addEventListener('abort', passOn(() => reasonOf(stop)), { once: true });
  request.leave?.addEventListener('abort', passOn(() => 'SIGKILL'), { once: true });
  const warned = new Set<string>();
  let next = 0;
  const runSlot = async (slot: number): Promise<void> => {
    while (next < models.length && !stopping() && !failed) {
      const index = next++;
      const model = models[index];
      const args = ['fit', request.configPath, '--model', model.label, '--workers', String(threads[slot]),
        ...(request.outDir !== undefined ? ['--out', request.outDir] : []), ...(request.resume ? ['--resume'] : []), ...(request.quiet ? ['--quiet'] : [])];
      const child = startModelProcess(request.launcher, args, (line) => {
        // A warning about the shared inputs comes from every model word for word; a fit in turn prints each warning once.
        if (/\bwarning\b/.test(line)) {
          if (warned.has(line)) return;
          warned.add(line);
        }
        say(`[${model.label}] ${line}`);
      });
      running.set(index, child);
      const end = await child.ended;
      running.delete(index);
      settle(model, end, stopping());
      const record = join(model.runDir, RUN_FILES.run);
      windows[index] = { finished: model.state === 'finished', outputsFromMs: existsSync(record) ? statSync(record).mtimeMs : null, endedAtMs: Date.now() };
      if (end.stdout !== '') request.onReport?.(model.label, end.stdout);
      if (model.state === 'failed') failed = true;
    }
  };
  await Promise.all(threads.map((_, slot) => runSlot(slot)));
  if (!modelsPageIsCurrent(windows)) writeFinalModelsIndex(models.map((model) => model.runDir), request.outDir ?? config.output.dir.resolved);
  return { plan, models, exitCode: exitCodeOf(models) };
}

/** Records how a model's process ended; `stopAsked` tells a stop signal's end from a crash. */
function settle(model: SideBySideModel, end: ModelProcessEnd, stopAsked: boolean): void {
  model.exitCode = end.code;
  model.endSignal = end.signal;
  if (end.code === 0) model.state = 'finished';
  // After a stop signal, a process ended by a signal is one the stop reached before its handler was installed, or one a second signal ended (SIGKILL).
  else if (end.code === EXIT_INTERRUPTED || (stopAsked && end.signal !== null)) model.state = 'interrupted';
  else model.state = 'failed';
}

/** The fit's exit code: a failure's (2 bad input, else 1), then 130 when a model did not finish, else 0. */
function exitCodeOf(models: readonly SideBySideModel[]): number {
  const failures = models.filter((model) => model.state === 'failed');
  if (failures.length > 0) return failures.every((model) => model.exitCode === EXIT_BAD_INPUT) ? EXIT_BAD_INPUT : EXIT_INTERNAL;
  return models.every((model) => model.state === 'finished') ? 0 : EXIT_INTERRUPTED;
}
