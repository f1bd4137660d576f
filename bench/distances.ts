/**
 * Distance benchmark: the distance modulus at 2,000 sorted supernova-like
 * redshifts in flat w0waCDM, by candela's cumulative vectorized path
 * (createCosmology + transverseComovingDistancesHubbleUnits, what one
 * likelihood call needs) against a naive independent integrator: composite
 * Simpson in z from 0 to each redshift, doubling the intervals until two
 * successive estimates agree to 1e-12 relative (Richardson: the error of the
 * finer one is then ~1e-13). Both run in the same process, same model.
 */
import { createCosmology } from '../src/cosmology/index.js';
import { timeCalls } from './suite.js';
import type { BenchSuite } from './suite.js';

/** Number of redshifts of the benchmark. */
export const COUNT = 2000;
const MODEL = { omegaMatter: 0.3, w0: -0.9, wa: 0.3, h0KmPerSPerMpc: 70 };
/** Simpson stops when successive doublings agree to this, relative. */
const SIMPSON_AGREEMENT = 1e-12;
const SPEED_OF_LIGHT_KM_PER_S = 299792.458;

/** Redshifts 0.01 .. 2.3, denser at low z like real compilations, sorted. */
export function supernovaRedshifts(): Float64Array {
  return Float64Array.from({ length: COUNT }, (_, i) => 0.01 + 2.29 * Math.pow(i / (COUNT - 1), 1.5));
}

/** E(z) of flat w0waCDM written out independently of src/ (Chevallier & Polarski 2001; Linder 2003). */
function inverseExpansionRate(z: number): number {
  const { omegaMatter, w0, wa } = MODEL;
  const u = 1 + z;
  const darkEnergy = (1 - omegaMatter) * Math.pow(u, 3 * (1 + w0 + wa)) * Math.exp((-3 * wa * z) / u);
  return 1 / Math.sqrt(omegaMatter * u * u * u + darkEnergy);
}

/** int_0^z dz'/E by composite Simpson with interval doubling (reusing the previous points). */
function simpsonComoving(z: number): number {
  let intervals = 8;
  let h = z / intervals;
  let endpoints = inverseExpansionRate(0) + inverseExpansionRate(z);
  let odd = 0;
  let even = 0;
  for (let i = 1; i < intervals; i++) (i % 2 ? (odd += inverseExpansionRate(i * h)) : (even += inverseExpansionRate(i * h)));
  let estimate = (h / 3) * (endpoints + 4 * odd + 2 * even);
  for (;;) {
    even += odd;
    intervals *= 2;
    h = z / intervals;
    odd = 0;
    for (let i = 1; i < intervals; i += 2) odd += inverseExpansionRate(i * h);
    const next = (h / 3) * (endpoints + 4 * odd + 2 * even);
    if (Math.abs(next - estimate) <= SIMPSON_AGREEMENT * Math.abs(next) || intervals > 1 << 22) return next;
    estimate = next;
  }
}

/** The moduli at sorted z into out, candela's vectorized path (mag). */
export function vectorizedModuli(z: Float64Array, out: Float64Array): void {
  const outcome = createCosmology({ darkEnergy: 'cpl', flat: true, ...MODEL }, { maxRedshift: z[z.length - 1] });
  if (!outcome.ok) throw new Error(outcome.reason);
  outcome.cosmology.transverseComovingDistancesHubbleUnits(z, out);
  const offset = 5 * Math.log10(SPEED_OF_LIGHT_KM_PER_S / MODEL.h0KmPerSPerMpc) + 25;
  for (let i = 0; i < z.length; i++) out[i] = 5 * Math.log10((1 + z[i]) * out[i]) + offset;
}

/** The moduli at z into out, the naive independent Simpson path (mag). */
export function naiveModuli(z: Float64Array, out: Float64Array): void {
  const hubbleDistanceMpc = SPEED_OF_LIGHT_KM_PER_S / MODEL.h0KmPerSPerMpc;
  for (let i = 0; i < z.length; i++) out[i] = 5 * Math.log10((1 + z[i]) * hubbleDistanceMpc * simpsonComoving(z[i])) + 25;
}

export const suite: BenchSuite = {
  name: 'distances',
  async run() {
    const z = supernovaRedshifts();
    const fast = new Float64Array(COUNT);
    const naive = new Float64Array(COUNT);
    const vectorized = timeCalls(() => vectorizedModuli(z, fast), 50, 200);
    const simpson = timeCalls(() => naiveModuli(z, naive), 2, 7);
    let maxDeltaMu = 0;
    for (let i = 0; i < COUNT; i++) maxDeltaMu = Math.max(maxDeltaMu, Math.abs(fast[i] - naive[i]));
    return {
      model: 'flat w0waCDM, Omega_m = 0.3, w0 = -0.9, wa = 0.3, H0 = 70, no radiation',
      redshift_count: COUNT,
      redshift_range: `${z[0]}..${z[COUNT - 1]}`,
      vectorized_ms_per_evaluation: vectorized.medianMs,
      vectorized_min_ms: vectorized.minMs,
      vectorized_repeats: vectorized.repeats,
      naive_simpson_ms_per_evaluation: simpson.medianMs,
      naive_simpson_min_ms: simpson.minMs,
      naive_simpson_repeats: simpson.repeats,
      speedup_naive_over_vectorized: simpson.medianMs / vectorized.medianMs,
      max_abs_delta_mu_mag: maxDeltaMu,
    };
  },
};
