import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { closestWord, loadConfigFile, type CandelaConfig } from '../../config/index.js';
import { CandelaError, type Issue } from '../../errors.js';
import { samplePrior } from '../../likelihood/index.js';
import {
  createInProcessEvaluator, createWorkerPoolEvaluator, EnsembleSampler, initializeWalkers,
  type BatchEvaluator, type LogProbabilityModel, type WorkerModelSpec,
} from '../../sampler/index.js';
import { runJsonText, writeFileAtomic } from '../../output/index.js';
import { appendChainRecord, bestStoredDraw, drawsFromChainRecord, readCheckpointState, recordShapeOf, shiftedDraws, writeCheckpoint } from '../../output/index.js';
import { chainsSelection, type ChainsCsvOption, type ChainsSelection } from '../../output/index.js';
import { buildModel, type BuiltModel } from '../run/buildModel.js';
import { writeChainsFile } from '../../output/index.js';
import { loadSupernovae, type LoadedSupernovae } from '../run/loadSupernovae.js';
import { prepareRunFolder, RUN_FILES } from '../../output/index.js';
import { checkConvergence, type ConvergenceCheck, type StopReason } from './samplingLoop.js';
import { createRunRecord, type RunRecord } from '../run/runRecord.js';
import { writeHubbleFiles } from '../report/hubbleFiles.js';
import { writeResolvedConfig } from '../run/writeResolvedConfig.js';
import { writeRunOutputsUnlessStopped } from '../report/buildRunOutputs.js';
import { terminalRunReport } from '../report/terminalRunReport.js';
import { blindRunRecord } from '../blinding/blindRunRecord.js';
import { checkBlindingSupported } from '../blinding/checkBlindingSupported.js';
import { prepareRunBlinding } from '../blinding/prepareRunBlinding.js';
import { workerModelUrl } from '../run/workerModel.js';
import { fitNestedModel } from './nestedFit.js';
import { createInterruptibleEvaluator, EVENT_LOOP_SLICE_MS, isRunInterrupted } from './interruptibleEvaluator.js';
import { locatePart, type FitPart, type PartFacts } from '../cluster/slurmPart.js';

/** Steps advanced between looks at the clock, the progress display and the checkpoint schedule (the stop signal is seen within a step, see createInterruptibleEvaluator). */
const STEPS_PER_SLICE = 25;
/** Fewest steps a run needs before its summaries, densities and figures can be written (the diagnostics need a few draws per split chain). */
const MINIMUM_STEPS_FOR_OUTPUTS = 80;

/**
 * Thrown by runFit when an interrupt came before every model of the
 * configuration had sampled: `outcomes` holds the models that did (their
 * folders are complete or hold a checkpoint), `message` says what the user
 * can do next.
 */
export class FitInterrupted extends Error {
  constructor(message: string, readonly outcomes: FitOutcome[]) {
    super(message);
    this.name = 'FitInterrupted';
  }
}

/** True when `error` is a {@link FitInterrupted}. */
export function isFitInterrupted(error: unknown): error is FitInterrupted {
  return error instanceof Error && error.name === 'FitInterrupted' && Array.isArray((error as FitInterrupted).outcomes);
}

/** What the caller asks of `candela fit`. */
export interface FitRequest {
  configPath: string;
  /** Replaces output.dir. */
  outDir?: string;
  force?: boolean;
  resume?: boolean;
  /** Replaces sampler.workers. */
  workers?: number;
  /**
   * Runs only part I of the configuration (one ensemble of one model, see
   * locatePart) into `<out>/parts/<label>/ensemble-<k>/`; `candela merge`
   * combines the parts of a model into one run folder.
   */
  part?: number;
  /**
   * Fits only the model with this label (into the folder it has in a full
   * run, with the chains it has there, byte for byte).
   */
  model?: string;
  /**
   * With `part`: the step count the part runs to, replacing sampler.max_steps
   * (a cluster plan gives every part the same count, see planSlurmArray; the
   * configuration stays unchanged, so the parts still merge).
   */
  partSteps?: number;
  /**
   * Set when the user interrupts (SIGINT, SIGTERM): the step in progress is
   * abandoned (the sampler returns to its start), then the checkpoint and
   * the outputs of the steps so far are written and the run returns with
   * stop reason `interrupted`. An interrupt before the walkers are placed
   * rejects with {@link FitInterrupted}.
   */
  signal?: AbortSignal;
  /** Progress after every slice of steps. */
  onProgress?: (progress: FitProgress) => void;
  /** Informational lines (what is being run, where outputs go). */
  onLine?: (line: string) => void;
  /**
   * Salt of a blinded run's secret offsets (hex) instead of 128 random bits:
   * for tests only (a known salt lets anyone recompute the offsets; docs/blinding.md).
   */
  blindingSalt?: string;
  /** Which steps chains.csv holds, replacing output.chains (default: the thinned steps after the burn-in); the chain record always holds every step. */
  chainsCsv?: ChainsCsvOption;
}

/** Progress of one model's sampling. */
export interface FitProgress {
  model: string;
  step: number;
  maxSteps: number;
  elapsedSeconds: number;
  check: ConvergenceCheck | null;
  targetEss: number;
  /** R-hat the run must reach (sampler.max_rhat). */
  maxRhat: number;
  /** Mean acceptance fraction over all walkers so far. */
  acceptance: number;
}

function meanAcceptance(sampler: EnsembleSampler): number {
  let sum = 0;
  let count = 0;
  for (let k = 0; k < sampler.options.ensembles; k++) {
    const fractions = sampler.acceptanceFractions(k);
    for (let w = 0; w < fractions.length; w++) { sum += fractions[w]; count++; }
  }
  return count ? sum / count : 0;
}

/** The result of one model's run. */
export interface FitOutcome {
  model: string;
  runDir: string;
  record: RunRecord;
  /** Problems worth a warning (approximations in use, data warnings). */
  warnings: Issue[];
  /** False when the run was interrupted before it had steps enough for summaries: only the checkpoint, chains.csv and run.json are written. */
  summarized?: boolean;
  /** The terminal report of a finished run (terminalRunReport), made from the analysis its outputs were written from. */
  terminalReport?: string;
}

/** Output folder of model `index`: the configured folder itself for one model, a subfolder per label for several. */
export function runFolderFor(config: CandelaConfig, index: number, outDir?: string): string {
  const base = outDir ?? config.output.dir.resolved;
  return config.models.length === 1 ? base : join(base, config.models[index].label);
}

/**
 * `candela fit`: validates the configuration and the data (any problem stops
 * here, before a file is touched), then samples each model in turn into its
 * run folder, checking convergence every `check_every` steps and writing an
 * atomic checkpoint every `checkpoint_every` steps, and finally writes the
 * chains and every derived output.
 */
/**
 * The indices of the models to fit: every model, or the one whose label is `label`.
 * @throws CandelaError `fit.unknown_model` (path --model) naming the labels and the closest one.
 */
function selectedModels(config: CandelaConfig, label: string | undefined): number[] {
  if (label === undefined) return config.models.map((_, index) => index);
  const index = config.models.findIndex((model) => model.label === label);
  if (index >= 0) return [index];
  const labels = config.models.map((model) => model.label);
  const suggestion = closestWord(label, labels);
  throw new CandelaError({
    code: 'fit.unknown_model', path: '--model', message: `the configuration has no model labelled "${label}"`,
    expected: `one of ${labels.join(', ')}`, found: label, fix: suggestion ? `did you mean "${suggestion}"?` : 'give the label of one of the models of the configuration',
  });
}

export async function runFit(request: FitRequest): Promise<FitOutcome[]> {
  const config = loadConfigFile(request.configPath);
  const part = request.part === undefined ? null : locatePart(config, request.part, request.outDir);
  checkBlindingSupported(config, part !== null);
  const selected = selectedModels(config, request.model);
  // The worker threads of the first model start now and build it from the configuration while this
  // thread reads the data and builds the models (two cores busy instead of one after the other).
  const firstIndex = part ? part.modelIndex : selected[0];
  let models: BuiltModel[] = [];
  const early = startEarlyEvaluator(config, request, firstIndex, () => models[firstIndex].logProbability);
  // fitOneModel closes the pool it is given; until then (bad data, an existing folder, an abort) this does.
  let handedOver = false;
  const handOver = (index: number): Promise<BatchEvaluator> | null => {
    if (index !== firstIndex) return null;
    handedOver = true;
    return early;
  };
  try {
    const data = loadSupernovae(config);
    if (part) {
      models[part.modelIndex] = buildModel(config, part.modelIndex, data);
      prepareRunFolder(part.runDir, { force: Boolean(request.force), resume: Boolean(request.resume) });
      if (request.signal?.aborted) throw new FitInterrupted('interrupted before the sampling started; run the same command with --resume to start it', []);
      return [await fitOneModel(config, part.modelIndex, models[part.modelIndex], data, part.runDir, request, part, handOver(part.modelIndex))];
    }
    for (const index of selected) models[index] = buildModel(config, index, data);
    const folders = config.models.map((_, index) => runFolderFor(config, index, request.outDir));
    for (const index of selected) prepareRunFolder(folders[index], { force: Boolean(request.force), resume: Boolean(request.resume) });
    const outcomes: FitOutcome[] = [];
    for (const [position, index] of selected.entries()) {
      if (request.signal?.aborted) {
        const left = selected.slice(position).map((i) => models[i].label).join(', ');
        throw new FitInterrupted(`interrupted before the model(s) ${left} started; run the same command with --resume to continue`, outcomes);
      }
      try {
        outcomes.push(await fitOneModel(config, index, models[index], data, folders[index], request, undefined, handOver(index)));
      } catch (error) {
        if (!isFitInterrupted(error)) throw error;
        throw new FitInterrupted(error.message, [...outcomes, ...error.outcomes]);
      }
    }
    return outcomes;
  } finally {
    if (!handedOver) void early?.then((evaluator) => evaluator.close(), () => undefined);
  }
}

/** The worker pool of model `index`, started before its model is built here (null when one worker or nested sampling). */
function startEarlyEvaluator(config: CandelaConfig, request: FitRequest, index: number, localModel: () => LogProbabilityModel): Promise<BatchEvaluator> | null {
  const workers = workerCount(config, request);
  if (workers <= 1 || config.sampler.method === 'nested') return null;
  const promise = createWorkerPoolEvaluator(workerSpec(config, index), workers - 1, { localModel });
  promise.catch(() => undefined); // awaited (and its error reported) by fitOneModel; never an unhandled rejection
  return promise;
}

function workerSpec(config: CandelaConfig, index: number): WorkerModelSpec {
  return { moduleUrl: workerModelUrl(), exportName: 'createWorkerModel', init: { config, modelIndex: index } };
}

function workerCount(config: CandelaConfig, request: FitRequest): number {
  if (request.workers !== undefined) return request.workers;
  return config.sampler.workers === 'auto' ? availableParallelism() : config.sampler.workers;
}

async function createEvaluator(config: CandelaConfig, index: number, model: BuiltModel, workers: number): Promise<BatchEvaluator> {
  if (workers <= 1) return createInProcessEvaluator(model.logProbability);
  // This thread evaluates its share of every batch itself; workers - 1 threads do the rest.
  return createWorkerPoolEvaluator(workerSpec(config, index), workers - 1, { localModel: model.logProbability });
}

/**
 * Samples one model into `runDir`. With `part`, the sampler holds only the
 * part's ensemble k: the walkers of every ensemble are initialized as in a
 * full run (initializeWalkers is deterministic from the seed) and ensemble
 * k's are kept, and its random stream is derived from k (ensembleIndices),
 * so its chain is bit-identical to ensemble k of the full run. A part never
 * stops on its own diagnostics (one ensemble's R-hat and ESS say little about
 * the merged run's): it runs to `request.partSteps` (default max_steps), or
 * stops at max_minutes (of this session: each resumption gets a fresh budget)
 * or on a signal; `candela merge` checks the targets.
 */
async function fitOneModel(
  config: CandelaConfig, index: number, model: BuiltModel, data: LoadedSupernovae, runDir: string, request: FitRequest, part?: FitPart,
  earlyEvaluator?: Promise<BatchEvaluator> | null,
): Promise<FitOutcome> {
  if (config.sampler.method === 'nested') return fitNestedModel(config, index, model, data, runDir, request);
  const started = Date.now();
  const settings = config.sampler;
  const seed = String(config.seed);
  const checkpointPath = join(runDir, RUN_FILES.checkpoint);
  const say = request.onLine ?? (() => undefined);
  const workers = workerCount(config, request);
  const partNote = part ? ` (part ${part.index}: ensemble ${part.ensemble} of ${part.ensembles})` : '';
  const rule = { targetEss: part ? settings.targetEss / part.ensembles : settings.targetEss, maxRhat: settings.maxRhat };
  const maxSteps = part && request.partSteps !== undefined ? request.partSteps : settings.maxSteps;
  say(`model ${model.label}${partNote}: ${model.parameterNames.length} free parameters (${model.parameterNames.join(', ')}); ${data.table.count} supernovae; ${workers} worker thread${workers === 1 ? '' : 's'}`);
  for (const line of [...(model.supernovae?.describe() ?? []), ...model.probes.flatMap((probe) => probe.loaded.describe)]) say(`  ${line}`);
  const { blinding, lines: blindingLines } = prepareRunBlinding(config, model.label, model.parameterNames, runDir, request.blindingSalt);
  for (const line of blindingLines) say(line);
  const evaluator = createInterruptibleEvaluator(await (earlyEvaluator ?? createEvaluator(config, index, model, workers)), request.signal, EVENT_LOOP_SLICE_MS, workers);
  try {
    let sampler: EnsembleSampler;
    let previousSeconds = 0;
    let evaluations = 0;
    if (request.resume && existsSync(checkpointPath)) {
      // The checkpoint without its chain: the earlier steps stream from the chain record to rebuild the sampler's traces.
      const saved = readCheckpointState(runDir);
      sampler = await EnsembleSampler.restore(saved.snapshot, evaluator, { earlierSteps: saved.earlierSteps });
      previousSeconds = saved.wallSeconds;
      evaluations = saved.evaluations;
      say(`resuming from step ${sampler.stepCount}`);
    } else {
      const rejection = (theta: Float64Array) => model.posterior.rejectionReason(theta) ?? 'log posterior is -Infinity';
      const start = await interruptedIsStartup(initializeWalkers({
        walkers: settings.walkers,
        ensembles: settings.ensembles,
        seed,
        sampleStart: (rng, out) => model.priors.forEach((entry, d) => { out[d] = samplePrior(entry.prior, rng); }),
        describeRejection: rejection,
      }, evaluator), model.label);
      const held = part ? [part.ensemble] : null;
      evaluations += start.optimizer.evaluations + settings.walkers * (held ? held.length : settings.ensembles);
      sampler = await interruptedIsStartup(EnsembleSampler.start({
        dimension: model.parameterNames.length, walkers: settings.walkers, seed,
        stretchScale: settings.stretchScale, differentialEvolutionWeight: settings.differentialEvolutionWeight,
        ...(held ? { ensembleIndices: held } : { ensembles: settings.ensembles }),
      }, evaluator, held ? held.map((k) => start.positions[k]) : start.positions), model.label);
    }
    const stepsPerEvaluation = settings.walkers * sampler.options.ensembles;
    const saveCheckpoint = () => {
      const seconds = previousSeconds + (Date.now() - started) / 1000;
      writeCheckpoint(runDir, sampler.snapshot(), { wallSeconds: seconds, evaluations });
    };
    let stopReason: StopReason | null = null;
    let check: ConvergenceCheck | null = null;
    let lastCheckpoint = sampler.stepCount;
    // Convergence is checked at every multiple of check_every steps, and only there, whether or not the run was
    // resumed in between: a resumed run checks at its checkpoint's step only when an uninterrupted run checked there.
    let lastCheck = sampler.stepCount - (sampler.stepCount % settings.checkEvery);
    if (sampler.stepCount > 0 && sampler.stepCount % settings.checkEvery === 0) check = checkConvergence(sampler, rule);
    if (check?.converged && !part) stopReason = 'converged';
    while (stopReason === null) {
      if (request.signal?.aborted) { stopReason = 'interrupted'; break; }
      // A part's max_minutes counts this session only: a cluster job that stopped at its time limit continues with a fresh budget when submitted again.
      const elapsed = (part ? 0 : previousSeconds) + (Date.now() - started) / 1000;
      if (elapsed > settings.maxMinutes * 60) { stopReason = 'wall_time'; break; }
      if (sampler.stepCount >= maxSteps) { stopReason = 'max_steps'; break; }
      const slice = Math.min(STEPS_PER_SLICE, maxSteps - sampler.stepCount, settings.checkEvery - (sampler.stepCount - lastCheck));
      const before = sampler.stepCount;
      try {
        await sampler.advance(slice);
      } catch (error) {
        if (!isRunInterrupted(error)) throw error;
        stopReason = 'interrupted'; // the sampler is back at the end of its last whole step
      }
      evaluations += (sampler.stepCount - before) * stepsPerEvaluation;
      // The slice's steps go to the chain record and leave memory, so a run's memory does not grow with its steps.
      appendChainRecord(runDir, sampler.snapshot(), { sync: false });
      sampler.releaseStoredSteps(sampler.stepCount);
      if (stopReason !== null) break;
      if (sampler.stepCount - lastCheck >= settings.checkEvery) {
        lastCheck = sampler.stepCount;
        check = checkConvergence(sampler, rule);
        if (check.converged && !part) stopReason = 'converged';
      }
      if (settings.checkpointEvery > 0 && sampler.stepCount - lastCheckpoint >= settings.checkpointEvery) {
        saveCheckpoint();
        lastCheckpoint = sampler.stepCount;
      }
      request.onProgress?.({ model: model.label, step: sampler.stepCount, maxSteps, elapsedSeconds: previousSeconds + (Date.now() - started) / 1000, check, targetEss: rule.targetEss, maxRhat: rule.maxRhat, acceptance: meanAcceptance(sampler) });
    }
    if (stopReason === 'interrupted') say(`model ${model.label}${partNote}: stopped at step ${sampler.stepCount} on the signal; writing the checkpoint, the chains and the summaries so far`);
    saveCheckpoint();
    const summarized = sampler.stepCount >= MINIMUM_STEPS_FOR_OUTPUTS;
    if (!summarized && stopReason !== 'interrupted') {
      throw new CandelaError({ code: 'run.too_short', message: `the run stopped after ${sampler.stepCount} steps, too few to summarize`, fix: 'raise sampler.max_steps or sampler.max_minutes (or resume the run with --resume)' });
    }
    check = checkConvergence(sampler, rule);
    const wallSeconds = previousSeconds + (Date.now() - started) / 1000;
    // Every step, streamed from the chain record the checkpoint has just completed (the sampler holds none of them
    // any more): chains.csv, the best fit and the Hubble files read it a block at a time, so memory does not grow with the run.
    const ensembles = drawsFromChainRecord(runDir, recordShapeOf(sampler.snapshot()), sampler.stepCount);
    const selection = chainsSelection(request.chainsCsv ?? config.output.chains, sampler.stepCount, check.burnInSteps, check.maxTau);
    // A blinded run's chains.csv shows the blinded parameters shifted and leaves the derived quantities out (docs/blinding.md).
    const shownDraws = blinding ? shiftedDraws(ensembles, model.parameterNames.map((name) => blinding.offsets[name] ?? 0)) : ensembles;
    writeChainsFile(join(runDir, RUN_FILES.chains), { parameters: model.parameterNames, derived: blinding ? [] : model.derivedNames }, shownDraws, check.burnInSteps, undefined, selection);
    // One pass over the record for the best draw after the burn-in: run.json's best fit and the Hubble files share it.
    const best = bestStoredDraw(ensembles, check.burnInSteps);
    const fullRecord = createRunRecord({ config, modelIndex: index, model, data, check, stopReason, wallSeconds, evaluations, steps: sampler.stepCount, workers, best });
    const stored: RunRecord & { chains_csv?: ChainsSelection } = selection.keep === 'all' ? fullRecord : { ...fullRecord, chains_csv: selection };
    const unblindedRecord: RunRecord & { part?: PartFacts; chains_csv?: ChainsSelection } = part ? {
      ...stored,
      run: { ...fullRecord.run, ensembles: 1, target_ess: rule.targetEss },
      part: { index: part.index, model_index: part.modelIndex, ensemble: part.ensemble, ensembles_total: part.ensembles, part_target_ess: rule.targetEss, steps_target: maxSteps },
    } : stored;
    const record = blinding ? blindRunRecord(unblindedRecord, blinding) : unblindedRecord;
    writeFileAtomic(join(runDir, RUN_FILES.run), runJsonText(record));
    writeResolvedConfig(runDir, config); // paths relative to the run folder, so the copy re-runs as is
    const warnings: Issue[] = [...data.warnings, ...(model.supernovae?.warnings ?? []).map((message) => ({ code: 'likelihood.approximation', severity: 'warning' as const, message }))];
    if (!summarized) {
      say(`model ${model.label}${partNote}: interrupted after ${sampler.stepCount} steps, fewer than the ${MINIMUM_STEPS_FOR_OUTPUTS} the summaries need; wrote the checkpoint, chains.csv and run.json in ${runDir}`);
      return { model: model.label, runDir, record, warnings, summarized: false };
    }
    writeHubbleFiles(runDir, model, ensembles, check.burnInSteps, best.theta, seed, { blinded: blinding !== null });
    // A signal asks to stop soon: the figures and report.html are left to `candela report` (or to the resumed run),
    // also when it comes while they are being drawn after the sampling finished.
    const interrupted = stopReason === 'interrupted';
    let terminalReport: string | undefined;
    const complete = await writeRunOutputsUnlessStopped(runDir, interrupted ? null : request.signal, (written) => {
      if (!interrupted) terminalReport = terminalRunReport(runDir, written);
    });
    if (!complete) say(`model ${model.label}${partNote}: figures and report.html${interrupted ? ' of the steps so far' : ' left out on the signal'}: candela report ${runDir}`);
    say(`model ${model.label}${partNote}: ${stopReason} after ${sampler.stepCount} steps in ${wallSeconds.toFixed(1)} s; outputs in ${runDir}`);
    return { model: model.label, runDir, record, warnings, summarized: true, ...(terminalReport !== undefined ? { terminalReport } : {}) };
  } finally {
    await evaluator.close();
  }
}

/** Awaits a start-up stage; an interrupt there becomes {@link FitInterrupted} (no walker state exists yet to checkpoint). */
async function interruptedIsStartup<T>(stage: Promise<T>, label: string): Promise<T> {
  try {
    return await stage;
  } catch (error) {
    if (!isRunInterrupted(error)) throw error;
    throw new FitInterrupted(`interrupted while the walkers of ${label} were being placed, before any step: nothing to checkpoint; run the same command with --resume to start it`, []);
  }
}
