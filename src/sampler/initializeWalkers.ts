import { CandelaError } from '../errors.js';
import { createRandomStream, deriveSeed, NELDER_MEAD_EVALUATIONS_PER_DIMENSION } from '../math/index.js';
import type { RandomStream } from '../math/index.js';
import { curvatureWidths } from './curvatureWidths.js';
import { resolveEnsembleOptions } from './ensembleOptions.js';
import { evaluateBatchChecked } from './evaluateBatchChecked.js';
import { locatePosteriorMode } from './locatePosteriorMode.js';
import type { BatchEvaluator } from './logProbabilityModel.js';

/** Start draws used to measure the typical scale of each parameter (at least this many). */
const SCALE_DRAWS = 16;
/** Nelder-Mead initial simplex edge, as a fraction of the start-draw spread. */
const SIMPLEX_STEP_FRACTION = 0.1;
/** First finite-difference probe step, as a fraction of the start-draw spread. */
const PROBE_STEP_FRACTION = 1e-3;
/** Width used when curvature cannot be measured, as a fraction of the start-draw spread. */
const FALLBACK_WIDTH_FRACTION = 1e-2;
/** Scale for a parameter whose start draws do not vary: this fraction of max(|value|, 1). */
const FIXED_START_RELATIVE_SCALE = 0.1;

/** How to start the walkers of every ensemble. */
export interface WalkerStartOptions {
  /** Walkers per ensemble. */
  walkers: number;
  /** Ensembles (default 4). */
  ensembles?: number;
  /** Run seed; draws come from `deriveSeed(seed, 'start', ...)` streams. */
  seed: string;
  /** Writes one plausible point (e.g. a prior draw) into `out` using only `rng`. */
  sampleStart(rng: RandomStream, out: Float64Array): void;
  /** Nelder-Mead searches from different start draws (default 4). */
  optimizerStarts?: number;
  /** Evaluation budget per search (default 500 x dimension). */
  optimizerEvaluations?: number;
  /** Attempts (redraw rounds) before giving up on a start point or a walker (default 100). */
  maxAttempts?: number;
  /** Radius of the walker ball in units of the curvature widths (default 0.1). */
  ballScale?: number;
  /** Says why a point has -Infinity log posterior, for the error message (e.g. which prior bound). */
  describeRejection?(theta: Float64Array): string;
}

/** Where the walkers start and how that was found. */
export interface WalkerStart {
  /** Per ensemble, walkers x dimension, every walker with a finite log posterior. */
  positions: Float64Array[];
  /** Highest-posterior point found. */
  mode: Float64Array;
  modeLogProb: number;
  /** Curvature width per parameter (parameter units); the ball radius is ballScale x width. */
  widths: Float64Array;
  /** Searches run, how many met their tolerances, and total evaluations. */
  optimizer: { searches: number; converged: number; evaluations: number };
}

function noValidStart(attempts: number, lastRejection: string): CandelaError {
  return new CandelaError({
    code: 'sampler.no_valid_start',
    message: `no walker could be started with a finite log-posterior after ${attempts} attempts; the last rejection: ${lastRejection}`,
    fix: 'check that the priors and the data allow some parameter values (prior ranges, parameter bounds, fixed values)',
  });
}

/**
 * Draws points into `slots` rows of `points` until each has a finite log
 * posterior, redrawing failed rows (in row order) for at most `maxAttempts`
 * rounds. Returns how many rows succeeded (failed rows keep -Infinity).
 */
async function drawUntilFinite(
  evaluator: BatchEvaluator, points: Float64Array, logProb: Float64Array, maxAttempts: number,
  draw: (row: number, out: Float64Array) => void, rejection: (theta: Float64Array) => string,
): Promise<{ attempts: number; lastRejection: string }> {
  const dimension = evaluator.dimension;
  let pending = Array.from({ length: logProb.length }, (_, row) => row);
  let lastRejection = 'no point was drawn';
  let attempts = 0;
  while (pending.length > 0 && attempts < maxAttempts) {
    attempts += 1;
    const batch = new Float64Array(pending.length * dimension);
    pending.forEach((row, index) => {
      const out = batch.subarray(index * dimension, (index + 1) * dimension);
      draw(row, out);
      points.set(out, row * dimension);
    });
    const values = (await evaluateBatchChecked(evaluator, batch, pending.length)).logProb;
    const failed: number[] = [];
    pending.forEach((row, index) => {
      logProb[row] = values[index];
      if (values[index] === -Infinity) {
        failed.push(row);
        lastRejection = rejection(batch.subarray(index * dimension, (index + 1) * dimension));
      }
    });
    pending = failed;
  }
  return { attempts, lastRejection };
}

/**
 * Starts the walkers: finds the posterior mode with Nelder & Mead (1965)
 * searches from several start draws (keeping the best), measures the
 * posterior width per parameter from the curvature there (see
 * curvatureWidths.ts), and draws each ensemble's walkers from a Gaussian
 * ball of radius ballScale x width around the mode, redrawing any walker
 * with -Infinity log posterior. Fully deterministic from the seed: start
 * draws use stream deriveSeed(seed, 'start', 'draws'), ensemble k's ball
 * uses deriveSeed(seed, 'start', 'ensemble', k).
 *
 * Cost: about optimizerStarts x optimizerEvaluations + 4 d + walkers x
 * ensembles evaluations, all batched. Throws CandelaError
 * `sampler.no_valid_start` ("no walker could be started ... the last
 * rejection: ...") when no start draw or no ball walker has a finite log
 * posterior within maxAttempts rounds; `sampler.invalid_log_probability`;
 * the option errors of resolveEnsembleOptions (e.g. `sampler.too_few_walkers`).
 * @example
 * const start = await initializeWalkers({ walkers: 16, seed: '1', sampleStart: (rng, out) => { out[0] = rng.normal(); out[1] = rng.normal(); } }, evaluator);
 * start.positions.length // 4
 */
export async function initializeWalkers(options: WalkerStartOptions, evaluator: BatchEvaluator): Promise<WalkerStart> {
  const dimension = evaluator.dimension;
  const { ensembles, walkers } = resolveEnsembleOptions({ dimension, walkers: options.walkers, ensembles: options.ensembles, seed: options.seed }, dimension);
  const maxAttempts = options.maxAttempts ?? 100;
  const searchCount = options.optimizerStarts ?? 4;
  const ballScale = options.ballScale ?? 0.1;
  const rejection = (theta: Float64Array): string =>
    options.describeRejection?.(theta) ?? `the log posterior is -Infinity at (${Array.from(theta).join(', ')})`;

  // 1. Start draws: their spread sets the scale of every later step; the first finite ones seed the searches.
  const drawCount = Math.max(SCALE_DRAWS, searchCount);
  const drawStream = createRandomStream(deriveSeed(options.seed, 'start', 'draws'));
  const draws = new Float64Array(drawCount * dimension);
  const drawLogProb = new Float64Array(drawCount);
  // Running mean and sum of squared deviations of every draw (Welford 1962, Technometrics 4, 419).
  const runningMean = new Float64Array(dimension);
  const squaredDeviations = new Float64Array(dimension);
  let drawsMade = 0;
  const drawn = await drawUntilFinite(evaluator, draws, drawLogProb, maxAttempts, (_, out) => {
    options.sampleStart(drawStream, out);
    drawsMade += 1;
    for (let i = 0; i < dimension; i++) {
      const delta = out[i] - runningMean[i];
      runningMean[i] += delta / drawsMade;
      squaredDeviations[i] += delta * (out[i] - runningMean[i]);
    }
  }, rejection);
  const finiteRows = Array.from(drawLogProb.keys()).filter((row) => drawLogProb[row] > -Infinity);
  if (finiteRows.length === 0) throw noValidStart(drawn.attempts, drawn.lastRejection);
  const scale = Float64Array.from({ length: dimension }, (_, i) => {
    const variance = squaredDeviations[i] / drawsMade;
    const reference = draws[finiteRows[0] * dimension + i];
    return variance > 0 ? Math.sqrt(variance) : FIXED_START_RELATIVE_SCALE * Math.max(Math.abs(reference), 1);
  });

  // 2. Nelder-Mead from the first finite draws; keep the best end point.
  const starts = finiteRows.slice(0, searchCount).map((row) => draws.slice(row * dimension, (row + 1) * dimension));
  const mode = await locatePosteriorMode(evaluator, starts, scale.map((s) => SIMPLEX_STEP_FRACTION * s),
    options.optimizerEvaluations ?? NELDER_MEAD_EVALUATIONS_PER_DIMENSION * dimension);

  // 3. Widths from the curvature at the mode.
  const widths = await curvatureWidths(evaluator, mode.point, mode.logProb,
    scale.map((s) => PROBE_STEP_FRACTION * s), scale.map((s) => FALLBACK_WIDTH_FRACTION * s), scale);

  // 4. A Gaussian ball per ensemble, all ensembles evaluated together.
  const streams = Array.from({ length: ensembles }, (_, k) => createRandomStream(deriveSeed(options.seed, 'start', 'ensemble', k)));
  const ball = new Float64Array(ensembles * walkers * dimension);
  const ballLogProb = new Float64Array(ensembles * walkers);
  const placed = await drawUntilFinite(evaluator, ball, ballLogProb, maxAttempts, (row, out) => {
    const rng = streams[Math.floor(row / walkers)];
    for (let i = 0; i < dimension; i++) out[i] = mode.point[i] + ballScale * widths[i] * rng.normal();
  }, rejection);
  if (ballLogProb.some((value) => value === -Infinity)) throw noValidStart(placed.attempts, placed.lastRejection);
  return {
    positions: Array.from({ length: ensembles }, (_, k) => ball.slice(k * walkers * dimension, (k + 1) * walkers * dimension)),
    mode: mode.point,
    modeLogProb: mode.logProb,
    widths,
    optimizer: { searches: starts.length, converged: mode.searches.filter((s) => s.converged).length, evaluations: mode.evaluations },
  };
}
