import { CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES, cosmologyParametersFromValues, createCosmology, type DarkEnergyLaw } from '../../cosmology/index.js';
import { isCandelaError } from '../../errors.js';
import type { DarkEnergyBand, DarkEnergyBandsInput } from '../../output/index.js';
import type { BuiltModel } from '../run/buildModel.js';
import { binResiduals } from '../report/buildRunOutputs.js';
import type { AnalyzedRun } from './compareInputs.js';
import type { RebuiltRunModel } from './compareRebuildModel.js';
import { curveBands, equalWeightRows, interpolateLogSpaced, logSpacedGrid } from '../../math/index.js';

/** Posterior draws behind each model's distance-modulus band (68% band from ~300 draws: ~2% noise on its edges; common practice). */
export const DISTANCE_BAND_DRAWS = 300;
/** Points of each curve, log-spaced over the data's redshift range. */
export const DISTANCE_CURVE_POINTS = 100;
/** Redshift bins of the data residuals, equal in ln z (as in the Hubble figure). */
export const DISTANCE_RESIDUAL_BINS = 12;
/** Smallest redshift of the curves (the data may include z = 0 calibrators). */
const MINIMUM_CURVE_REDSHIFT = 1e-3;

interface MagnitudeCurve {
  /** Apparent standardized magnitude m(z) = mu(z) + M at the grid, mag. */
  (values: Record<string, number>, grid: Float64Array, flatLambda?: boolean): Float64Array | null;
}

/** m(z) = mu(z; cosmology, H0 of the likelihood) + M of a model at parameter values (M sampled, or its conditional best fit). */
function magnitudeCurve(model: BuiltModel): MagnitudeCurve {
  let nominalH0: number | null = null;
  return (values, grid, flatLambda = false) => {
    let absoluteMagnitude: number;
    if (!model.supernovae) return null; // probes alone: no magnitudes to draw
    const supernovae = model.supernovae;
    try {
      absoluteMagnitude = model.parameterNames.includes('abs_mag') ? values.abs_mag : supernovae.bestFitOffset(values);
      if (!model.parameterNames.includes('h0')) nominalH0 ??= supernovae.hubbleDiagram(values).h0KmPerSPerMpc;
    } catch (error) {
      if (isCandelaError(error)) return null;
      throw error;
    }
    const spec = model.cosmologyModel;
    const law: DarkEnergyLaw = flatLambda ? 'lambda' : spec.darkEnergy;
    const family = { darkEnergy: law, flat: flatLambda || spec.flat, cmbTemperatureK: spec.radiation ? CMB_TEMPERATURE_K : 0, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES };
    const h0 = model.parameterNames.includes('h0') ? values.h0 : (nominalH0 as number);
    const outcome = createCosmology(cosmologyParametersFromValues(family, { ...values, h0 }, h0), { maxRedshift: grid[grid.length - 1] });
    if (!outcome.ok || !Number.isFinite(absoluteMagnitude)) return null;
    const out = outcome.cosmology.distanceModuliMag(grid);
    for (let i = 0; i < out.length; i++) out[i] += absoluteMagnitude;
    return out;
  };
}

function valuesAt(model: BuiltModel, parameters: Record<string, number>): Record<string, number> {
  return { ...model.posterior.values(Float64Array.from(model.parameterNames, (name) => parameters[name])) };
}

/**
 * The distance-modulus difference of each model to a reference flat
 * LambdaCDM, the figure dark-energy comparisons show: the reference is the
 * base run's best fit when the base is flat LambdaCDM, else flat LambdaCDM
 * with the base's best-fit omega_m; its absolute magnitude is the base
 * likelihood's best-fitting one for that cosmology. For each model with a
 * rebuilt likelihood, equally weighted posterior draws give
 * Delta mu(z) = [mu(z; draw) + M(draw)] - [mu_ref(z) + M_ref] (M sampled, or
 * the draw's conditional best fit, so that the offset degeneracy cancels),
 * reduced to a median and 68% band over the data's redshift range. The
 * base run's Hubble-diagram residuals, moved to the reference, are binned
 * in ln z with inverse-variance weights (diagonal errors only).
 *
 * Cost: DISTANCE_BAND_DRAWS likelihood evaluations and distance curves per model.
 * @param runs the analyzed runs.
 * @param rebuilt each run's rebuilt model, or null (that run is left out).
 * @param baseIndex index of the base run.
 * @param seed seed of the draw selection.
 * @returns the figure input and the reference's description, or null without a rebuilt base model.
 * @throws CandelaError from the draw selection.
 * @example distanceDifferenceBands(runs, rebuilt, 0, 'figures')?.referenceLabel
 */
export function distanceDifferenceBands(runs: readonly AnalyzedRun[], rebuilt: ReadonlyArray<RebuiltRunModel | null>, baseIndex: number, seed: string): { input: DarkEnergyBandsInput; referenceLabel: string } | null {
  const base = runs[baseIndex];
  const baseModel = rebuilt[baseIndex]?.model;
  if (!baseModel) return null;
  const record = base.run.record;
  const [zLow, zHigh] = record.data.redshift_range;
  const zMin = Math.max(MINIMUM_CURVE_REDSHIFT, zLow);
  const grid = logSpacedGrid(zMin, zHigh, DISTANCE_CURVE_POINTS);
  const baseCurve = magnitudeCurve(baseModel);
  const bestValues = valuesAt(baseModel, record.best_fit.parameters);
  const isFlatLambda = record.model.dark_energy === 'lambda' && record.model.curvature === 'flat';
  const referenceValues = { ...bestValues, w0: -1, wa: 0, ...(record.model.curvature === 'flat' ? {} : { omega_de: 1 - bestValues.omega_m }) };
  const reference = baseCurve(referenceValues, grid, true);
  if (!reference) return null;
  const referenceLabel = isFlatLambda
    ? `${record.model.label} best fit (Omega_m = ${bestValues.omega_m.toFixed(3)})`
    : `flat LambdaCDM with the Omega_m of ${record.model.label} (${bestValues.omega_m.toFixed(3)})`;
  const bands: DarkEnergyBand[] = [];
  runs.forEach((analyzed, k) => {
    const model = rebuilt[k]?.model;
    if (!model) return;
    const curveOf = magnitudeCurve(model);
    const curves: Float64Array[] = [];
    for (const row of equalWeightRows(analyzed.analysis.keptRows, analyzed.analysis.keptWeights, DISTANCE_BAND_DRAWS, seed)) {
      const parameters = Object.fromEntries(model.parameterNames.map((name) => [name, analyzed.run.chains.columns[name][row]]));
      const curve = curveOf(valuesAt(model, parameters), grid);
      if (!curve) continue;
      for (let i = 0; i < curve.length; i++) curve[i] -= reference[i];
      curves.push(curve);
    }
    if (curves.length === 0) return;
    const { median, low68, high68 } = curveBands(curves, grid.length);
    bands.push({ label: analyzed.run.record.model.label, median, low68, high68 });
  });
  const input: DarkEnergyBandsInput = {
    x: grid, bands, referenceLine: { y: 0, label: `reference: ${referenceLabel}` },
    xLabel: 'redshift z', yLabel: '\\Delta\\mu (mag)',
  };
  const columns = base.run.hubble?.columns;
  const bestCurve = baseCurve(bestValues, grid);
  if (columns && bestCurve) {
    const rows = columns.z.map((_, i) => i).filter((i) => columns.calibrator?.[i] !== '1');
    const z = Float64Array.from(rows, (i) => Number(columns.z[i]));
    // m_best - m_ref at each supernova, interpolated in ln z on the grid (the helio-centric term cancels in the difference).
    const difference = bestCurve.map((value, i) => value - reference[i]);
    const shift = interpolateLogSpaced(difference, zMin, zHigh, z);
    const residual = Float64Array.from(rows, (i, k) => Number(columns.residual[i]) + shift[k]);
    const error = Float64Array.from(rows, (i) => Number(columns.sigma_mu[i]));
    const binned = binResiduals(z, residual, error, DISTANCE_RESIDUAL_BINS);
    input.points = { x: binned.map((bin) => bin.z), y: binned.map((bin) => bin.mean), error: binned.map((bin) => bin.err), label: `binned data (${record.model.label} residuals)` };
  }
  return { input, referenceLabel };
}
