import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { configToPlainObject, loadConfigFile, type CandelaConfig } from '../../config/index.js';
import { CandelaError } from '../../errors.js';
import { runJsonText, writeFileAtomic } from '../../output/index.js';
import { createInProcessEvaluator, EnsembleSampler, type EnsembleSnapshot, type SamplerSnapshot } from '../../sampler/index.js';
import { buildModel } from '../run/buildModel.js';
import { buildRunOutputs } from '../report/buildRunOutputs.js';
import { acceptedMoveCounts, bestStoredDraw, chainsSelection, ensemblesSideBySide, forEachStoredBlock, writeChainRecordFrom, writeChainsFile, type ChainsSelection } from '../../output/index.js';
import { writeHubbleFiles } from '../report/hubbleFiles.js';
import { loadSupernovae } from '../run/loadSupernovae.js';
import { readPartsForMerge, type PartOnDisk, type PartRecord } from './mergeChecks.js';
import { judgeMergedRun, type MergeVerdict } from './mergeVerdict.js';
import { createRunRecord, type RunRecord } from '../run/runRecord.js';
import { prepareRunFolder, RUN_FILES } from '../../output/index.js';
import { writeResolvedConfig } from '../run/writeResolvedConfig.js';
import { checkConvergence, type StopReason } from '../fit/samplingLoop.js';
import { SLURM_FILES, SLURM_FOLDER } from './slurmPlan.js';

/** Fewest steps a merged run may keep (as for a fit: the diagnostics need a few draws per split chain). */
const MINIMUM_MERGED_STEPS = 80;

/** What `candela merge` is asked. */
export interface MergeRequest {
  /** Finished part folders of one model. */
  partDirs: string[];
  /** The merged run folder. */
  outDir: string;
  /** Replace a non-empty output folder. */
  force?: boolean;
}

/** run.json of a merged run: a fit's record with stop_reason `merged` and the parts it came from. */
export type MergedRunRecord = Omit<RunRecord, 'run'> & {
  /** The steps chains.csv holds when it is thinned (output.chains), as in a fit's record. */
  chains_csv?: ChainsSelection;
  run: Omit<RunRecord['run'], 'stop_reason'> & { stop_reason: StopReason | 'merged' };
  merge: {
    ensembles_total: number;
    truncated_to_steps: number;
    /** Every sampled parameter meets target_ess and max_rhat over the merged ensembles. */
    targets_met: boolean;
    /** Missed targets and parts that stopped before their step count, one sentence each. */
    shortfalls: string[];
    /** Steps to continue every part to (--resume) when the targets are missed, else null. */
    steps_suggested: number | null;
    /** What to run next when the targets are missed, else null. */
    remedy: string | null;
    parts: Array<{ dir: string; index: number; ensemble: number; steps: number; steps_target: number | null; stop_reason: string; evaluations: number; wall_seconds: number }>;
  };
};

/** The batch script of the plan the parts came from (`<out>/slurm/...` for parts in `<out>/parts/<model>/ensemble-<k>`), when it exists. */
function planScriptOf(partDir: string): string | null {
  const path = join(dirname(dirname(dirname(resolve(partDir)))), SLURM_FOLDER, SLURM_FILES.batch);
  return existsSync(path) ? path : null;
}

/** One sentence saying how to continue the parts to `steps`: through the plan's batch script when there is one, else part by part. */
function remedyFor(steps: number, parts: PartOnDisk[], configFile: string, outDir: string): string {
  const script = planScriptOf(parts[0].dir);
  const direct = `candela fit ${configFile} --out <out> --part I --steps-per-part ${steps} --resume for I in ${parts.map((part) => part.record.part.index).join(', ')}`;
  const submit = script ? `submit the plan again with the step count, \`sbatch ${script} ${steps}\` (each part continues from its checkpoint), or run ` : 'run ';
  return `continue every part to ${steps} steps: ${submit}${direct}; then merge again with --force into ${outDir}`;
}

/** The configuration the parts ran, loaded again from its file and checked against their records. */
function loadPartConfiguration(first: PartRecord, dir: string): CandelaConfig {
  const file = resolve(first.inputs[0].path);
  const runPath = join(dir, RUN_FILES.run);
  if (!existsSync(file)) {
    throw new CandelaError({ code: 'merge.configuration_missing', file: runPath, message: `the configuration file ${first.inputs[0].path} the parts ran is not found from this folder`, fix: 'run candela merge from the folder the parts ran in (the merge script does)' });
  }
  const config = loadConfigFile(file);
  if (JSON.stringify(configToPlainObject(config)) !== JSON.stringify(first.configuration)) {
    throw new CandelaError({ code: 'merge.configuration_changed', file, message: `the configuration file changed since the parts in ${dir} ran`, fix: 'restore the configuration the parts ran with, or rerun the parts' });
  }
  return config;
}

/**
 * One part's sampler state as an ensemble of the merged run, holding no stored step (they stay in the part's
 * chain record). A part cut to fewer steps than it ran gets its acceptance counts recounted over the kept steps.
 */
function mergedEnsemble(part: PartOnDisk, steps: number): EnsembleSnapshot {
  const saved = part.snapshot.ensembles[0];
  const empty = new Float64Array(0);
  const acceptedCounts = steps < part.snapshot.stepCount ? acceptedMoveCounts(part.draws, steps) : saved.acceptedCounts;
  return { ...saved, acceptedCounts, chainPositions: empty, chainLogProb: empty, chainBlobs: empty };
}

/**
 * `candela merge`: combines finished part folders of one model (written by
 * `candela fit CONFIG --part I`) into one run folder, as if one fit had run
 * their ensembles together: the parts are checked (readPartsForMerge), cut
 * to the shortest part's step count, ordered by their original ensemble
 * index (ensemble column 0, 1, ... in that order), and the burn-in is chosen
 * again from the merged chains with the fit's rule, so R-hat compares the
 * parts' ensembles. Writes chain-record.bin (every merged step), chains.csv
 * (the steps output.chains selects), run.json (stop_reason `merged`, the
 * parts' evaluations summed, the longest part's wall time, the parts listed),
 * config.resolved.yaml, the Hubble-diagram files (from the model rebuilt from
 * the configuration and data) and every output of buildRunOutputs. No
 * checkpoint: a merged run cannot be resumed (resume the parts, then merge
 * again). When the parts hold every ensemble and ran to the same step count,
 * chains.csv equals that of a single `candela fit` byte for byte.
 *
 * The merged run is judged against target_ess and max_rhat of the
 * configuration (judgeMergedRun): the folder is written either way, and the
 * returned verdict (also in run.json under `merge`) says whether the targets
 * are met, what falls short, and how many steps to continue the parts to.
 *
 * Cost: reading the parts, rebuilding the likelihood, the diagnostics and outputs of a fit.
 * @param request part folders, output folder, force.
 * @returns the merged folder, its record and the verdict on the targets.
 * @throws CandelaError: those of readPartsForMerge; `merge.configuration_missing`,
 *   `merge.configuration_changed`, `merge.inputs_changed` (data files changed since the parts ran),
 *   `merge.too_short`; `run.folder_not_empty` without force. Nothing is written when it throws before sampling outputs.
 * @example await mergeParts({ partDirs: ['out/parts/flat_lcdm/ensemble-0', 'out/parts/flat_lcdm/ensemble-1'], outDir: 'out/flat_lcdm' })
 */
export async function mergeParts(request: MergeRequest): Promise<{ runDir: string; record: MergedRunRecord; verdict: MergeVerdict }> {
  const parts = readPartsForMerge(request.partDirs, request.outDir);
  const first = parts[0];
  const config = loadPartConfiguration(first.record, first.dir);
  const modelIndex = config.models.findIndex((model) => model.label === first.record.model.label);
  const data = loadSupernovae(config);
  const model = buildModel(config, modelIndex, data);
  const steps = Math.min(...parts.map((part) => part.snapshot.stepCount));
  if (steps < MINIMUM_MERGED_STEPS) {
    const shortest = parts.find((part) => part.snapshot.stepCount === steps) as PartOnDisk;
    throw new CandelaError({ code: 'merge.too_short', file: shortest.dir, message: `the part ${shortest.dir} holds ${steps} steps, too few to summarize`, expected: `>= ${MINIMUM_MERGED_STEPS} steps`, found: String(steps), fix: 'continue that part with `candela fit CONFIG --part I --resume --steps-per-part N` (or submit the plan again), then merge again' });
  }
  const indices = parts.map((part) => part.record.part.ensemble);
  // Every step stays on disk: the merged chains are the parts' chain records side by side, read a block at a time,
  // and the sampler's diagnostic traces are rebuilt by replaying them (as a resumed fit does), so merging needs memory
  // for a block and the traces, not for the chains.
  const ensembles = ensemblesSideBySide(parts.map((part) => part.draws), steps);
  const merged: SamplerSnapshot = {
    ...first.snapshot, stepCount: steps, chainFirstStep: steps,
    options: { ...first.snapshot.options, ensembles: parts.length, ensembleIndices: indices },
    ensembles: parts.map((part) => mergedEnsemble(part, steps)),
  };
  const evaluator = createInProcessEvaluator(model.logProbability);
  const sampler = await EnsembleSampler.restore(merged, evaluator, {
    earlierSteps: (visit) => forEachStoredBlock(ensembles, (ensemble, firstStep, block) => {
      const size = block.walkers * block.dimension;
      for (let s = 0; s < block.steps; s++) visit(firstStep + s, ensemble, block.positions.subarray(s * size, (s + 1) * size));
    }),
  });
  const check = checkConvergence(sampler, { targetEss: config.sampler.targetEss, maxRhat: config.sampler.maxRhat });
  const wallSeconds = Math.max(...parts.map((part) => part.wallSeconds));
  const evaluations = parts.reduce((sum, part) => sum + part.evaluations, 0);
  const workers = Math.max(...parts.map((part) => part.record.run.worker_threads));
  const best = bestStoredDraw(ensembles, check.burnInSteps);
  const base = createRunRecord({ config, modelIndex, model, data, check, stopReason: 'max_steps', wallSeconds, evaluations, steps, workers, best });
  const recorded = JSON.stringify(first.record.inputs.map((input) => input.sha256));
  if (JSON.stringify(base.inputs.map((input) => input.sha256)) !== recorded) {
    throw new CandelaError({ code: 'merge.inputs_changed', file: join(first.dir, RUN_FILES.run), message: 'an input file (configuration or data) changed since the parts ran: its SHA-256 differs from the parts\' records', fix: 'restore the files the parts ran with, or rerun the parts' });
  }
  const progress = parts.map((part) => ({ dir: part.dir, steps: part.snapshot.stepCount, stepsTarget: part.record.part.steps_target ?? null, stopReason: part.record.run.stop_reason }));
  const verdict = judgeMergedRun(check, { targetEss: config.sampler.targetEss, maxRhat: config.sampler.maxRhat }, model.parameterNames, progress);
  const total = first.record.part.ensembles_total;
  if (parts.length < total) verdict.shortfalls.push(`only ${parts.length} of the configuration's ${total} ensembles were merged (ensembles ${indices.join(', ')})`);
  const record: MergedRunRecord = {
    ...base,
    run: { ...base.run, ensembles: parts.length, stop_reason: 'merged' },
    merge: {
      ensembles_total: first.record.part.ensembles_total,
      truncated_to_steps: steps,
      targets_met: verdict.targetsMet,
      shortfalls: verdict.shortfalls,
      steps_suggested: verdict.suggestedSteps,
      remedy: verdict.suggestedSteps === null ? null : remedyFor(verdict.suggestedSteps, parts, first.record.inputs[0].path, request.outDir),
      parts: parts.map((part, i) => ({
        dir: part.dir, index: part.record.part.index, ensemble: part.record.part.ensemble, steps: part.snapshot.stepCount, steps_target: progress[i].stepsTarget,
        stop_reason: part.record.run.stop_reason, evaluations: part.evaluations, wall_seconds: part.record.run.wall_seconds,
      })),
    },
  };
  prepareRunFolder(request.outDir, { force: Boolean(request.force), resume: false });
  // Every step goes to the merged folder's chain record (what the summaries read when chains.csv is thinned);
  // chains.csv holds the steps output.chains asks for, chosen as a fit chooses them.
  writeChainRecordFrom(request.outDir, ensembles);
  const selection = chainsSelection(config.output.chains, steps, check.burnInSteps, check.maxTau);
  if (selection.keep !== 'all') record.chains_csv = selection;
  writeChainsFile(join(request.outDir, RUN_FILES.chains), { parameters: model.parameterNames, derived: model.derivedNames }, ensembles, check.burnInSteps, undefined, selection);
  writeFileAtomic(join(request.outDir, RUN_FILES.run), runJsonText(record));
  writeResolvedConfig(request.outDir, config);
  writeHubbleFiles(request.outDir, model, ensembles, check.burnInSteps, best.theta, String(config.seed));
  buildRunOutputs([request.outDir], request.outDir);
  return { runDir: request.outDir, record, verdict };
}
