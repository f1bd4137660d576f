import { RUN_FILES } from '../run/runFolder.js';

/*
 * Text of the two scripts of a cluster plan: the Slurm batch script of the
 * job array (one task per part) and the merge script. Slurm reads its
 * options from `#SBATCH` comment lines before the first command (Slurm
 * sbatch manual, "batch script"); the array task id arrives in the
 * environment variable SLURM_ARRAY_TASK_ID and the granted CPUs in
 * SLURM_CPUS_PER_TASK (same manual, "output environment variables");
 * arguments after the script name on the sbatch line reach the script as
 * $1, $2, ... (same manual, synopsis).
 *
 * Stopping before the time limit: `--signal=B:TERM@S` asks Slurm to send
 * SIGTERM to the batch shell S seconds before the limit (same manual,
 * --signal; "B:" signals the batch shell only). The part's command is run
 * with `exec`, so the batch shell *is* candela and receives the signal:
 * candela finishes the step in progress, writes its checkpoint and exits
 * 130. Submitting the same script again continues every part from its
 * checkpoint (the script passes --resume when one exists).
 */

/** Time limit of the merge job, minutes (it reads the parts, rediagnoses and redraws; no sampling). */
export const MERGE_TIME_MINUTES = 60;

/** What both scripts need to know. */
export interface SlurmScriptInput {
  /** Job name (letters, digits, '-', '_', '.'). */
  jobName: string;
  /** Number of parts (array tasks 0 .. count - 1). */
  partCount: number;
  /** CPUs per array task, also the worker threads of a part when Slurm does not say. */
  cpusPerTask: number;
  /** Time limit of each part, minutes. */
  partMinutes: number;
  /** Seconds before the time limit at which Slurm sends SIGTERM to a part. */
  stopWarningSeconds: number;
  /** Steps every part runs to unless the submit line gives another count as the script's first argument. */
  stepsPerPart: number;
  /** Account, partition and memory per job; null: not written (the cluster's default applies). */
  account: string | null;
  queue: string | null;
  memory: string | null;
  /** Absolute folder the scripts `cd` into before running candela. */
  workingDir: string;
  /** The command that starts candela, one word per entry (e.g. node and the entry script, or npx candela). */
  launcher: readonly string[];
  /** Absolute path of the configuration file. */
  configPath: string;
  /** Absolute output folder of the run. */
  outDir: string;
  /** Absolute folder of the log files. */
  logsDir: string;
  /** Absolute path of the batch script itself (named in its comments). */
  sbatchPath: string;
  /** Absolute path of the merge script. */
  mergePath: string;
  /** One entry per part, in index order: index, model label, ensemble, absolute part folder. */
  parts: Array<{ index: number; label: string; ensemble: number; runDir: string }>;
  /** One merge per model: its part folders and the merged folder, absolute. */
  merges: Array<{ label: string; partDirs: string[]; runDir: string }>;
}

/**
 * Quotes one word for a POSIX shell: unchanged when it holds only safe
 * characters, else in single quotes (a single quote written as '\'').
 * Cost: O(length).
 * @param word any text.
 * @returns the quoted word.
 * @throws nothing.
 * @example shellQuote("my run") // "'my run'"
 */
export function shellQuote(word: string): string {
  return /^[A-Za-z0-9_./:=@%+-]+$/.test(word) ? word : `'${word.replace(/'/g, `'\\''`)}'`;
}

/**
 * A Slurm time limit for `minutes` (rounded up to whole minutes), as
 * HH:MM:SS or, from one day on, D-HH:MM:SS (formats accepted by --time,
 * Slurm sbatch manual).
 * Cost: O(1).
 * @param minutes the limit, minutes (> 0).
 * @returns the --time value.
 * @throws nothing.
 * @example slurmTimeLimit(90) // '01:30:00'
 */
export function slurmTimeLimit(minutes: number): string {
  const total = Math.max(1, Math.ceil(minutes));
  const days = Math.floor(total / 1440);
  const hours = Math.floor((total % 1440) / 60);
  const clock = `${String(hours).padStart(2, '0')}:${String(total % 60).padStart(2, '0')}:00`;
  return days > 0 ? `${days}-${clock}` : clock;
}

const quoteAll = (words: readonly string[]) => words.map(shellQuote).join(' ');

/** The `#SBATCH` lines both jobs share: account, partition and memory, each only when given. */
function siteLines(input: SlurmScriptInput): string[] {
  return [
    ...(input.account === null ? [] : [`#SBATCH --account=${input.account}`]),
    ...(input.queue === null ? [] : [`#SBATCH --partition=${input.queue}`]),
    ...(input.memory === null ? [] : [`#SBATCH --mem=${input.memory}`]),
  ];
}

/**
 * The job-array batch script: task I runs
 * `exec <launcher> fit CONFIG --out DIR --part I --steps-per-part N [--resume]`,
 * with N the script's first argument or the plan's step count, and --resume
 * when the part's folder already holds a checkpoint.
 * Cost: O(parts).
 * @param input the plan.
 * @returns the script text (bash).
 * @throws nothing.
 * @example slurmBatchScript(input).includes('#SBATCH --array=0-7') // for 8 parts
 */
export function slurmBatchScript(input: SlurmScriptInput): string {
  const command = ['exec', quoteAll(input.launcher), 'fit', shellQuote(input.configPath), '--out', shellQuote(input.outDir),
    '--part', '"$SLURM_ARRAY_TASK_ID"', '--workers', `"\${SLURM_CPUS_PER_TASK:-${input.cpusPerTask}}"`, '--steps-per-part', '"$steps"', '$resume'].join(' ');
  return [
    '#!/bin/bash',
    `#SBATCH --job-name=${input.jobName}`,
    `#SBATCH --array=0-${input.partCount - 1}`,
    '#SBATCH --ntasks=1',
    `#SBATCH --cpus-per-task=${input.cpusPerTask}`,
    `#SBATCH --time=${slurmTimeLimit(input.partMinutes)}`,
    `#SBATCH --signal=B:TERM@${input.stopWarningSeconds}`,
    ...siteLines(input),
    `#SBATCH --output=${input.logsDir}/part-%A_%a.log`,
    '#',
    '# Written by `candela fit CONFIG --plan slurm`. One array task per part:',
    '# part I = model index x ensembles + ensemble, sampled into',
    '# <out>/parts/<model>/ensemble-<k>/. Parts of this configuration:',
    ...input.parts.map((part) => `#   ${part.index}: model ${part.label}, ensemble ${part.ensemble}`),
    '#',
    `# Every part runs to the same step count (${input.stepsPerPart}, or the first argument after`,
    '# the script name), so that the merged run equals one fit of that length.',
    `# Submit:     sbatch ${shellQuote(input.sbatchPath)}`,
    `# Then merge: sbatch --dependency=afterok:<jobid> ${shellQuote(input.mergePath)}`,
    `# ${input.stopWarningSeconds} s before the time limit Slurm sends SIGTERM; the part writes its`,
    '# checkpoint and exits 130. Submitting this script again continues every part',
    '# from its checkpoint (--array=I,J for some parts only); more steps after a',
    `# merge that did not converge: sbatch ${shellQuote(input.sbatchPath)} <steps>`,
    'set -euo pipefail',
    `cd ${shellQuote(input.workingDir)}`,
    `steps="\${1:-${input.stepsPerPart}}"`,
    `folders=(${input.parts.map((part) => shellQuote(part.runDir)).join(' ')})`,
    'resume=\'\'',
    `if [ -e "\${folders[$SLURM_ARRAY_TASK_ID]}/${RUN_FILES.checkpoint}" ]; then resume=--resume; fi`,
    command,
    '',
  ].join('\n');
}

/**
 * The merge script: one `candela merge --force` per model, each into
 * `<out>/<model>` (a merged folder holds nothing the parts do not, so it is
 * replaced when the parts ran longer). Runs as a Slurm job after the array
 * (`sbatch --dependency=afterok:<jobid>`) or directly with bash. It runs every
 * merge and exits with the last non-zero code: 3 when a merged run misses
 * the convergence targets, 2 on bad parts.
 * Cost: O(parts).
 * @param input the plan.
 * @returns the script text (bash).
 * @throws nothing.
 * @example slurmMergeScript(input).split('\n').filter((line) => line.includes(' merge ')).length // models
 */
export function slurmMergeScript(input: SlurmScriptInput): string {
  return [
    '#!/bin/bash',
    `#SBATCH --job-name=${input.jobName}-merge`,
    '#SBATCH --ntasks=1',
    '#SBATCH --cpus-per-task=1',
    `#SBATCH --time=${slurmTimeLimit(MERGE_TIME_MINUTES)}`,
    ...siteLines(input),
    `#SBATCH --output=${input.logsDir}/merge-%j.log`,
    '#',
    '# Combines the parts of each model into one run folder once every array task',
    '# has finished. Submit it so that it waits for the array job:',
    `#   sbatch --dependency=afterok:<jobid> ${shellQuote(input.mergePath)}`,
    '# or run it with bash when the array is done. Exit code 3: a merged run does',
    '# not meet target_ess and max_rhat; its log says how many steps to add.',
    'set -uo pipefail',
    `cd ${shellQuote(input.workingDir)} || exit 2`,
    'status=0',
    ...input.merges.map((merge) => `${[quoteAll(input.launcher), 'merge', ...merge.partDirs.map(shellQuote), '--out', shellQuote(merge.runDir), '--force'].join(' ')} || status=$?`),
    'exit "$status"',
    '',
  ].join('\n');
}
