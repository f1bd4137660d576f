import type { ParameterValues } from './likelihoodTerm.js';
import { choleskyBlock, populationCovarianceBlock, whitenBlock } from './hierarchicalBlock.js';
import type { HierarchicalModel } from './hierarchicalModel.js';
import type { HierarchicalModes } from './hierarchicalModes.js';
import type { LatentEstimates } from './hierarchicalTermOptions.js';
import type { HubbleDiagram } from './supernovaTermOptions.js';
import type { Whitener } from './whitener.js';

/**
 * Sigma_i including the diagonal 3 x 3 block of the coupling matrix, at the
 * point filled by the last model.residual() call (private helper); with
 * `withModes`, also the modes' variance sum_k U_ik^2 on m_B (the diagonal
 * block of the full covariance), else the block B_i the Woodbury path factorizes.
 */
function fullBlock(model: HierarchicalModel, i: number, out: Float64Array, withModes: boolean): void {
  const inputs = model.point.covarianceInputs;
  const samples = model.sampleCount;
  const s = model.options.table.sampleIndex[i];
  populationCovarianceBlock(model.data.measurement, 6 * i, inputs[0], inputs[1], inputs[2 + s], inputs[2 + samples + s], inputs[2 + 2 * samples + s], out);
  const { modes, modeCount } = model.data;
  if (modes && withModes) for (let k = 0; k < modeCount; k++) out[0] += modes[i * modeCount + k] ** 2;
  const dense = model.data.dense;
  if (!dense) return;
  const size = 3 * model.count;
  const at = (a: number, b: number): number => dense[(3 * i + a) * size + 3 * i + b];
  out[0] += at(0, 0); out[1] += at(0, 1); out[2] += at(0, 2); out[3] += at(1, 1); out[4] += at(1, 2); out[5] += at(2, 2);
}

/** out = L^-1 g for a vector g that is zero before row `from` (forward substitution from there). Cost O((size - from)^2 / 2). */
function forwardFrom(lower: Float64Array, size: number, from: number, out: Float64Array): void {
  for (let r = from; r < size; r++) {
    let sum = out[r];
    const row = r * size;
    for (let k = from; k < r; k++) sum -= lower[row + k] * out[k];
    out[r] = sum / lower[row + r];
  }
}

/** a . b over three entries. */
function dot3(a: Float64Array, b: Float64Array): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/**
 * delta_i(m_B) -= U_i . g_hat, g_hat = S^-1 U^T q with q_i = e_1^T B_i^-1 delta_i
 * (hierarchicalModes.ts): afterwards B_i^-1 delta_i is [Sigma^-1 delta]_i. O(N K); allocates.
 */
function subtractModeShifts(model: HierarchicalModel, modes: HierarchicalModes, delta: Float64Array): void {
  const n = model.count;
  const block = new Float64Array(6);
  const factor = new Float64Array(6);
  const e = new Float64Array(3);
  const w = new Float64Array(3);
  const q = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    fullBlock(model, i, block, false);
    choleskyBlock(block, factor);
    whitenBlock(factor, delta[3 * i], delta[3 * i + 1], delta[3 * i + 2], e, 0);
    whitenBlock(factor, 1, 0, 0, w, 0);
    q[i] = dot3(w, e);
  }
  const shifts = new Float64Array(n);
  modes.modeShifts(q, shifts);
  for (let i = 0; i < n; i++) delta[3 * i] -= shifts[i];
}

/**
 * Posterior of the true x1 and c of every supernova given all the data
 * (m_B, x1, c of every supernova) and the parameters, by Gaussian
 * conditioning (see hierarchicalBlock.ts): with G_i = A D_i (the 3 x 2
 * cross-covariance of o_i and t_i) and Sigma the covariance of all o,
 *
 *   E[t_i | o] = t*_i + G_i^T [Sigma^-1 (o - m)]_i,
 *   Cov[t_i | o] = D_i - G_i^T (Sigma^-1)_ii G_i,
 *
 * computed as inner products of whitened vectors L^-1 g. With systematic
 * modes on the blocks path, Sigma = B + V V^T and (hierarchicalModes.ts)
 * [Sigma^-1 delta]_i = B_i^-1 (delta_i - (U_i . g_hat, 0, 0)) with g_hat the
 * posterior-mean mode amplitudes, and G_i^T (Sigma^-1)_ii G_i loses
 * (U_i^T S^-1 U_i) (G_i^T B_i^-1 e_1)(G_i^T B_i^-1 e_1)^T. The absolute
 * magnitude is held at `absoluteMagnitude` (its uncertainty, ~sigma/sqrt(N),
 * is not propagated). Cost: O(N) on the blocks path, O(N K^2) with modes;
 * O((3N)^3/3) on the dense path (two forward solves per supernova). Call right
 * after a successful evaluation at p (the model's point, the dense factor and
 * the modes' factor must be those of p).
 * @param model the shared model
 * @param denseFactor the factor of the full Sigma (dense path), or null
 * @param modes the modes' K x K algebra prepared at p (blocks path with modes), or null
 * @param p the parameter point
 * @param absoluteMagnitude M, mag
 */
export function latentPosterior(model: HierarchicalModel, denseFactor: Whitener | null, modes: HierarchicalModes | null, p: ParameterValues, absoluteMagnitude: number): LatentEstimates {
  const n = model.count;
  const size = 3 * n;
  const delta = new Float64Array(size);
  model.residual(p, delta);
  for (let i = 0; i < n; i++) delta[3 * i] -= absoluteMagnitude;
  const { point, sampleCount } = model;
  const inputs = point.covarianceInputs;
  const [alpha, beta] = [inputs[0], inputs[1]];
  const result: LatentEstimates = {
    ids: [...model.options.table.ids], stretchMean: new Float64Array(n), stretchSd: new Float64Array(n), colorMeanMag: new Float64Array(n),
    colorSdMag: new Float64Array(n), stretchColorCorrelation: new Float64Array(n), absoluteMagnitudeMag: absoluteMagnitude,
  };
  const block = new Float64Array(6);
  const factor = new Float64Array(6);
  const e = denseFactor ? delta : new Float64Array(3);
  const vx = new Float64Array(denseFactor ? size : 3);
  const vc = new Float64Array(denseFactor ? size : 3);
  if (denseFactor) denseFactor.whitenInPlace(e);
  const template = new Float64Array(3);
  if (modes && !denseFactor) subtractModeShifts(model, modes, delta);
  for (let i = 0; i < n; i++) {
    const s = model.options.table.sampleIndex[i];
    const rx2 = inputs[2 + s];
    const rc2 = inputs[2 + sampleCount + s];
    const z = model.options.table.redshift[i];
    let from = 0;
    if (denseFactor) {
      from = 3 * i;
      vx.fill(0); vc.fill(0);
      vx[from] = -alpha * rx2; vx[from + 1] = rx2;
      vc[from] = beta * rc2; vc[from + 2] = rc2;
      forwardFrom(denseFactor.matrix, size, from, vx);
      forwardFrom(denseFactor.matrix, size, from, vc);
    } else {
      fullBlock(model, i, block, false);
      choleskyBlock(block, factor);
      whitenBlock(factor, delta[3 * i], delta[3 * i + 1], delta[3 * i + 2], e, 0);
      whitenBlock(factor, -alpha * rx2, rx2, 0, vx, 0);
      whitenBlock(factor, beta * rc2, 0, rc2, vc, 0);
    }
    let meanX = 0; let meanC = 0; let xx = 0; let cc = 0; let xc = 0;
    for (let k = from; k < vx.length; k++) {
      meanX += vx[k] * e[k]; meanC += vc[k] * e[k];
      xx += vx[k] * vx[k]; cc += vc[k] * vc[k]; xc += vx[k] * vc[k];
    }
    if (modes && !denseFactor) {
      whitenBlock(factor, 1, 0, 0, template, 0);
      const [towardX, towardC] = [dot3(vx, template), dot3(vc, template)];
      const modeVariance = modes.modeVariance(i);
      xx -= modeVariance * towardX * towardX; cc -= modeVariance * towardC * towardC; xc -= modeVariance * towardX * towardC;
    }
    const varX = Math.max(rx2 - xx, 0);
    const varC = Math.max(rc2 - cc, 0);
    result.stretchMean[i] = point.stretchMean[s] + point.stretchSlope * z + meanX;
    result.colorMeanMag[i] = point.colorMean[s] + point.colorSlope * z + meanC;
    result.stretchSd[i] = Math.sqrt(varX);
    result.colorSdMag[i] = Math.sqrt(varC);
    result.stretchColorCorrelation[i] = varX > 0 && varC > 0 ? -xc / Math.sqrt(varX * varC) : 0;
  }
  return result;
}

/**
 * The Hubble diagram of the hierarchical model. Each supernova's x1 and c are
 * replaced by their posterior means given its measured x1 and c and the
 * population (not its m_B, which would use the magnitude twice and pull the
 * residuals toward the model):
 *
 *   t_hat = t* + D (D + V_xc)^-1 (o_xc - t*),
 *   mu_obs = m_B - bias + alpha x_hat - beta c_hat + mass_step (f_high - 1/2) - M,
 *
 * and the quoted error is the exact standard deviation of mu_obs - mu_model
 * under the model, sqrt(h^T Sigma_i h) with h = (1, (D (D + V_xc)^-1)^T (alpha, -beta)).
 * Cost O(N) plus N distances; allocates.
 * @param model the shared model
 * @param p the parameter point (must not be rejected)
 * @param absoluteMagnitude M, mag
 */
export function hierarchicalHubbleDiagram(model: HierarchicalModel, p: ParameterValues, absoluteMagnitude: number): HubbleDiagram {
  const n = model.count;
  const table = model.options.table;
  const d = new Float64Array(3 * n);
  model.residual(p, d);
  const { point, sampleCount, data } = model;
  const inputs = point.covarianceInputs;
  const observed = new Float64Array(n);
  const errors = new Float64Array(n);
  const residualMag = new Float64Array(n);
  const block = new Float64Array(6);
  for (let i = 0; i < n; i++) {
    const s = table.sampleIndex[i];
    const rx2 = inputs[2 + s];
    const rc2 = inputs[2 + sampleCount + s];
    fullBlock(model, i, block, true);
    // (D + V_xc) is the lower-right 2 x 2 of Sigma_i: [block[3], block[4]; block[4], block[5]]
    const det = block[3] * block[5] - block[4] * block[4];
    const g00 = (rx2 * block[5]) / det; const g01 = (-rx2 * block[4]) / det;
    const g10 = (-rc2 * block[4]) / det; const g11 = (rc2 * block[3]) / det;
    const xShift = g00 * d[3 * i + 1] + g01 * d[3 * i + 2];
    const cShift = g10 * d[3 * i + 1] + g11 * d[3 * i + 2];
    const z = table.redshift[i];
    const xHat = point.stretchMean[s] + point.stretchSlope * z + xShift;
    const cHat = point.colorMean[s] + point.colorSlope * z + cShift;
    observed[i] = data.observed[3 * i] + point.alpha * xHat - point.beta * cHat + point.massStep * data.stepFraction[i] - absoluteMagnitude;
    residualMag[i] = observed[i] - model.modelModulus[i];
    const h1 = g00 * point.alpha - g10 * point.beta;
    const h2 = g01 * point.alpha - g11 * point.beta;
    const variance = block[0] + 2 * (h1 * block[1] + h2 * block[2]) + h1 * h1 * block[3] + 2 * h1 * h2 * block[4] + h2 * h2 * block[5];
    errors[i] = Math.sqrt(Math.max(variance, 0));
  }
  return {
    ids: [...table.ids], redshift: Float64Array.from(table.redshift), isCalibrator: Array.from(data.isCalibrator, (flag) => flag === 1),
    distanceModulusMag: observed, distanceModulusErrorMag: errors, modelDistanceModulusMag: Float64Array.from(model.modelModulus), residualMag,
    absoluteMagnitudeMag: absoluteMagnitude, h0KmPerSPerMpc: model.h0At(p),
  };
}
