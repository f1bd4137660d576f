/** One benchmark suite: a file in bench/ that exports `suite`. */
export interface BenchSuite {
  /** Short name, the key of its results in out/bench.json. */
  name: string;
  /** Runs the measurements and returns flat results (numbers with units in their keys, or strings). */
  run(): Promise<Record<string, number | string>>;
}

/** Result of timing one function: the median and spread over repeats, milliseconds per call. */
export interface Timing {
  medianMs: number;
  minMs: number;
  maxMs: number;
  repeats: number;
}

/**
 * Times `action` with process.hrtime.bigint: `warmup` untimed calls (JIT),
 * then `repeats` timed calls; returns the median, minimum and maximum.
 */
export function timeCalls(action: () => unknown, warmup: number, repeats: number): Timing {
  for (let i = 0; i < warmup; i++) action();
  const samples: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const start = process.hrtime.bigint();
    action();
    samples.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  samples.sort((a, b) => a - b);
  const middle = Math.floor(samples.length / 2);
  const medianMs = samples.length % 2 ? samples[middle] : (samples[middle - 1] + samples[middle]) / 2;
  return { medianMs, minMs: samples[0], maxMs: samples[samples.length - 1], repeats };
}

/**
 * Times `action` for about `budgetMs` of wall time: one probe call (which
 * also warms up), then a warm-up of a tenth of the repeats (at most 50), then
 * as many timed repeats as fit the budget, between `minRepeats` and
 * `maxRepeats`. For calls from microseconds (thousands of repeats) to seconds
 * (a few).
 */
export function timeWithinBudget(action: () => unknown, budgetMs: number, minRepeats = 3, maxRepeats = 5000): Timing {
  const start = process.hrtime.bigint();
  action();
  const probeMs = Math.max(Number(process.hrtime.bigint() - start) / 1e6, 1e-4);
  const repeats = Math.max(minRepeats, Math.min(maxRepeats, Math.floor(budgetMs / probeMs)));
  return timeCalls(action, Math.min(50, Math.floor(repeats / 10)), repeats);
}

/** Peak resident set size of this process so far, MB (process.resourceUsage().maxRSS is in kilobytes). */
export function peakRssMb(): number {
  return process.resourceUsage().maxRSS / 1024;
}
