import { CandelaError, type Issue } from '../../errors.js';

/**
 * What a cluster plan asks the scheduler for, and how long each part samples.
 * Every field is optional in the request; {@link resolveClusterResources}
 * fills the defaults from the configuration.
 */
export interface ClusterResourceRequest {
  /** Account the jobs are charged to (`#SBATCH --account`); none: the user's default account. */
  account?: string;
  /** Partition (queue) the jobs run in (`#SBATCH --partition`); none: the cluster's default partition. */
  queue?: string;
  /** Memory per job, a whole number with an optional K, M, G or T suffix (megabytes without one; `#SBATCH --mem`); none: the partition's default. */
  memory?: string;
  /** Wall-time limit of each part, minutes (`#SBATCH --time`); default: sampler.max_minutes x 1.1 + 10. */
  partMinutes?: number;
  /** Seconds before the part's time limit at which Slurm sends SIGTERM to the part (`#SBATCH --signal=B:TERM@<seconds>`); default 600. */
  stopWarningSeconds?: number;
  /** Steps every part runs to (passed to `fit --part I --steps-per-part`); default: sampler.max_steps. */
  stepsPerPart?: number;
}

/** The request with every default filled in. */
export interface ClusterResources {
  account: string | null;
  queue: string | null;
  memory: string | null;
  partMinutes: number;
  stopWarningSeconds: number;
  stepsPerPart: number;
}

/** Extra wall time granted to a part beyond sampler.max_minutes, as a fraction of it: data loading and the walker search before sampling. */
export const PART_TIME_MARGIN_FRACTION = 0.1;
/** Extra minutes granted to a part beyond sampler.max_minutes: the final diagnostics, figures and report page. */
export const PART_TIME_MARGIN_MINUTES = 10;

/**
 * Time limit of one part: max_minutes plus the margins of PART_TIME_MARGIN_FRACTION and PART_TIME_MARGIN_MINUTES, minutes.
 * @param maxMinutes sampler.max_minutes.
 * @returns minutes, rounded up.
 * @throws nothing.
 * @example partTimeMinutes(60) // 76
 */
export function partTimeMinutes(maxMinutes: number): number {
  return Math.ceil(maxMinutes * (1 + PART_TIME_MARGIN_FRACTION) + PART_TIME_MARGIN_MINUTES);
}

/** Default seconds of warning before a part's time limit: enough to write the checkpoint, chains and figures of a large run (common practice: minutes, not seconds). */
export const DEFAULT_STOP_WARNING_SECONDS = 600;
/** Largest warning Slurm accepts in --signal (the time is stored in 16 bits; Slurm sbatch manual, from memory). */
export const LARGEST_STOP_WARNING_SECONDS = 65535;
/** Fewest steps a part may be asked for: the fewest a merged run can summarize. */
export const FEWEST_STEPS_PER_PART = 80;

/** Slurm account and partition names: letters, digits and `_ . -` (no spaces, no shell characters). */
const NAME_PATTERN = /^[A-Za-z0-9_.-]+$/;
/** A --mem value: a whole number with an optional unit suffix (Slurm sbatch manual, --mem). */
const MEMORY_PATTERN = /^[1-9][0-9]*[KMGT]?$/;

/**
 * Checks the cluster request and fills its defaults from the configuration's
 * sampler settings. Every problem is reported at once.
 * Cost: O(1).
 * @param request the options given (command line, later configuration).
 * @param sampler sampler.max_minutes (minutes) and sampler.max_steps.
 * @returns the resources the scripts are written with.
 * @throws CandelaError `plan.bad_name` (account or queue), `plan.bad_memory`, `plan.bad_minutes`,
 *   `plan.bad_warning` (not a whole number of seconds from 1 to 65535, or not shorter than the time limit),
 *   `plan.bad_steps` (not a whole number >= 80).
 * @example resolveClusterResources({ memory: '4G' }, { maxMinutes: 60, maxSteps: 5000 }).partMinutes // 76
 */
export function resolveClusterResources(request: ClusterResourceRequest, sampler: { maxMinutes: number; maxSteps: number }): ClusterResources {
  const issues: Issue[] = [];
  for (const [option, value] of [['--cluster-account', request.account], ['--cluster-queue', request.queue]] as const) {
    if (value !== undefined && !NAME_PATTERN.test(value)) issues.push({ code: 'plan.bad_name', path: option, message: 'a Slurm account or partition name holds only letters, digits, "_", "." and "-"', found: value, fix: 'give the name as `sacctmgr show assoc user=$USER` or `sinfo` lists it' });
  }
  if (request.memory !== undefined && !MEMORY_PATTERN.test(request.memory)) {
    issues.push({ code: 'plan.bad_memory', path: '--part-memory', message: 'memory is a whole number with an optional unit K, M, G or T (megabytes without one)', found: request.memory, expected: 'e.g. 4000, 4G or 512M' });
  }
  const partMinutes = request.partMinutes ?? partTimeMinutes(sampler.maxMinutes);
  if (!Number.isInteger(partMinutes) || partMinutes < 1) {
    issues.push({ code: 'plan.bad_minutes', path: '--part-minutes', message: 'the time limit of a part is a whole number of minutes >= 1', found: String(request.partMinutes) });
  }
  const stopWarningSeconds = request.stopWarningSeconds ?? DEFAULT_STOP_WARNING_SECONDS;
  if (!Number.isInteger(stopWarningSeconds) || stopWarningSeconds < 1 || stopWarningSeconds > LARGEST_STOP_WARNING_SECONDS) {
    issues.push({ code: 'plan.bad_warning', path: '--stop-warning', message: 'the warning before the time limit is a whole number of seconds', expected: `1 to ${LARGEST_STOP_WARNING_SECONDS}`, found: String(request.stopWarningSeconds) });
  } else if (Number.isInteger(partMinutes) && partMinutes >= 1 && stopWarningSeconds >= partMinutes * 60) {
    issues.push({ code: 'plan.bad_warning', path: '--stop-warning', message: `the warning (${stopWarningSeconds} s) must come before the part's time limit (${partMinutes} min = ${partMinutes * 60} s), or every part is stopped as it starts`, fix: 'give a shorter --stop-warning or a longer --part-minutes' });
  }
  const stepsPerPart = request.stepsPerPart ?? sampler.maxSteps;
  if (!Number.isInteger(stepsPerPart) || stepsPerPart < FEWEST_STEPS_PER_PART) {
    issues.push({ code: 'plan.bad_steps', path: '--steps-per-part', message: 'every part runs a whole number of steps, enough for the merged run\'s diagnostics', expected: `>= ${FEWEST_STEPS_PER_PART}`, found: String(stepsPerPart) });
  }
  if (issues.length > 0) throw new CandelaError(issues);
  return { account: request.account ?? null, queue: request.queue ?? null, memory: request.memory ?? null, partMinutes, stopWarningSeconds, stepsPerPart };
}
