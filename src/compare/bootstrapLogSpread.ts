import { createRandomStream, sampleVarianceOf } from '../math/index.js';

/**
 * Bootstrap standard deviation (Efron 1979, Ann. Stat. 7, 1) of the natural
 * log of a statistic of n draws: `replicates` resamples of n indices drawn
 * uniformly with replacement from a seeded stream, the statistic evaluated on
 * each, and the (n - 1)-normalized spread of its log. Replicates where the
 * statistic is not positive are skipped. Private helper of the compare layer.
 *
 * Cost: replicates x (n draws + one statistic evaluation).
 */
export function bootstrapLogSpread(count: number, replicates: number, seed: string, statistic: (indices: Int32Array) => number): { spread: number; used: number } {
  const random = createRandomStream(seed);
  const indices = new Int32Array(count);
  const logs: number[] = [];
  for (let r = 0; r < replicates; r++) {
    for (let m = 0; m < count; m++) indices[m] = random.integer(count);
    const value = statistic(indices);
    if (value > 0 && Number.isFinite(value)) logs.push(Math.log(value));
  }
  if (logs.length < 2) return { spread: Infinity, used: logs.length };
  return { spread: Math.sqrt(sampleVarianceOf(logs)), used: logs.length };
}
