import {
  CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES, baoDistanceRatios, cosmologyParametersFromValues, createCosmology,
  dragSoundHorizonFitMpc, type BaoDistanceKind,
} from '../../cosmology/index.js';
import type { ParameterValues } from '../../likelihood/index.js';
import { quantileOfDraws } from '../../math/index.js';
import type { ProbeDiagram, ProbeModel } from '../probeDefinition.js';
import type { BaoRuler } from './createBaoTerm.js';
import type { BaoTable } from './readBaoTable.js';

/** Omega_m of the flat LambdaCDM reference the BAO figure divides by (common practice: a round fiducial). */
export const BAO_REFERENCE_OMEGA_M = 0.3;
/** Redshifts on the model curves. */
const CURVE_POINTS = 60;

const GROUP_LABELS: Record<BaoDistanceKind, string> = {
  transverse_comoving: 'D_M / r_d', hubble: 'D_H / r_d', volume_averaged: 'D_V / r_d', angular_diameter: 'D_A / r_d',
};

/** r_d (Mpc) and the cosmology at p, or null when p is unphysical. */
function rulerAndCosmology(p: ParameterValues, ruler: BaoRuler, model: ProbeModel, maxRedshift: number) {
  const family = { darkEnergy: model.darkEnergy, flat: model.flat, cmbTemperatureK: CMB_TEMPERATURE_K, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES };
  const parameters = cosmologyParametersFromValues(family, p, model.referenceH0KmPerSPerMpc);
  const outcome = createCosmology(parameters, { maxRedshift });
  if (!outcome.ok) return null;
  const h = parameters.h0KmPerSPerMpc / 100;
  const omegaMatterH2 = p.omega_m * h * h;
  if (ruler === 'computed' && !(p.omega_b_h2 > 0 && p.omega_b_h2 < omegaMatterH2)) return null; // the fit formula would throw
  const rulerMpc = ruler === 'free' ? p.h_ruler / h : dragSoundHorizonFitMpc(omegaMatterH2, p.omega_b_h2, 0);
  return rulerMpc > 0 ? { rulerMpc, cosmology: outcome.cosmology, h } : null;
}

/**
 * The BAO figure's numbers: every measured D_X/r_d and the fitted D_X/r_d
 * divided by the same ratio in a flat LambdaCDM reference (Omega_m = 0.3,
 * radiation on) whose r_d is the best fit's, so that the curves show the
 * shape the data prefer and every quantity sits near 1. The 68% band is the
 * 16th-84th percentile of the draws at each redshift.
 * Cost: one distance sweep per draw and quantity.
 */
export function baoDiagram(table: BaoTable, ruler: BaoRuler, model: ProbeModel, best: ParameterValues, draws: readonly ParameterValues[]): ProbeDiagram | null {
  const zMax = Math.max(...table.redshifts) * 1.08;
  const fitted = rulerAndCosmology(best, ruler, model, zMax);
  if (!fitted) return null;
  const reference = createCosmology({ darkEnergy: 'lambda', flat: true, omegaMatter: BAO_REFERENCE_OMEGA_M, h0KmPerSPerMpc: fitted.h * 100, cmbTemperatureK: CMB_TEMPERATURE_K }, { maxRedshift: zMax });
  if (!reference.ok) return null;
  const grid = Float64Array.from({ length: CURVE_POINTS }, (_, i) => 0.02 + ((zMax - 0.02) * i) / (CURVE_POINTS - 1));
  const kinds = [...new Set(table.kinds)];
  const groups = kinds.map((kind) => {
    const rows = table.kinds.flatMap((k, i) => (k === kind ? [i] : []));
    const rowZ = Float64Array.from(rows, (i) => table.redshifts[i]);
    const same = (count: number) => new Array<BaoDistanceKind>(count).fill(kind);
    const referenceAtRows = baoDistanceRatios(reference.cosmology, rowZ, same(rows.length), fitted.rulerMpc);
    const referenceOnGrid = baoDistanceRatios(reference.cosmology, grid, same(grid.length), fitted.rulerMpc);
    const curveAt = (p: ParameterValues): Float64Array | null => {
      const state = rulerAndCosmology(p, ruler, model, zMax);
      if (!state) return null;
      const values = baoDistanceRatios(state.cosmology, grid, same(grid.length), state.rulerMpc);
      for (let i = 0; i < grid.length; i++) values[i] /= referenceOnGrid[i];
      return values;
    };
    const bestCurve = curveAt(best) ?? new Float64Array(grid.length);
    const drawn = draws.map(curveAt).filter((curve): curve is Float64Array => curve !== null);
    const band = (q: number) => Array.from(grid, (_, i) => (drawn.length > 1 ? quantileOfDraws(Float64Array.from(drawn, (curve) => curve[i]), q) : bestCurve[i]));
    return {
      label: GROUP_LABELS[kind],
      points: {
        x: Array.from(rowZ),
        y: rows.map((row, j) => table.values[row] / referenceAtRows[j]),
        error: rows.map((row, j) => Math.sqrt(table.covariance[row * table.values.length + row]) / referenceAtRows[j]),
      },
      curve: { x: Array.from(grid), best: Array.from(bestCurve), low68: band(0.16), high68: band(0.84) },
    };
  });
  return {
    title: 'BAO distances over a flat ΛCDM reference, with the best fit and its 68% band',
    xLabel: 'redshift z',
    yLabel: 'ratio to the reference',
    referenceLabel: `flat ΛCDM, Ωm = ${BAO_REFERENCE_OMEGA_M}, best-fit r_d`,
    groups,
  };
}
