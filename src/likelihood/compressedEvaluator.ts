import { CandelaError } from '../errors.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { barycentricRow, chebyshevNodes, chebyshevTailSize } from './chebyshevInterpolation.js';
import { chooseCompressionNodes } from './chooseCompressionNodes.js';
import { compensatedDot } from './compensatedSquares.js';
import { householderReduce } from './householderLeastSquares.js';
import { createOffsetMarginal } from './marginalizeOffset.js';
import { completeEvaluation, finishEvaluation, rejectEvaluation, type SupernovaEvaluation, type SupernovaEvaluator } from './supernovaEvaluation.js';
import type { SupernovaModel } from './supernovaModel.js';
import { createWhitenerFor } from './exactEvaluator.js';

/** Exact evaluation replaces the interpolation when the top Chebyshev coefficients exceed this multiple of the largest seen at the references. */
const TAIL_GUARD_FACTOR = 10;
/** Smallest tail that triggers the guard, mag (rounding noise of 5 log10 values of order one). */
const TAIL_GUARD_FLOOR_MAG = 1e-13;

/**
 * The compressed path for a covariance fixed during the run. The model is
 * linear in q = (offset, [5 log10(c/H0) + 25 when calibrators exist], [alpha,
 * beta, mass_step for light curves], s_1..s_K), where s_k is the smooth part
 * s(z) = 5 log10(D_M H0/c / z) at K Chebyshev nodes in ln(1+z) and
 * s(z_i) = sum_k W_ik s_k is barycentric interpolation (Berrut & Trefethen
 * 2004). With the whitened design Z = L^-1 X and data e = L^-1 (b - X q_ref),
 * a Householder QR gives chi^2(q) = rho^2 + |f - R (q - q_ref)|^2 exactly,
 * so each call costs P^2/2 multiply-adds (P = K + up to 5) plus K distances.
 * The offset is the first column, so marginalizing it drops the first row:
 * chi^2_min = rho^2 + sum_{j>=1} u_j^2 and E = 1^T C^-1 1 = R_00^2.
 * Built once: N^3/3 (Cholesky) + P N^2/2 (whitening) + 2 N P^2 (QR); with a
 * diagonal-plus-modes covariance the whitening is the Woodbury operator
 * (createModesWhitener): 2.5 N K^2 + P (2 N K) instead of the N^3/3 and P N^2/2.
 * @throws CandelaError when the covariance varies, N is too small, or no K meets the tolerance
 */
export function createCompressedEvaluator(model: SupernovaModel, tolerance: number): SupernovaEvaluator {
  const n = model.count;
  const table = model.options.table;
  const names = model.names;
  const fixed = model.options.fixed ?? {};
  const fail = (message: string): never => {
    throw new CandelaError({ code: 'likelihood.compression_unavailable', path: `${model.options.name}.fastPath`, message: `compressed path unavailable: ${message}`, fix: "use fastPath 'auto', 'general' or 'diagonal'" });
  };
  if (model.covarianceVaries) fail('the covariance depends on sampled parameters (fix them, freeze alpha/beta, or turn sigma_int off)');
  const structure = model.covariance.structure;
  const whitener = createWhitenerFor(model, structure === 'dense' ? 'general' : structure);
  const covarianceInputs = new Float64Array(model.covariance.inputCount);
  model.readCovarianceInputs(fixed, covarianceInputs);
  if (structure === 'dense') model.covariance.fillDense(covarianceInputs, whitener.matrix);
  else model.covariance.fillVariances(covarianceInputs, whitener.matrix);
  const factorFailure = whitener.factorize();
  if (factorFailure) fail(factorFailure);
  const choice = chooseCompressionNodes(model, whitener, tolerance);
  if (!choice.ok) return fail(choice.reason);
  const nodeCount = choice.nodeCount;
  const { nodes, weights } = chebyshevNodes(nodeCount, choice.lowerLog, choice.upperLog);
  const nodeRedshifts = Float64Array.from(nodes, (x) => Math.min(Math.expm1(x), model.maxFlowRedshift));

  // Columns: offset, [hubble term if calibrators], [alpha, beta, [mass_step]], nodes.
  const calibrated = names.hasCalibrators;
  const lightCurveColumns = names.readsAlphaBeta ? (names.readsMassStep ? 3 : 2) : 0;
  const firstNode = 1 + (calibrated ? 1 : 0) + lightCurveColumns;
  const columns = firstNode + nodeCount;
  if (columns > n) fail(`${columns} coefficients exceed the ${n} supernovae`);
  const design = new Float64Array(n * columns);
  const base = new Float64Array(n);
  const probe = new Float64Array(n);
  const standardizeAt = (alpha: number, beta: number, step: number, out: Float64Array): void =>
    model.standardize({ alpha, beta, mass_step: step }, out);
  standardizeAt(0, 0, 0, base);
  for (let c = 0; c < lightCurveColumns; c++) {
    standardizeAt(c === 0 ? 1 : 0, c === 1 ? 1 : 0, c === 2 ? 1 : 0, probe);
    for (let i = 0; i < n; i++) design[i * columns + firstNode - lightCurveColumns + c] = base[i] - probe[i];
  }
  const row = new Float64Array(nodeCount);
  const calibratorMu = table.calibratorMu;
  for (let i = 0; i < n; i++) {
    design[i * columns] = 1;
    if (model.isCalibrator[i]) {
      base[i] -= (calibratorMu as Float64Array)[i];
      continue;
    }
    if (calibrated) design[i * columns + 1] = 1;
    base[i] -= 5 * Math.log10((1 + table.redshiftHelio[i]) * table.redshift[i]);
    barycentricRow(Math.log1p(table.redshift[i]), nodes, weights, row);
    design.set(row, i * columns + firstNode);
  }
  // Reference q: nodes at the first reference cosmology, hubble term at its H0, offset = mean remainder.
  const reference = new Float64Array(columns);
  const nodeValues = new Float64Array(nodeCount);
  const referenceCosmology = model.cosmologyAt(choice.referencePoint);
  if (!referenceCosmology.ok) return fail(referenceCosmology.reason);
  referenceCosmology.cosmology.transverseComovingDistancesHubbleUnits(nodeRedshifts, nodeValues);
  for (let j = 0; j < nodeCount; j++) reference[firstNode + j] = 5 * Math.log10(nodeValues[j] / nodeRedshifts[j]);
  if (calibrated) reference[1] = model.hubbleTerm(choice.referencePoint);
  for (let i = 0; i < n; i++) for (let c = 1; c < columns; c++) base[i] -= design[i * columns + c] * reference[c];
  reference[0] = base.reduce((sum, value) => sum + value, 0) / n;
  for (let i = 0; i < n; i++) base[i] -= reference[0];
  // Whiten the columns and the data, then reduce.
  const column = new Float64Array(n);
  const ones = new Float64Array(n);
  for (let c = 0; c < columns; c++) {
    for (let i = 0; i < n; i++) column[i] = design[i * columns + c];
    whitener.whitenInPlace(column);
    if (c === 0) ones.set(column);
    for (let i = 0; i < n; i++) design[i * columns + c] = column[i];
  }
  whitener.whitenInPlace(base);
  const reduced = householderReduce(design, n, columns, base);
  const upper = reduced.upper;
  const projected = reduced.projected;
  const residualSquare = reduced.residualSquare;
  const diagonalHead = upper[0];
  const logDeterminant = whitener.logDeterminant;
  const templateTerm = Math.log((diagonalHead * diagonalHead) / (2 * Math.PI));
  const onesPrecision = compensatedDot(ones, ones, n);

  const delta = new Float64Array(columns);
  const residual = new Float64Array(n);
  const marginal = createOffsetMarginal();
  const tailGuard = Math.max(TAIL_GUARD_FACTOR * choice.referenceTail, TAIL_GUARD_FLOOR_MAG);
  const inputs = new Float64Array(model.covariance.inputCount);

  const exact = (p: ParameterValues, out: SupernovaEvaluation): void => {
    const unphysical = model.offsetFreeResidual(p, residual);
    if (unphysical) return rejectEvaluation(out, unphysical);
    whitener.whitenInPlace(residual);
    finishEvaluation(residual, ones, onesPrecision, logDeterminant, n, names.readsAbsMag ? p.abs_mag : null, marginal, out);
  };

  return {
    path: 'compressed',
    evaluate(p, out) {
      model.readCovarianceInputs(p, inputs);
      for (let k = 0; k < inputs.length; k++) {
        if (inputs[k] !== covarianceInputs[k]) {
          return rejectEvaluation(out, `the compressed covariance was built for covariance input ${k} = ${covarianceInputs[k]}, but got ${inputs[k]} (pass only truly fixed parameters in 'fixed')`);
        }
      }
      const outcome = model.cosmologyAt(p);
      if (!outcome.ok) return rejectEvaluation(out, outcome.reason);
      outcome.cosmology.transverseComovingDistancesHubbleUnits(nodeRedshifts, nodeValues);
      for (let j = 0; j < nodeCount; j++) {
        if (!(nodeValues[j] > 0)) return exact(p, out); // the exact path names the offending redshift
        nodeValues[j] = 5 * Math.log10(nodeValues[j] / nodeRedshifts[j]);
      }
      if (chebyshevTailSize(nodeValues) > tailGuard) return exact(p, out);
      const hubble = model.hubbleTerm(p);
      let c = 1;
      if (calibrated) delta[c++] = hubble - reference[1];
      if (lightCurveColumns > 0) {
        delta[c] = p.alpha - reference[c];
        delta[c + 1] = p.beta - reference[c + 1];
        if (lightCurveColumns === 3) delta[c + 2] = p.mass_step - reference[c + 2];
      }
      for (let j = 0; j < nodeCount; j++) delta[firstNode + j] = nodeValues[j] - reference[firstNode + j];
      // u = f - R delta over rows j >= 1 (row 0 holds the offset).
      let chiSquare = residualSquare;
      let compensation = 0;
      let headFree = projected[0];
      for (let k = 1; k < columns; k++) headFree -= upper[k] * delta[k];
      for (let j = 1; j < columns; j++) {
        let u = projected[j];
        const rowStart = j * columns;
        for (let k = j; k < columns; k++) u -= upper[rowStart + k] * delta[k];
        const term = u * u;
        const next = chiSquare + term;
        compensation += chiSquare >= term ? chiSquare - next + term : term - next + chiSquare;
        chiSquare = next;
      }
      const bestOffset = reference[0] + headFree / diagonalHead;
      out.bestAbsoluteMagnitude = calibrated ? bestOffset : bestOffset - hubble;
      out.logDeterminant = logDeterminant;
      if (names.readsAbsMag) {
        const head = headFree - diagonalHead * ((calibrated ? p.abs_mag : p.abs_mag + hubble) - reference[0]);
        out.chiSquare = chiSquare + compensation + head * head;
        out.marginalizationTerm = 0;
      } else {
        out.chiSquare = chiSquare + compensation;
        out.marginalizationTerm = templateTerm;
      }
      completeEvaluation(n, out);
    },
    describe() {
      return [
        `path: compressed, covariance fixed and ${structure === 'low_rank' ? `whitened once through the Woodbury identity (diagonal + ${model.covariance.modeCount} modes)` : 'factorized once'} (N = ${n}); ${nodeCount} Chebyshev nodes in ln(1+z) on ` +
          `z = [${model.minFlowRedshift}, ${model.maxFlowRedshift}] (barycentric interpolation, Berrut & Trefethen 2004); ` +
          `${columns} coefficients, O(${columns}^2/2) multiply-adds + ${nodeCount} distances per call`,
        `compression error bound |delta chi^2| <= ${choice.chiSquareBound.toExponential(2)} (target ${tolerance}) at ${choice.referenceCount} reference cosmologies; ` +
          `largest interpolation error ${choice.maxErrorMag.toExponential(2)} mag`,
        // No call counts here: with worker threads each thread counts only its own share, which varies from run to run,
        // and the description goes into run.json and summary.json, which the same configuration and seed must reproduce.
        `exact evaluations when the top Chebyshev coefficients exceed ${tailGuard.toExponential(2)} mag`,
      ];
    },
  };
}
