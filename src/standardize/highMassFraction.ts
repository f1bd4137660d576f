/**
 * The host-galaxy mass step: Type Ia supernovae in hosts more massive than
 * about 10^10 M_sun are brighter after stretch and colour corrections
 * (Kelly et al. 2010, ApJ 715, 743; Sullivan et al. 2010, MNRAS 406, 782).
 * The fraction of a supernova assigned to the high-mass side is either a
 * sharp step or a logistic function of the host log-mass.
 */

/** Configuration of the host-mass step. */
export interface HostMassStep {
  /** When false the step term is zero for every supernova. */
  enabled: boolean;
  /** Split in log10(M / M_sun), typically 10. */
  splitLogMass: number;
  /** `sharp`: Heaviside step; `logistic`: smooth step of width `widthDex`. */
  shape: 'sharp' | 'logistic';
  /** Width of the logistic step, dex (ignored for `sharp`; <= 0 behaves as `sharp`). */
  widthDex: number;
}

/**
 * Weight of the high-mass side, in [0, 1]. Sharp: 1 above the split, 0 below,
 * exactly 0.5 at the split. Logistic: 1 / (1 + exp(-(m - split) / width)).
 * An unknown mass (NaN) gives 0.5, so the step term vanishes for it.
 * Cost O(1).
 * @param logMass host log10(M / M_sun), NaN when unknown.
 * @param step the step's shape.
 * @example highMassFraction(10.5, { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0 }) // 1
 * @example highMassFraction(10, { enabled: true, splitLogMass: 10, shape: 'logistic', widthDex: 0.1 }) // 0.5
 */
export function highMassFraction(logMass: number, step: HostMassStep): number {
  if (Number.isNaN(logMass)) return 0.5;
  const offset = logMass - step.splitLogMass;
  if (step.shape === 'logistic' && step.widthDex > 0) return 1 / (1 + Math.exp(-offset / step.widthDex));
  return offset > 0 ? 1 : offset < 0 ? 0 : 0.5;
}

/**
 * {@link highMassFraction} for every supernova; all 0.5 when the table has no
 * host masses. Cost O(N).
 * @param hostLogMass host log10(M / M_sun) per supernova, or undefined.
 * @param count number of supernovae N.
 * @param step the step's shape.
 * @param out length-N output, returned.
 * @example highMassFractions(Float64Array.of(9, NaN, 11), 3, sharpStep, new Float64Array(3)) // [0, 0.5, 1]
 */
export function highMassFractions(hostLogMass: Float64Array | undefined, count: number, step: HostMassStep, out: Float64Array): Float64Array {
  for (let i = 0; i < count; i++) out[i] = hostLogMass ? highMassFraction(hostLogMass[i], step) : 0.5;
  return out;
}
