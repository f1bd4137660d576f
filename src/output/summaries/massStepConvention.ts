import type { ParameterSummary } from './runSummary.js';

/**
 * States the host-mass step's sign convention beside its value, in the
 * tables and the report: the Tripp-relation code (src/standardize,
 * trippCorrectedMagnitudes) adds +mass_step/2 to the standardized magnitude
 * of hosts above the split and -mass_step/2 below it, so a positive value
 * means supernovae in the more massive hosts are brighter after the stretch
 * and colour corrections (the sign of the DES-SN5YR gamma, Vincenzi et al.
 * 2024; the opposite of the JLA Delta_M, Betoule et al. 2014).
 * Cost: O(parameters).
 * @param parameters the summary rows; every `mass_step` row (also per sample, `mass_step_<sample>`) gets the note.
 * @param splitLogMass log10 of the split mass in solar masses, or undefined when unknown.
 * @returns nothing (the rows are changed in place).
 * @example massStepConvention(rows, 10) // rows' mass_step note: '> 0: hosts above 10^10 M_sun brighter'
 */
export function massStepConvention(parameters: ParameterSummary[], splitLogMass: number | undefined): void {
  const split = splitLogMass === undefined ? 'the split mass' : `10^${splitLogMass} M_sun`;
  for (const row of parameters) {
    if (row.name === 'mass_step' || row.name.startsWith('mass_step_')) row.note = `> 0: hosts above ${split} brighter`;
  }
}
