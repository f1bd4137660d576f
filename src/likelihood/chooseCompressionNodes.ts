import type { Cosmology } from '../cosmology/index.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { barycentricRow, chebyshevNodes, chebyshevTailSize } from './chebyshevInterpolation.js';
import type { SupernovaModel } from './supernovaModel.js';
import type { Whitener } from './whitener.js';

/** Candidate node counts K, tried in order until the error bound is met. */
const NODE_COUNTS = [12, 16, 20, 24, 32, 40, 48, 64, 80, 96];

/** Outcome of {@link chooseCompressionNodes}. */
export type CompressionChoice =
  | { ok: true; nodeCount: number; lowerLog: number; upperLog: number; chiSquareBound: number; maxErrorMag: number; referenceCount: number; referenceTail: number; referencePoint: ParameterValues }
  | { ok: false; reason: string };

/**
 * Reference cosmologies spanning a wide prior box (one-at-a-time extremes
 * around omega_m = 0.3, omega_de = 0.7, w0 = -1, wa = 0, plus the two
 * corners); fixed parameters keep their fixed values. Unphysical points are
 * skipped by the caller.
 */
function referencePoints(model: SupernovaModel): ParameterValues[] {
  const fixed = model.options.fixed ?? {};
  const { readsOmegaDarkEnergy, readsW0, readsWa } = model.names;
  const axes: [string, boolean, number, number, number][] = [
    ['omega_m', true, 0.3, 0.05, 1.0],
    ['omega_de', readsOmegaDarkEnergy, 0.7, 0, 1.2],
    ['w0', readsW0, -1, -2, -0.4],
    ['wa', readsWa, 0, -2, 1],
  ];
  const center: Record<string, number> = { h0: fixed.h0 ?? 70 };
  for (const [name, used, middle] of axes) if (used) center[name] = fixed[name] ?? middle;
  const points: Record<string, number>[] = [center];
  const low: Record<string, number> = { ...center };
  const high: Record<string, number> = { ...center };
  for (const [name, used, , lower, upper] of axes) {
    if (!used || name in fixed) continue;
    points.push({ ...center, [name]: lower }, { ...center, [name]: upper });
    low[name] = lower;
    high[name] = upper;
  }
  points.push(low, high);
  return points;
}

/**
 * Chooses the number K of Chebyshev nodes in x = ln(1+z) for the compressed
 * path: the smallest K for which, at every reference cosmology, the
 * interpolated smooth part s(z) = 5 log10(D_M H0/c / z) differs from the
 * exact one by a vector eps with
 *
 *   2 sqrt(N) |eps|_C + |eps|_C^2 <= tolerance,   |eps|_C = |L^-1 eps|,
 *
 * the Cauchy-Schwarz bound on |delta chi^2| = |2 r^T C^-1 eps + eps^T C^-1 eps|
 * for a residual with chi^2 = r^T C^-1 r of order N (a good fit).
 * Cost: per reference N distances + per K and reference O(N K) + one whitening (N^2/2 dense).
 * @param model the shared supernova model (flow redshifts)
 * @param whitener factorized covariance of the compressed path
 * @param tolerance target for |delta chi^2|
 */
export function chooseCompressionNodes(model: SupernovaModel, whitener: Whitener, tolerance: number): CompressionChoice {
  const flowRows = model.flowRows;
  const flowCount = flowRows.length;
  const n = model.count;
  const redshift = model.options.table.redshift;
  if (flowCount < 2 || !(model.maxFlowRedshift > model.minFlowRedshift)) return { ok: false, reason: 'fewer than two distinct Hubble-flow redshifts' };
  const lowerLog = Math.log1p(model.minFlowRedshift);
  const upperLog = Math.log1p(model.maxFlowRedshift);
  const sorted = Float64Array.from(flowRows, (row) => redshift[row]);
  const logZ = Float64Array.from(sorted, (z) => 5 * Math.log10(z));
  const references: { point: ParameterValues; cosmology: Cosmology; exact: Float64Array }[] = [];
  for (const point of referencePoints(model)) {
    const outcome = model.cosmologyAt(point);
    if (!outcome.ok) continue;
    const exact = new Float64Array(flowCount);
    outcome.cosmology.transverseComovingDistancesHubbleUnits(sorted, exact);
    if (!exact.every((d) => d > 0)) continue;
    for (let k = 0; k < flowCount; k++) exact[k] = 5 * Math.log10(exact[k]) - logZ[k];
    references.push({ point, cosmology: outcome.cosmology, exact });
  }
  if (references.length === 0) return { ok: false, reason: 'no reference cosmology is physical' };
  const error = new Float64Array(n);
  for (const nodeCount of NODE_COUNTS) {
    if (nodeCount + 6 > n) break;
    const { nodes, weights } = chebyshevNodes(nodeCount, lowerLog, upperLog);
    const rows = new Float64Array(flowCount * nodeCount);
    const row = new Float64Array(nodeCount);
    for (let k = 0; k < flowCount; k++) {
      barycentricRow(Math.log1p(sorted[k]), nodes, weights, row);
      rows.set(row, k * nodeCount);
    }
    const nodeRedshifts = Float64Array.from(nodes, (x) => Math.min(Math.expm1(x), model.maxFlowRedshift));
    const nodeValues = new Float64Array(nodeCount);
    let worstBound = 0;
    let worstError = 0;
    let worstTail = 0;
    for (const { cosmology, exact } of references) {
      cosmology.transverseComovingDistancesHubbleUnits(nodeRedshifts, nodeValues);
      for (let j = 0; j < nodeCount; j++) nodeValues[j] = 5 * Math.log10(nodeValues[j] / nodeRedshifts[j]);
      worstTail = Math.max(worstTail, chebyshevTailSize(nodeValues));
      error.fill(0);
      for (let k = 0; k < flowCount; k++) {
        let value = 0;
        for (let j = 0; j < nodeCount; j++) value += rows[k * nodeCount + j] * nodeValues[j];
        error[flowRows[k]] = value - exact[k];
        worstError = Math.max(worstError, Math.abs(value - exact[k]));
      }
      whitener.whitenInPlace(error);
      let norm = 0;
      for (let i = 0; i < n; i++) norm += error[i] * error[i];
      norm = Math.sqrt(norm);
      worstBound = Math.max(worstBound, 2 * Math.sqrt(n) * norm + norm * norm);
    }
    if (worstBound <= tolerance) {
      return {
        ok: true, nodeCount, lowerLog, upperLog, chiSquareBound: worstBound, maxErrorMag: worstError,
        referenceCount: references.length, referenceTail: worstTail, referencePoint: references[0].point,
      };
    }
  }
  return { ok: false, reason: `no node count up to ${NODE_COUNTS[NODE_COUNTS.length - 1]} (and below N - 6) meets |delta chi^2| <= ${tolerance}` };
}
