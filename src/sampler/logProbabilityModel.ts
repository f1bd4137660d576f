/**
 * The evaluation contract between the sampler and whatever it samples. The
 * sampler knows nothing about cosmology: it sees a log-probability function of
 * a parameter vector that also reports a fixed number of extra values
 * ("blobs": log prior, log likelihood, derived parameters) per point.
 */

/**
 * A log-probability function of `dimension` parameters.
 *
 * `evaluate` returns the log posterior (natural log, up to a constant) of the
 * point `theta` and writes exactly `blobCount` extra values into
 * `blobs[blobOffset .. blobOffset + blobCount)`. It returns -Infinity for a
 * point of zero posterior density (outside the prior, unphysical) and never
 * NaN or +Infinity; the sampler stops with a CandelaError if it sees either.
 * It must be a pure function of `theta` (same input, same bits out), which is
 * what makes chains independent of the number of worker threads.
 *
 * @example
 * const standardNormal: LogProbabilityModel = {
 *   dimension: 1, blobCount: 0,
 *   evaluate: (theta) => -0.5 * theta[0] * theta[0],
 * };
 */
export interface LogProbabilityModel {
  /** Number of parameters. */
  readonly dimension: number;
  /** Number of extra values written per point. */
  readonly blobCount: number;
  /** Log posterior at `theta` (may be -Infinity, never NaN); writes `blobCount` values at `blobs[blobOffset]`. */
  evaluate(theta: Float64Array, blobs: Float64Array, blobOffset: number): number;
}

/**
 * How a worker thread builds its own copy of the model: the module at
 * `moduleUrl` (a `file:` URL of a JavaScript module) exports, under
 * `exportName`, a factory `(init) => LogProbabilityModel | Promise<LogProbabilityModel>`.
 * `init` must survive the structured clone (plain data, typed arrays).
 *
 * @example
 * { moduleUrl: new URL('./posteriorModel.js', import.meta.url).href, exportName: 'createPosteriorModel', init: { ... } }
 */
export interface WorkerModelSpec {
  /** URL of the JavaScript module exporting the factory. */
  moduleUrl: string;
  /** Name of the exported factory function. */
  exportName: string;
  /** Serializable data handed to the factory in every worker. */
  init: unknown;
}

/**
 * Evaluates many points at once, in process or in worker threads. The sampler
 * hands it a whole half-ensemble of every ensemble in one call.
 */
export interface BatchEvaluator {
  /** Number of parameters of the model. */
  readonly dimension: number;
  /** Number of blobs per point. */
  readonly blobCount: number;
  /**
   * Evaluates `count` points stored row major in `points` (count x dimension)
   * into `logProb[0 .. count)` and `blobs[0 .. count * blobCount)`.
   * Rejects when the model throws.
   */
  evaluate(points: Float64Array, count: number, logProb: Float64Array, blobs: Float64Array): Promise<void>;
  /** Releases threads and buffers; the evaluator is unusable afterwards. */
  close(): Promise<void>;
}
