import { CandelaError } from '../../errors.js';
import type { ParameterDiagnostics, RunSummary } from './runSummary.js';
import { sampleStatistics } from './sampleStatistics.js';
import { weightedCorrelationMatrix } from './weightedCorrelationMatrix.js';

/** Options of {@link summarizePosterior}. */
export interface SummarizePosteriorOptions {
  /** Non-negative sample weights (nested sampling); unit weights when omitted. */
  weights?: ArrayLike<number>;
  /** Log posterior of each sample (natural log); gives the MAP row. Non-finite entries are never chosen. */
  logPosterior?: ArrayLike<number>;
  /** Diagnostics per parameter name, copied into the rows. */
  diagnostics?: Readonly<Record<string, ParameterDiagnostics>>;
  /** Names of derived parameters (flagged in the rows). */
  derived?: readonly string[];
  /** Heading of the summary. */
  title?: string;
}

/**
 * Summarizes posterior samples, one column per parameter: statistics of
 * every parameter (see sampleStatistics), the MAP estimate (the sample with
 * the highest log posterior, when given; a sample estimate, not an
 * optimization) and the weighted correlation matrix.
 *
 * Cost: O(p n log n + n p^2) for p parameters of n samples.
 * @param columns one column of n samples per parameter (parameter units).
 * @param names parameter names, same order as columns.
 * @param options weights, log posteriors, diagnostics, derived names, title.
 * @throws CandelaError `output.column_length` when lengths differ, or the
 *   errors of sampleStatistics.
 * @example summarizePosterior([Float64Array.of(0.3, 0.31, 0.29)], ['omega_m']).parameters[0].stats.median // 0.3
 */
export function summarizePosterior(columns: readonly ArrayLike<number>[], names: readonly string[], options: SummarizePosteriorOptions = {}): RunSummary {
  if (columns.length !== names.length) {
    throw new CandelaError({ code: 'output.column_length', message: `${columns.length} columns but ${names.length} names`, expected: String(names.length), found: String(columns.length) });
  }
  const count = columns.length ? columns[0].length : 0;
  let mapIndex: number | undefined;
  let maxLogPosterior: number | undefined;
  if (options.logPosterior) {
    if (options.logPosterior.length !== count) {
      throw new CandelaError({ code: 'output.column_length', path: 'log_posterior', message: `${options.logPosterior.length} log posteriors for ${count} samples`, expected: String(count), found: String(options.logPosterior.length) });
    }
    for (let i = 0; i < count; i++) {
      const value = options.logPosterior[i];
      const usable = Number.isFinite(value) && (!options.weights || options.weights[i] > 0);
      if (usable && (maxLogPosterior === undefined || value > maxLogPosterior)) {
        maxLogPosterior = value;
        mapIndex = i;
      }
    }
  }
  const derived = new Set(options.derived ?? []);
  const parameters = columns.map((column, index) => {
    const name = names[index];
    const stats = sampleStatistics(column, { weights: options.weights, mapIndex, label: name });
    const diagnostics = options.diagnostics?.[name];
    return { name, stats, ...(diagnostics ? { diagnostics } : {}), ...(derived.has(name) ? { derived: true } : {}) };
  });
  return {
    ...(options.title !== undefined ? { title: options.title } : {}),
    sampleCount: count,
    parameters,
    correlationNames: [...names],
    correlation: weightedCorrelationMatrix(columns, options.weights, names),
    ...(maxLogPosterior !== undefined ? { maxLogPosterior } : {}),
  };
}
