import { runWarning, type RunWarning } from './runWarning.js';
import type { ParameterSummary } from './runSummary.js';

/** Derived quantities that scale with H0 whatever the model (the age in Gyr is proportional to 1/H0). */
const H0_DEPENDENT_ALWAYS = ['age_gyr'];
/** Derived quantities that depend on H0 only through the radiation density Omega_r h^2 = const (with radiation on). */
const H0_DEPENDENT_WITH_RADIATION = ['z_accel', 'q0', 'omega_k', 'omega_de'];

/** What fixedParameterNotes needs to know about a run. */
export interface FixedParameterFacts {
  /** Sampled parameter names. */
  sampled: readonly string[];
  /** Fixed parameter values of the run. */
  fixed: Readonly<Record<string, number>>;
  /** reference_h0 of the configuration, km/s/Mpc (used when h0 is neither sampled nor fixed). */
  referenceH0KmPerSPerMpc: number;
  /** Whether the model includes radiation. */
  radiation: boolean;
}

/**
 * Marks the derived quantities computed at a fixed H0 (when h0 is not
 * sampled): the age always, and with radiation on also z_accel, q0, omega_k
 * and omega_de, since Omega_r follows from the fixed T_CMB and h. Sets each
 * one's `note` (printed beside its value) and returns one warning naming them.
 * Cost: O(parameters).
 * @param parameters the summary rows (changed in place).
 * @param facts the run's sampled and fixed parameters, reference H0 and radiation switch.
 * @returns the warning, or null when nothing depends on a fixed H0.
 * @example fixedParameterNotes(rows, { sampled: ['omega_m'], fixed: {}, referenceH0KmPerSPerMpc: 70, radiation: false })?.parameter // 'age_gyr'
 */
export function fixedParameterNotes(parameters: ParameterSummary[], facts: FixedParameterFacts): RunWarning | null {
  if (facts.sampled.includes('h0')) return null;
  const h0 = facts.fixed.h0 ?? facts.referenceH0KmPerSPerMpc;
  const dependent = [...H0_DEPENDENT_ALWAYS, ...(facts.radiation ? H0_DEPENDENT_WITH_RADIATION : [])];
  const affected = parameters.filter((row) => dependent.includes(row.name));
  if (affected.length === 0) return null;
  const note = `at fixed H0 = ${h0} km/s/Mpc`;
  for (const row of affected) row.note = note;
  const names = affected.map((row) => row.name);
  return runWarning('fixed_parameter', names.length === 1 ? names[0] : null,
    `${names.join(', ')} ${names.length === 1 ? 'is' : 'are'} computed ${note} (h0 is not sampled): ${names.length === 1 ? 'its' : 'their'} uncertainty leaves out that of H0`,
    { h0_km_s_mpc: h0 });
}
