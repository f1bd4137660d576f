import { createRandomStream } from '../../../src/math/index.js';

// Fixed weighted sample of test/fixtures/output/make_summary_reference.R (section 1).
export const VALUES = [2.1, -0.4, 3.3, 0.7, 1.5, 2.8, -1.2, 0.9];
export const OTHER = [1.0, 0.2, 2.9, 0.1, 1.7, 2.0, -0.5, 1.1];
export const WEIGHTS = [1, 3, 0, 2, 1, 4, 2, 1];

/** count draws of a unit normal from the seeded stream `seed`. */
export function normalSample(seed: string, count: number): Float64Array {
  const stream = createRandomStream(seed);
  return Float64Array.from({ length: count }, () => stream.normal());
}
