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
