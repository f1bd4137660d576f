import type { ParameterValues } from './likelihoodTerm.js';
import { populationCovarianceBlock } from './hierarchicalBlock.js';
import type { HierarchicalModel } from './hierarchicalModel.js';
import type { HierarchicalModes } from './hierarchicalModes.js';
import type { HierarchicalPath } from './hierarchicalTermOptions.js';
import { compensatedSumOfShiftedSquares } from './compensatedSquares.js';
import { createOffsetMarginal, marginalizeOffset } from './marginalizeOffset.js';
import { createDenseWhitener, type Whitener } from './whitener.js';
import { createBlockScratch, whitenBlocks } from './whitenHierarchicalBlocks.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/** One evaluation of the hierarchical term (a mutable record reused by the hot path). */
export interface HierarchicalEvaluation {
  /** ln L over the 3N observations, fully normalized; -Infinity when rejected. */
  logLikelihood: number;
  /** delta^T Sigma^-1 delta at the absolute magnitude used. */
  chiSquare: number;
  /** ln det Sigma. */
  logDeterminant: number;
  /** ln(E/2 pi) when the offset is marginalized, else 0. */
  marginalizationTerm: number;
  /** Best-fit absolute magnitude given the other parameters, mag. */
  bestAbsoluteMagnitude: number;
  /** Why logLikelihood is -Infinity, else null. */
  reason: string | null;
}

/** One evaluation strategy of the hierarchical term (private helper). */
export interface HierarchicalEvaluator {
  readonly path: HierarchicalPath;
  /** Fills `out` at p. No allocation. */
  evaluate(p: ParameterValues, out: HierarchicalEvaluation): void;
  /** The dense factor of the last successful evaluate() ('dense' path), else null. */
  readonly denseFactor: Whitener | null;
  /** The systematic modes' K x K algebra at the last successful evaluate() (block path with modes), else null. */
  readonly modes: HierarchicalModes | null;
  describe(): string[];
}

/** A fresh evaluation record. */
export function createHierarchicalEvaluation(): HierarchicalEvaluation {
  return { logLikelihood: -Infinity, chiSquare: NaN, logDeterminant: NaN, marginalizationTerm: NaN, bestAbsoluteMagnitude: NaN, reason: 'not evaluated' };
}

/** Marks `out` as rejected with `reason` (private helper of the evaluators). */
export function reject(out: HierarchicalEvaluation, reason: string): void {
  out.logLikelihood = -Infinity;
  out.chiSquare = NaN;
  out.reason = reason;
}

/**
 * Completes an evaluation from the whitened residual e = L^-1 d and template
 * w = L^-1 u (u = 1 on the m_B entries, 0 on x1 and c), like the
 * conventional term: marginalized, -2 ln L = chi^2_min + ln(E/2 pi) + ln det
 * Sigma + 3N ln 2 pi with E = u^T Sigma^-1 u (the model is linear in M, so a
 * flat prior integrates it out exactly: Goliath et al. 2001; Conley et al.
 * 2011, appendix C); sampled, chi^2 = |e - M w|^2.
 */
function finish(model: HierarchicalModel, e: Float64Array, w: Float64Array, logDeterminant: number, p: ParameterValues, marginal: ReturnType<typeof createOffsetMarginal>, out: HierarchicalEvaluation): void {
  const size = 3 * model.count;
  marginalizeOffset(e, w, NaN, size, marginal);
  out.bestAbsoluteMagnitude = marginal.bestOffset;
  out.logDeterminant = logDeterminant;
  if (model.names.readsAbsMag) {
    out.chiSquare = compensatedSumOfShiftedSquares(e, w, p.abs_mag, size);
    out.marginalizationTerm = 0;
  } else {
    out.chiSquare = marginal.chiSquareAtBest;
    out.marginalizationTerm = marginal.marginalizationTerm;
  }
  const total = out.chiSquare + logDeterminant + size * LOG_TWO_PI + out.marginalizationTerm;
  if (Number.isFinite(total)) {
    out.logLikelihood = -0.5 * total;
    out.reason = null;
  } else reject(out, `chi-square is not finite (${out.chiSquare}); a parameter or data value is out of range`);
}

/**
 * The 'blocks' path: every covariance is per supernova, so Sigma is block
 * diagonal and each 3 x 3 block is factorized on the fly. Cost per call:
 * N distances plus about 60 N flops; ln det Sigma summed with Neumaier's
 * compensation. Allocates its buffers here, nothing per call.
 * @param model the shared model (model.data.dense must be null)
 */
export function createBlockEvaluator(model: HierarchicalModel): HierarchicalEvaluator {
  const n = model.count;
  const e = new Float64Array(3 * n);
  const w = new Float64Array(3 * n);
  const scratch = createBlockScratch();
  const marginal = createOffsetMarginal();
  return {
    path: 'blocks',
    denseFactor: null,
    modes: null,
    evaluate(p, out) {
      const unphysical = model.residual(p, e);
      if (unphysical) return reject(out, unphysical);
      const problem = whitenBlocks(model, e, w, scratch);
      if (problem) return reject(out, problem);
      finish(model, e, w, scratch.logDeterminant, p, marginal, out);
    },
    describe: () => [`path: per-supernova 3 x 3 blocks, O(N) per call with N = ${n} (3N = ${3 * n} observations)`],
  };
}

/**
 * The 'dense' path: a matrix couples supernovae, so the full 3N x 3N
 * Sigma = S + blockdiag(Sigma_i) is factorized (Cholesky, (3N)^3/3
 * multiply-adds, e.g. 3.6e9 for N = 740) whenever the covariance inputs
 * (alpha, beta, widths, sigma_int) change, then whitened by triangular
 * solves ((3N)^2/2 per call). Frozen: factorized once. Memory 2 (3N)^2 doubles.
 * @param model the shared model (model.data.dense must be set)
 */
export function createDenseEvaluator(model: HierarchicalModel): HierarchicalEvaluator {
  const n = model.count;
  const size = 3 * n;
  const dense = model.data.dense as Float64Array;
  const { measurement } = model.data;
  const sampleOfRow = model.options.table.sampleIndex;
  const samples = model.sampleCount;
  const whitener = createDenseWhitener(size);
  const cached = new Float64Array(model.point.covarianceInputs.length).fill(NaN);
  const e = new Float64Array(size);
  const w = new Float64Array(size);
  const block = new Float64Array(6);
  const marginal = createOffsetMarginal();
  const entry = [0, 1, 2, 1, 3, 4, 2, 4, 5];
  let failure: string | null = null;
  let factorizations = 0;

  const prepare = (): string | null => {
    const inputs = model.point.covarianceInputs;
    let same = true;
    for (let k = 0; k < inputs.length; k++) if (!(inputs[k] === cached[k])) same = false;
    if (same) return failure;
    cached.set(inputs);
    const matrix = whitener.matrix;
    matrix.set(dense);
    for (let i = 0; i < n; i++) {
      const s = sampleOfRow[i];
      populationCovarianceBlock(measurement, 6 * i, inputs[0], inputs[1], inputs[2 + s], inputs[2 + samples + s], inputs[2 + 2 * samples + s], block);
      for (let a = 0; a < 3; a++) for (let b = 0; b < 3; b++) matrix[(3 * i + a) * size + 3 * i + b] += block[entry[3 * a + b]];
    }
    factorizations++;
    failure = whitener.factorize();
    if (failure) return failure;
    w.fill(0);
    for (let i = 0; i < n; i++) w[3 * i] = 1;
    whitener.whitenInPlace(w);
    return null;
  };
  return {
    path: 'dense',
    modes: null,
    get denseFactor() {
      return failure === null && factorizations > 0 ? whitener : null;
    },
    evaluate(p, out) {
      const unphysical = model.residual(p, e);
      if (unphysical) return reject(out, unphysical);
      const problem = prepare();
      if (problem) return reject(out, problem);
      whitener.whitenInPlace(e);
      finish(model, e, w, whitener.logDeterminant, p, marginal, out);
    },
    describe: () => [
      `path: dense 3N x 3N covariance, N = ${n}: Cholesky factorization O((3N)^3/3) = ${(size ** 3 / 3).toExponential(2)} multiply-adds ` +
        `${model.frozen ? 'once (frozen covariance)' : 'whenever alpha, beta, a population width or sigma_int changes'}, then O((3N)^2/2) solves per call`,
      `factorizations so far: ${factorizations}`,
    ],
  };
}
