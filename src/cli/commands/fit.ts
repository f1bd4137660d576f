import { fileURLToPath } from 'node:url';
import type { Command } from 'commander';
import cliProgress from 'cli-progress';
import { CandelaError, formatIssue } from '../../errors.js';
import { closestWord } from '../../config/index.js';
import {
  fitSideBySide, isFitInterrupted, planSlurmArray, runFit, sideBySidePlanFor, terminalRunReport, type FitOutcome, type FitProgress, type SideBySidePlan,
} from '../../pipeline/index.js';

/** Seconds between status lines when the output is not a terminal. */
const STATUS_INTERVAL_SECONDS = 5;
/** Exit code of a fit that was interrupted (128 + SIGINT, the shell convention). */
const EXIT_INTERRUPTED = 130;
/** The signals that ask a fit to stop: Ctrl-C, and what a scheduler or `kill` sends before the wall-time limit. */
const STOP_SIGNALS = ['SIGINT', 'SIGTERM'] as const;

function formatNumber(value: number | null | undefined, digits: number): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '-' : value.toFixed(digits);
}

function etaSeconds(progress: FitProgress): number | null {
  const check = progress.check;
  if (!check || check.minEssBulk === null || check.minEssBulk <= 0 || progress.step === 0) return null;
  // ESS grows about linearly with the steps kept after the burn-in; R-hat - 1 of converging chains
  // shrinks about as 1 / (kept steps) (Gelman & Rubin 1992: B/W falls as 1/n), so each target gives
  // the kept steps it needs, and the larger of the two decides.
  const kept = Math.max(1, progress.step - check.burnInSteps);
  const forEss = (progress.targetEss / check.minEssBulk) * kept;
  const forRhat = check.maxRhat !== null && check.maxRhat > progress.maxRhat ? ((check.maxRhat - 1) / (progress.maxRhat - 1)) * kept : 0;
  // The chain must also reach 50 autocorrelation times (the stopping rule's third condition), counted from step 0.
  const forTau = check.maxTau !== null ? 50 * check.maxTau - check.burnInSteps : 0;
  const needed = Math.max(forEss, forRhat, forTau) + check.burnInSteps;
  const rate = progress.elapsedSeconds / progress.step;
  const left = Math.max(0, Math.min(needed, progress.maxSteps) - progress.step) * rate;
  // Not converged yet but both extrapolations already met: the next check decides; say so rather than "0 s".
  return left === 0 && !check.converged ? null : left;
}

function statusLine(progress: FitProgress): string {
  const c = progress.check;
  const eta = etaSeconds(progress);
  return `${progress.model}: step ${progress.step}/${progress.maxSteps}  accept ${formatNumber(progress.acceptance, 2)}  tau ${formatNumber(c?.maxTau, 1)}  ESS ${formatNumber(c?.minEssBulk, 0)}/${progress.targetEss}  R-hat ${formatNumber(c?.maxRhat, 3)}  left ${eta === null ? '?' : `${Math.round(eta)} s`}`;
}

/**
 * The words that start this very candela on a cluster node: this node binary
 * and the entry script of this build (dist/src/cli/main.js once built),
 * absolute, whichever way the current process was started.
 */
function currentLauncher(): string[] {
  return [process.execPath, fileURLToPath(new URL('../main.js', import.meta.url))];
}

/**
 * The words that start the models' processes of a side-by-side fit: those of
 * currentLauncher, except that from the TypeScript sources (tests calling
 * the command in process) the built entry script is started, as worker
 * threads start the built model (workerModelUrl).
 */
function modelLauncher(): string[] {
  const [node, script] = currentLauncher();
  return [node, import.meta.url.endsWith('.ts') ? script.replace(/src\/cli\/main\.js$/, 'dist/src/cli/main.js') : script];
}

/** A parser for an option that takes a whole number (>= 0). */
function wholeNumber(option: string): (text: string) => number {
  return (text) => {
    if (!/^\d+$/.test(text.trim())) throw new CandelaError({ code: 'fit.bad_number', path: option, message: `${option} takes a whole number`, found: text });
    return Number(text);
  };
}

/** The options of a cluster plan (`--plan slurm`), by their command-line names. */
const PLAN_OPTIONS = ['clusterAccount', 'clusterQueue', 'partMemory', 'partMinutes', 'stopWarning', 'nodeBinary'] as const;
const optionName = (key: string) => `--${key.replace(/[A-Z]/g, (letter) => `-${letter.toLowerCase()}`)}`;

function parsePart(text: string): number {
  if (!/^\d+$/.test(text.trim())) throw new CandelaError({ code: 'fit.bad_part', path: '--part', message: 'the part index must be a whole number >= 0', found: text, fix: 'use a task id of the array written by --plan slurm' });
  return Number(text);
}

/**
 * The models of a configuration fitted side by side (fitSideBySide), each in
 * a process of its own. First stop signal: every model is told to stop and
 * write its checkpoint, chains and summaries; a second one ends the models
 * at once (see SideBySideRequest.leave) and this process by the system's
 * default action, as in a fit in turn.
 */
async function fitModelsSideBySide(configPath: string, options: { out?: string; force?: boolean; resume?: boolean; workers?: number; quiet?: boolean }, plan: SideBySidePlan): Promise<void> {
  const quiet = Boolean(options.quiet);
  const stop = new AbortController();
  const leave = new AbortController();
  const onSignal = (signal: NodeJS.Signals) => {
    if (!stop.signal.aborted) {
      stop.abort(signal);
      if (!quiet) process.stderr.write(`\n${signal}: stopping every model; each writes its checkpoint, chains and summaries so far (send it again to leave at once)\n`);
      return;
    }
    for (const name of STOP_SIGNALS) process.off(name, onSignal);
    leave.abort(signal);
    process.kill(process.pid, signal);
  };
  for (const name of STOP_SIGNALS) process.on(name, onSignal);
  try {
    const outcome = await fitSideBySide({
      configPath, outDir: options.out, force: options.force, resume: options.resume, workers: options.workers, quiet, launcher: modelLauncher(),
      stop: stop.signal, leave: leave.signal, onLine: (line) => process.stderr.write(`${line}\n`), onReport: (_label, text) => process.stdout.write(text),
    }, plan);
    const named = (state: string) => outcome.models.filter((model) => model.state === state).map((model) => model.label);
    const [failed, interrupted, waiting] = [named('failed'), named('interrupted'), named('not_started')];
    if (failed.length > 0) {
      process.stderr.write(`failed: ${failed.join(', ')} (the lines above say why)${waiting.length ? `; not started: ${waiting.join(', ')}` : ''}\n`);
    } else if (outcome.exitCode === EXIT_INTERRUPTED) {
      process.stderr.write(`interrupted: ${interrupted.length ? `${interrupted.join(', ')} wrote their checkpoints and the chains so far` : 'no model had started'}${waiting.length ? `; not started: ${waiting.join(', ')}` : ''}; continue with the same command and --resume\n`);
    } else if (stop.signal.aborted && !quiet) {
      process.stderr.write('the signal came after the sampling had finished: the run is complete\n');
    }
    process.exitCode = outcome.exitCode;
  } finally {
    for (const name of STOP_SIGNALS) process.off(name, onSignal);
  }
}

/**
 * `candela fit CONFIG`: samples the posterior of every model in the
 * configuration, proves convergence, writes the run folders.
 */
export function registerFitCommand(program: Command): void {
  program
    .command('fit')
    .description('sample the posterior of every model in a configuration and write the run folders')
    .argument('<config>', 'YAML configuration file')
    .option('--out <dir>', 'output folder (replaces output.dir)')
    .option('--force', 'replace an existing output folder')
    .option('--resume', 'continue an interrupted run from its last checkpoint')
    .option('--workers <n>', 'worker threads (replaces sampler.workers)', (text) => Number.parseInt(text, 10))
    .option('--quiet', 'print nothing but errors')
    .option('--model <label>', 'fit only the model with this label (its folder and chains are those of a full run)')
    .option('--in-turn', 'fit the models one after another, each with every worker thread (default: with two threads or more, several models at once, each with its share)')
    .option('--part <index>', 'run only part I = model index x ensembles + ensemble, into <out>/parts/<model>/ensemble-<k>', parsePart)
    .option('--plan <scheduler>', 'write a job-array plan for a cluster scheduler instead of sampling (slurm)')
    .option('--steps-per-part <n>', 'with --plan or --part: the step count every part runs to (default sampler.max_steps; a part never stops early on its own diagnostics)', wholeNumber('--steps-per-part'))
    .option('--cluster-account <name>', 'with --plan: the Slurm account the jobs are charged to (default: your default account)')
    .option('--cluster-queue <partition>', 'with --plan: the Slurm partition the jobs run in (default: the cluster\'s default)')
    .option('--part-memory <size>', 'with --plan: memory per job, e.g. 4G or 4000 (megabytes); default: the partition\'s')
    .option('--part-minutes <n>', 'with --plan: time limit of each part in minutes (default sampler.max_minutes x 1.1 + 10)', wholeNumber('--part-minutes'))
    .option('--stop-warning <seconds>', 'with --plan: Slurm sends SIGTERM this long before the time limit; the part writes its checkpoint and stops (default 600)', wholeNumber('--stop-warning'))
    .option('--node-binary <path>', 'with --plan: the node the cluster starts candela with (default: the node running this command)')
    .addHelpText('after', '\nExamples:\n  candela fit configs/demo.yaml --out out/demo\n  candela fit configs/demo.yaml --out out/demo --resume\n  candela fit configs/demo.yaml --out out/demo --plan slurm --steps-per-part 8000 --cluster-queue short --part-memory 4G\n  candela fit configs/demo.yaml --out out/demo --part 3\n\nWith two worker threads or more (--workers, sampler.workers), the models of a configuration are fitted several at once, each with its share of the threads and the same chains; --in-turn fits them one after another.\nCtrl-C writes a checkpoint, the chains and the summaries so far (candela report draws the figures); --resume continues the run.\n')
    .action(async (configPath: string, options: { out?: string; force?: boolean; resume?: boolean; workers?: number; quiet?: boolean; part?: number; plan?: string; model?: string; inTurn?: boolean;
      stepsPerPart?: number; clusterAccount?: string; clusterQueue?: string; partMemory?: string; partMinutes?: number; stopWarning?: number; nodeBinary?: string }) => {
      if (options.plan !== undefined) {
        if (options.plan !== 'slurm') throw new CandelaError({ code: 'fit.unknown_plan', path: '--plan', message: 'this scheduler is not supported', expected: 'slurm', found: options.plan, fix: closestWord(options.plan, ['slurm']) ? 'did you mean "slurm"?' : 'write --plan slurm (the only scheduler candela plans for)' });
        if (options.part !== undefined) throw new CandelaError({ code: 'fit.plan_with_part', path: '--part', message: '--plan writes the scripts of every part; it takes no --part', fix: 'drop --part' });
        const launcher = currentLauncher();
        if (options.nodeBinary !== undefined) launcher[0] = options.nodeBinary;
        const plan = planSlurmArray({
          configPath, outDir: options.out, force: options.force, launcher, workingDir: process.cwd(),
          account: options.clusterAccount, queue: options.clusterQueue, memory: options.partMemory, partMinutes: options.partMinutes,
          stopWarningSeconds: options.stopWarning, stepsPerPart: options.stepsPerPart,
        });
        const { resources } = plan;
        const asked = [`time limit ${resources.partMinutes} min`, `SIGTERM ${resources.stopWarningSeconds} s before it`, ...(resources.account ? [`account ${resources.account}`] : []), ...(resources.queue ? [`partition ${resources.queue}`] : []), ...(resources.memory ? [`memory ${resources.memory}`] : [])];
        process.stdout.write(`wrote ${plan.batchPath} (${plan.parts} array tasks, ${resources.stepsPerPart} steps each; ${asked.join(', ')}) and ${plan.mergePath}\nsubmit with:\n  ${plan.submitCommand}\nthen merge when every task has succeeded:\n  sbatch --dependency=afterok:<jobid> ${plan.mergePath}\nthe merge exits 3 and says how many steps to add when the merged run misses target_ess or max_rhat\n`);
        return;
      }
      const planOnly = PLAN_OPTIONS.filter((key) => options[key] !== undefined);
      if (planOnly.length > 0) throw new CandelaError({ code: 'fit.option_needs_plan', path: optionName(planOnly[0]), message: `${planOnly.map(optionName).join(', ')} describe${planOnly.length === 1 ? 's' : ''} the jobs of a cluster plan`, fix: 'add --plan slurm, or drop the option' });
      if (options.stepsPerPart !== undefined && options.part === undefined) throw new CandelaError({ code: 'fit.option_needs_part', path: '--steps-per-part', message: '--steps-per-part sets the length of a part; a whole fit stops on sampler.max_steps and its targets', fix: 'add --part I, or set sampler.max_steps' });
      const sideBySide = options.inTurn ? null : sideBySidePlanFor({ configPath, workers: options.workers, model: options.model, part: options.part });
      if (sideBySide) return fitModelsSideBySide(configPath, options, sideBySide);
      const controller = new AbortController();
      // First signal: stop sampling, write the checkpoint, the chains and the summaries so far. Then the handlers are removed, so a
      // second signal ends the process at once by the system's default action, even in the middle of writing the
      // outputs (no JavaScript runs until they are written). Every file is written to a temporary name and renamed,
      // so that corrupts nothing: the last checkpoint stays, and --resume clears the temporary files left behind.
      const stop = (signal: NodeJS.Signals) => {
        for (const name of STOP_SIGNALS) process.off(name, stop);
        controller.abort();
        if (!options.quiet) process.stderr.write(`\n${signal}: stopping; writing a checkpoint, the chains and the summaries so far (send it again to leave at once)\n`);
      };
      for (const name of STOP_SIGNALS) process.on(name, stop);
      const quiet = Boolean(options.quiet);
      const interactive = Boolean(process.stderr.isTTY) && !quiet;
      const bar = interactive ? new cliProgress.SingleBar({ format: '{bar} {status}', barsize: 20, hideCursor: true, stream: process.stderr }, cliProgress.Presets.shades_classic) : null;
      let barStarted = false;
      let lastStatus = 0;
      const interruptedMessage = (outcomes: FitOutcome[]) => {
        const short = outcomes.filter((outcome) => outcome.summarized === false).map((outcome) => outcome.model);
        return `interrupted: the checkpoint and ${short.length ? 'the chains so far' : 'the chains and summaries so far'} are written (figures and report.html: candela report <run folder>); continue with --resume${short.length ? ` (too few steps for summaries yet: ${short.join(', ')})` : ''}\n`;
      };
      const printOutcomes = (outcomes: FitOutcome[]) => {
        if (quiet) return;
        for (const outcome of outcomes) {
          // An interrupted run says where its outputs are instead of reading them back: a signal asks to stop soon.
          // The run report lists every warning of the run (data, likelihood, diagnostics); an interrupted run, which has no report, prints them here.
          if (outcome.record.run.stop_reason === 'interrupted') {
            process.stdout.write(`== ${outcome.model}: interrupted after ${outcome.record.run.steps} steps; chains and summaries so far in ${outcome.runDir}\n`);
            for (const warning of outcome.warnings) process.stderr.write(`${formatIssue(warning)}\n`);
          } else {
            process.stdout.write(`${outcome.terminalReport ?? terminalRunReport(outcome.runDir)}\n`);
          }
        }
      };
      try {
        const outcomes = await runFit({
          configPath, outDir: options.out, force: options.force, resume: options.resume, workers: options.workers, part: options.part, partSteps: options.stepsPerPart, model: options.model, signal: controller.signal,
          onLine: (line) => {
            if (quiet) return;
            if (bar && barStarted) { bar.stop(); barStarted = false; }
            process.stderr.write(`${line}\n`);
          },
          onProgress: (progress) => {
            if (quiet) return;
            if (bar) {
              if (!barStarted) { bar.start(progress.maxSteps, 0, { status: '' }); barStarted = true; }
              bar.update(progress.step, { status: statusLine(progress) });
            } else if (progress.elapsedSeconds - lastStatus >= STATUS_INTERVAL_SECONDS) {
              lastStatus = progress.elapsedSeconds;
              process.stderr.write(`${statusLine(progress)}\n`);
            }
          },
        });
        if (bar && barStarted) { bar.stop(); barStarted = false; }
        printOutcomes(outcomes);
        // Exit 130 only when a model really stopped early; a signal that came after the sampling finished changes nothing.
        if (outcomes.some((outcome) => outcome.record.run.stop_reason === 'interrupted')) {
          process.stderr.write(interruptedMessage(outcomes));
          process.exitCode = EXIT_INTERRUPTED;
        } else if (controller.signal.aborted && !quiet) {
          process.stderr.write('the signal came after the sampling had finished: the run is complete\n');
        }
      } catch (error) {
        if (!isFitInterrupted(error)) throw error;
        if (bar && barStarted) { bar.stop(); barStarted = false; }
        printOutcomes(error.outcomes);
        process.stderr.write(`${error.message}\n`);
        process.exitCode = EXIT_INTERRUPTED;
      } finally {
        if (bar && barStarted) bar.stop();
        for (const name of STOP_SIGNALS) process.off(name, stop);
      }
    });
}
