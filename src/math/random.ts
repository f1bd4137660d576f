import seedrandom from 'seedrandom';

/**
 * A seeded random stream. All randomness in candela comes from these streams,
 * created from a seed string, never from Math.random. Built on seedrandom's
 * Alea generator (Baagoe 2010), whose state can be saved and restored exactly,
 * which checkpoints need.
 */
export interface RandomStream {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal deviate (Marsaglia & Bray 1964 polar method; no cached spare, so state is one generator state). */
  normal(): number;
  /** Uniform integer in [0, n). */
  integer(n: number): number;
  /** Opaque generator state for checkpoints (JSON-serializable). */
  state(): RandomState;
}

/** Serializable generator state. */
export type RandomState = { c: number; s0: number; s1: number; s2: number };

/**
 * Creates a stream from a seed string, or resumes one from a saved state.
 * @example createRandomStream('42').uniform() // same value on every machine
 */
export function createRandomStream(seed: string, resumeFrom?: RandomState): RandomStream {
  const generator = resumeFrom
    ? seedrandom.alea('', { state: resumeFrom as unknown as true })
    : seedrandom.alea(seed, { state: true });
  const uniform = (): number => generator();
  return {
    uniform,
    normal(): number {
      for (;;) {
        const u = 2 * uniform() - 1;
        const v = 2 * uniform() - 1;
        const s = u * u + v * v;
        if (s > 0 && s < 1) return u * Math.sqrt((-2 * Math.log(s)) / s);
      }
    },
    integer(n: number): number {
      return Math.floor(uniform() * n);
    },
    state(): RandomState {
      return (generator as unknown as { state(): RandomState }).state();
    },
  };
}

/**
 * Derives a child seed string from a parent seed and a label path, so that
 * independent streams (per ensemble, per mock, ...) never share a sequence.
 * @example deriveSeed('2026', 'ensemble', 3) // '2026/ensemble/3'
 */
export function deriveSeed(parent: string | number, ...labels: Array<string | number>): string {
  return [String(parent), ...labels.map(String)].join('/');
}
