import { CandelaError } from '../errors.js';
import type { ParameterValues } from './likelihoodTerm.js';
import { prepareHierarchicalData, type HierarchicalData } from './hierarchicalData.js';
import { hierarchicalParameterNames, type HierarchicalParameterNames } from './hierarchicalParameterNames.js';
import type { HierarchicalTermOptions } from './hierarchicalTermOptions.js';
import { checkFlowRedshifts, createHubbleFlowModuli } from './hubbleFlowModuli.js';

/** The parameters at one point, in the form the evaluation loops use (reused record). */
export interface HierarchicalPoint {
  alpha: number;
  beta: number;
  /** mass_step, or 0 when the step is off, mag. */
  massStep: number;
  /** Slopes of the population means per unit redshift (0 without redshift dependence). */
  stretchSlope: number;
  colorSlope: number;
  /** Population means at z = 0 per sample index: x1 and c (mag). */
  stretchMean: Float64Array;
  colorMean: Float64Array;
  /**
   * What the covariance depends on: [alpha, beta, R_x^2 per sample, R_c^2 per
   * sample, sigma_int^2 per sample] (frozen values on a frozen dense path).
   */
  covarianceInputs: Float64Array;
}

/**
 * Everything the evaluation paths share (private helper): data, names, the
 * parameter point, the model distance moduli and the residual o - m without M.
 */
export interface HierarchicalModel {
  readonly options: HierarchicalTermOptions;
  readonly data: HierarchicalData;
  readonly names: HierarchicalParameterNames;
  readonly count: number;
  readonly sampleCount: number;
  /** True on the dense path with alphaBetaCovariance 'frozen'. */
  readonly frozen: boolean;
  /** Filled by {@link HierarchicalModel.residual}. */
  readonly point: HierarchicalPoint;
  /** Model distance modulus per supernova at the last residual() call, mag. */
  readonly modelModulus: Float64Array;
  /** H0 in use at p, km/s/Mpc. */
  h0At(p: ParameterValues): number;
  /**
   * d = o - m_i without the absolute magnitude (3N, interleaved), at p.
   * Fills `point` and `modelModulus`. Returns why p is rejected, or null.
   * Cost O(N) plus N distances; no allocation.
   */
  residual(p: ParameterValues, out: Float64Array): string | null;
}

/** Why the parameter is not a finite number, or null. */
function finite(p: ParameterValues, name: string): string | null {
  return Number.isFinite(p[name]) ? null : `parameter ${name} = ${p[name]} is not a finite number`;
}

/** Why the population width is not a positive finite number, or null. */
function positive(p: ParameterValues, name: string): string | null {
  return p[name] > 0 && p[name] < Infinity ? null : `population width ${name} = ${p[name]} must be a positive finite number`;
}

function frozenInputs(options: HierarchicalTermOptions, names: HierarchicalParameterNames, sampleCount: number): Float64Array {
  const source = { ...(options.fixed ?? {}), ...(options.standardization.frozenAt ?? {}) };
  const wanted = ['alpha', 'beta', ...names.stretchWidth, ...names.colorWidth, ...names.intrinsic.filter((name) => name !== '')];
  const missing = [...new Set(wanted.filter((name) => !Number.isFinite(source[name])))];
  if (missing.length) {
    throw new CandelaError({
      code: 'likelihood.frozen_without_values', path: `${options.name}.frozenAt`,
      message: `a frozen dense covariance needs values for ${missing.join(', ')}`, fix: 'give them in frozenAt, or fix these parameters',
    });
  }
  const inputs = new Float64Array(2 + 3 * sampleCount);
  inputs[0] = source.alpha;
  inputs[1] = source.beta;
  for (let s = 0; s < sampleCount; s++) {
    inputs[2 + s] = source[names.stretchWidth[s]] ** 2;
    inputs[2 + sampleCount + s] = source[names.colorWidth[s]] ** 2;
    inputs[2 + 2 * sampleCount + s] = names.intrinsic[s] ? source[names.intrinsic[s]] ** 2 : 0;
  }
  return inputs;
}

/**
 * Builds the shared model. Cost O(N log N) plus the data preparation.
 * @param options the term's options
 * @throws CandelaError for a non-light-curve table, bad rows, matrix sizes, a Hubble-flow redshift <= 0,
 *   or a frozen covariance without values
 * @example createHierarchicalModel(options).count === options.table.count
 */
export function createHierarchicalModel(options: HierarchicalTermOptions): HierarchicalModel {
  const { table } = options;
  const n = table.count;
  if (n < 1) throw new CandelaError({ code: 'likelihood.empty_sample', path: options.name, message: `likelihood term ${options.name} has no supernovae` });
  checkFlowRedshifts(table); // before the light-curve checks, so a z <= 0 row is named as such
  const data = prepareHierarchicalData(options);
  const frozen = data.dense !== null && options.standardization.alphaBetaCovariance === 'frozen';
  const names = hierarchicalParameterNames(options, frozen);
  // The Hubble-flow distance moduli, shared with the conventional term (hubbleFlowModuli.ts).
  const flowModel = createHubbleFlowModuli(table, options.cosmologyModel, {
    omegaDarkEnergy: names.readsOmegaDarkEnergy, w0: names.readsW0, wa: names.readsWa, h0: names.readsH0,
  });
  const h0At = flowModel.h0At;
  const sampleCount = table.sampleNames.length;
  const sampleOfRow = table.sampleIndex;
  const point: HierarchicalPoint = {
    alpha: NaN, beta: NaN, massStep: 0, stretchSlope: 0, colorSlope: 0,
    stretchMean: new Float64Array(sampleCount), colorMean: new Float64Array(sampleCount),
    covarianceInputs: frozen ? frozenInputs(options, names, sampleCount) : new Float64Array(2 + 3 * sampleCount),
  };
  const modelModulus = new Float64Array(n);

  /** Reads the point; returns the first problem with a parameter value, or null. No allocation unless a problem is found. */
  const readPoint = (p: ParameterValues): string | null => {
    const problem = finite(p, 'alpha') ?? finite(p, 'beta') ?? (names.readsAbsMag ? finite(p, 'abs_mag') : null) ?? (names.readsMassStep ? finite(p, 'mass_step') : null) ??
      (names.stretchSlope ? finite(p, names.stretchSlope) : null) ?? (names.colorSlope ? finite(p, names.colorSlope) : null);
    if (problem) return problem;
    point.alpha = p.alpha;
    point.beta = p.beta;
    point.massStep = names.readsMassStep ? p.mass_step : 0;
    point.stretchSlope = names.stretchSlope ? p[names.stretchSlope] : 0;
    point.colorSlope = names.colorSlope ? p[names.colorSlope] : 0;
    const inputs = point.covarianceInputs;
    for (let s = 0; s < sampleCount; s++) {
      const meanProblem = finite(p, names.stretchMean[s]) ?? finite(p, names.colorMean[s]);
      if (meanProblem) return meanProblem;
      point.stretchMean[s] = p[names.stretchMean[s]];
      point.colorMean[s] = p[names.colorMean[s]];
      if (frozen) continue;
      const widthProblem = positive(p, names.stretchWidth[s]) ?? positive(p, names.colorWidth[s]) ?? (names.intrinsic[s] ? finite(p, names.intrinsic[s]) : null);
      if (widthProblem) return widthProblem;
      inputs[2 + s] = p[names.stretchWidth[s]] ** 2;
      inputs[2 + sampleCount + s] = p[names.colorWidth[s]] ** 2;
      inputs[2 + 2 * sampleCount + s] = names.intrinsic[s] ? p[names.intrinsic[s]] ** 2 : 0;
    }
    if (!frozen) {
      inputs[0] = p.alpha;
      inputs[1] = p.beta;
    }
    return null;
  };

  return {
    options, data, names, count: n, sampleCount, frozen, point, modelModulus, h0At,
    residual(p, out) {
      const problem = readPoint(p) ?? flowModel.moduli(p, modelModulus);
      if (problem) return problem;
      const { alpha, beta, massStep, stretchSlope, colorSlope, stretchMean, colorMean } = point;
      const observed = data.observed;
      for (let i = 0; i < n; i++) {
        const s = sampleOfRow[i];
        const z = table.redshift[i];
        const stretchCentre = stretchMean[s] + stretchSlope * z;
        const colorCentre = colorMean[s] + colorSlope * z;
        out[3 * i] = observed[3 * i] - (modelModulus[i] - massStep * data.stepFraction[i] - alpha * stretchCentre + beta * colorCentre);
        out[3 * i + 1] = observed[3 * i + 1] - stretchCentre;
        out[3 * i + 2] = observed[3 * i + 2] - colorCentre;
      }
      return null;
    },
  };
}
