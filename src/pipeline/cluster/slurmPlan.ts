import { chmodSync, existsSync, mkdirSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { loadConfigFile } from '../../config/index.js';
import { CandelaError } from '../../errors.js';
import { writeFileAtomic } from '../../output/index.js';
import { loadSupernovae } from '../run/loadSupernovae.js';
import { locatePart, partCount } from './slurmPart.js';
import { resolveClusterResources, type ClusterResourceRequest, type ClusterResources } from './slurmResources.js';
import { shellQuote, slurmBatchScript, slurmMergeScript, type SlurmScriptInput } from '../../output/index.js';

/** CPUs per array task when sampler.workers is `auto` (a part is small; two threads keep one ensemble's half-steps busy; common practice). */
export const DEFAULT_CPUS_PER_PART = 2;
/** Folder under the output folder holding the scripts and their logs. */
export const SLURM_FOLDER = 'slurm';
/** File names of a plan. */
export const SLURM_FILES = { batch: 'candela-parts.sbatch', merge: 'merge.sh', logs: 'logs' } as const;

/** What `candela fit CONFIG --plan slurm` is asked (the scheduler resources are documented on ClusterResourceRequest). */
export interface SlurmPlanRequest extends ClusterResourceRequest {
  configPath: string;
  /** Replaces output.dir (relative paths are taken from `workingDir`). */
  outDir?: string;
  /** Replace existing scripts. */
  force?: boolean;
  /** The words that start candela on the cluster, e.g. a node binary and candela's entry script (default `npx candela`, run from `workingDir`). */
  launcher?: readonly string[];
  /** Folder the scripts run from (default: the current folder). */
  workingDir?: string;
}

/** The written plan. */
export interface SlurmPlan {
  batchPath: string;
  mergePath: string;
  logsDir: string;
  /** Number of array tasks (models x ensembles). */
  parts: number;
  /** The command that submits the array. */
  submitCommand: string;
  /** The merged run folder of each model. */
  mergedDirs: string[];
  /** What the scripts ask Slurm for, and the steps of every part. */
  resources: ClusterResources;
}

function jobNameOf(configPath: string): string {
  const stem = basename(configPath, extname(configPath)).replace(/[^A-Za-z0-9_.-]+/g, '-');
  return `candela-${stem || 'run'}`;
}

/**
 * Writes a Slurm job-array plan for a configuration, without sampling:
 * `<out>/slurm/candela-parts.sbatch` (array task I runs part I, see
 * locatePart), `<out>/slurm/merge.sh` (one `candela merge` per model into
 * `<out>/<model label>`), and the empty log folder Slurm writes into (Slurm
 * does not create it). The configuration and its data are checked first, so
 * a broken input fails here rather than on every node. Paths in the scripts
 * are absolute; the scripts `cd` into `workingDir` first, so a relative
 * launcher such as `npx candela` resolves in the project folder. Every part
 * runs to the same step count (`stepsPerPart`, default sampler.max_steps) and
 * never stops on its own ensemble's diagnostics: parts stopped at different
 * lengths would be cut to the shortest, and one ensemble's R-hat and ESS do
 * not bound the merged run's; `candela merge` checks the targets instead.
 *
 * Cost: reading and checking the data once.
 * @param request configuration, output folder, launcher, scheduler resources.
 * @returns the paths written and the submit command.
 * @throws CandelaError: configuration and data problems; `plan.exists` when the
 *   scripts exist and `force` is not set; `fit.part_needs_ensembles` for nested sampling;
 *   those of resolveClusterResources.
 * @example planSlurmArray({ configPath: 'configs/demo.yaml', outDir: 'out/demo' }).submitCommand // 'sbatch /abs/out/demo/slurm/candela-parts.sbatch'
 */
export function planSlurmArray(request: SlurmPlanRequest): SlurmPlan {
  const workingDir = resolve(request.workingDir ?? '.');
  const configPath = resolve(workingDir, request.configPath);
  const config = loadConfigFile(configPath);
  loadSupernovae(config);
  const outDir = request.outDir === undefined ? resolve(config.output.dir.resolved) : resolve(workingDir, request.outDir);
  const resources = resolveClusterResources(request, config.sampler);
  const count = partCount(config);
  const parts = Array.from({ length: count }, (_, index) => locatePart(config, index, outDir));
  const slurmDir = join(outDir, SLURM_FOLDER);
  const batchPath = join(slurmDir, SLURM_FILES.batch);
  const mergePath = join(slurmDir, SLURM_FILES.merge);
  const logsDir = join(slurmDir, SLURM_FILES.logs);
  const existing = [batchPath, mergePath].filter((path) => existsSync(path));
  if (existing.length > 0 && !request.force) {
    throw new CandelaError({ code: 'plan.exists', file: existing[0], message: 'a cluster plan is already written here and is never overwritten silently', fix: 'pass --force to rewrite it, or choose another folder with --out' });
  }
  const merges = config.models.map((model, modelIndex) => ({
    label: model.label,
    partDirs: parts.filter((part) => part.modelIndex === modelIndex).map((part) => part.runDir),
    runDir: join(outDir, model.label),
  }));
  const workers = config.sampler.workers;
  const input: SlurmScriptInput = {
    jobName: jobNameOf(configPath), partCount: count, cpusPerTask: workers === 'auto' ? DEFAULT_CPUS_PER_PART : workers,
    partMinutes: resources.partMinutes, stopWarningSeconds: resources.stopWarningSeconds, stepsPerPart: resources.stepsPerPart,
    account: resources.account, queue: resources.queue, memory: resources.memory,
    workingDir, launcher: request.launcher ?? ['npx', 'candela'], configPath, outDir, logsDir,
    sbatchPath: batchPath, mergePath, parts: parts.map(({ index, label, ensemble, runDir }) => ({ index, label, ensemble, runDir })), merges,
  };
  mkdirSync(logsDir, { recursive: true });
  writeFileAtomic(batchPath, slurmBatchScript(input));
  writeFileAtomic(mergePath, slurmMergeScript(input));
  chmodSync(mergePath, 0o755);
  return { batchPath, mergePath, logsDir, parts: count, submitCommand: `sbatch ${shellQuote(batchPath)}`, mergedDirs: merges.map((merge) => merge.runDir), resources };
}
