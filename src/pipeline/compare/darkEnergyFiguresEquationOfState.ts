import { darkEnergyEvolution, type DarkEnergyLaw } from '../../cosmology/index.js';
import type { BandFigureInput } from '../../output/index.js';
import type { AnalyzedRun } from './compareInputs.js';
import { curveBands, equalWeightRows } from '../../math/index.js';

/** Posterior draws behind each w(z) band (the 2.5% and 97.5% points then carry about 25 draws each; common practice). */
export const EQUATION_OF_STATE_DRAWS = 1000;
/** Redshifts of the w(z) curve, evenly spaced from 0 to the data's largest redshift. */
export const EQUATION_OF_STATE_POINTS = 101;

/**
 * The dark-energy equation of state reconstructed from a run's chains:
 * w(z) = w0 (wCDM) or w0 + wa z / (1 + z) (Chevallier & Polarski 2001;
 * Linder 2003), evaluated for equally weighted posterior draws on
 * 0 <= z <= zMax, reduced to the median and the 68% and 95% bands, with
 * w = -1 (a cosmological constant) as the dashed reference. Runs whose model
 * has no free w0 give null.
 *
 * Cost: O(draws x points).
 * @param analyzed the run and its analysis.
 * @param zMaxRedshift largest redshift of the curve (the data's largest), > 0.
 * @param seed seed of the draw selection.
 * @returns the band figure's input, or null for a run without w0.
 * @throws CandelaError from the draw selection.
 * @example equationOfStateBand(analyzed, 2.26, 'figures')?.referenceLine // { y: -1, label: 'w = -1 (cosmological constant)' }
 */
export function equationOfStateBand(analyzed: AnalyzedRun, zMaxRedshift: number, seed: string): BandFigureInput | null {
  const { run, analysis } = analyzed;
  const law = run.record.model.dark_energy as DarkEnergyLaw;
  if (law === 'lambda' || !analysis.sampled.includes('w0')) return null;
  const rows = equalWeightRows(analyzed.analysis.keptRows, analyzed.analysis.keptWeights, EQUATION_OF_STATE_DRAWS, seed);
  const z = Float64Array.from({ length: EQUATION_OF_STATE_POINTS }, (_, i) => (zMaxRedshift * i) / (EQUATION_OF_STATE_POINTS - 1));
  const w0Column = run.chains.columns.w0;
  const waColumn = run.chains.columns.wa;
  const fixedWa = run.record.parameters.fixed.wa ?? 0;
  const curves = Array.from(rows, (row) => {
    const law0 = darkEnergyEvolution(law, w0Column[row], waColumn ? waColumn[row] : fixedWa);
    return Float64Array.from(z, (redshift) => law0.equationOfState(redshift));
  });
  const bands = curveBands(curves, z.length);
  return {
    x: z, ...bands,
    referenceLine: { y: -1, label: 'w = -1 (cosmological constant)' },
    xLabel: 'redshift z', yLabel: 'w(z)', medianLabel: `${run.record.model.label}: posterior median`,
  };
}
