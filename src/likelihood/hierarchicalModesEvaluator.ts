import type { ParameterValues } from './likelihoodTerm.js';
import { compensatedDot, compensatedSumOfShiftedSquares, compensatedSumOfSquares } from './compensatedSquares.js';
import { reject, type HierarchicalEvaluation, type HierarchicalEvaluator } from './hierarchicalEvaluator.js';
import type { HierarchicalModel } from './hierarchicalModel.js';
import { createHierarchicalModes } from './hierarchicalModes.js';
import { createBlockScratch, whitenBlocks } from './whitenHierarchicalBlocks.js';

const LOG_TWO_PI = Math.log(2 * Math.PI);

/**
 * The 'blocks' path with systematic modes on m_B: Sigma = blockdiag(Sigma_i)
 * + V V^T (V the 3N x K matrix with the modes U in the m_B rows), evaluated
 * through the Woodbury identity and the matrix determinant lemma (Woodbury
 * 1950; derivation in hierarchicalModes.ts) without an N x N or 3N x 3N
 * matrix. Per call: the block sweep of the path without modes, then
 * S = I + U^T P U (N K (K + 1)/2 multiply-adds), its Cholesky factor (K^3/6)
 * and two projections U^T v (2 N K). The offset is marginalized as in the
 * other paths (flat prior; Goliath et al. 2001; Conley et al. 2011,
 * appendix C), with E = |w|^2 - |y1|^2 and
 *
 *   -2 ln L = |e - M w|^2 - |y - M y1|^2 + sum_i ln det Sigma_i + ln det S + 3N ln 2 pi [+ ln(E/2 pi)].
 *
 * Like the conventional term's modes path the chi-square is a difference of
 * sums of squares; it loses about log10(|e|^2 / chi^2) digits, and E about
 * log10(1 + N s^2 p) when one mode is a common offset of s mag (p the
 * typical m_B precision), e.g. three digits for N = 10^4, s = 0.3/sqrt(p).
 * Allocates its buffers here (about (2K + 9) N doubles with those of hierarchicalModes.ts), nothing per call.
 * @param model the shared model (model.data.dense must be null, model.data.modes set)
 */
export function createBlockModesEvaluator(model: HierarchicalModel): HierarchicalEvaluator {
  const n = model.count;
  const size = 3 * n;
  const { modeCount } = model.data;
  const modes = createHierarchicalModes(model.data.modes as Float64Array, n, modeCount);
  const e = new Float64Array(size);
  const w = new Float64Array(size);
  const precision = new Float64Array(n);
  const cross = new Float64Array(n);
  const residualProjection = new Float64Array(modeCount);
  const templateProjection = new Float64Array(modeCount);
  const scratch = createBlockScratch();

  const finishWithModes = (p: ParameterValues, logDeterminantModes: number, out: HierarchicalEvaluation): void => {
    // E = u^T Sigma^-1 u and B = u^T Sigma^-1 d (hierarchicalModes.ts); M* = B / E.
    const templatePrecision = compensatedSumOfSquares(w, size) - compensatedSumOfSquares(templateProjection, modeCount);
    const projection = compensatedDot(w, e, size) - compensatedDot(templateProjection, residualProjection, modeCount);
    const best = projection / templatePrecision;
    const used = model.names.readsAbsMag ? p.abs_mag : best;
    out.bestAbsoluteMagnitude = best;
    out.logDeterminant = scratch.logDeterminant + logDeterminantModes;
    out.chiSquare = compensatedSumOfShiftedSquares(e, w, used, size) - compensatedSumOfShiftedSquares(residualProjection, templateProjection, used, modeCount);
    out.marginalizationTerm = model.names.readsAbsMag ? 0 : Math.log(templatePrecision / (2 * Math.PI));
    const total = out.chiSquare + out.logDeterminant + size * LOG_TWO_PI + out.marginalizationTerm;
    if (Number.isFinite(total)) {
      out.logLikelihood = -0.5 * total;
      out.reason = null;
    } else reject(out, `chi-square is not finite (${out.chiSquare}); a parameter, data value or mode is out of range`);
  };

  let prepared = false;
  return {
    path: 'blocks',
    denseFactor: null,
    get modes() {
      return prepared ? modes : null;
    },
    evaluate(p, out) {
      prepared = false;
      const unphysical = model.residual(p, e);
      if (unphysical) return reject(out, unphysical);
      const problem = whitenBlocks(model, e, w, scratch);
      if (problem) return reject(out, problem);
      for (let i = 0; i < n; i++) {
        const at = 3 * i;
        precision[i] = w[at] * w[at] + w[at + 1] * w[at + 1] + w[at + 2] * w[at + 2];
        cross[i] = w[at] * e[at] + w[at + 1] * e[at + 1] + w[at + 2] * e[at + 2];
      }
      const logDeterminantModes = modes.prepare(precision);
      if (Number.isNaN(logDeterminantModes)) {
        return reject(out, `the ${modeCount} x ${modeCount} systematic-mode matrix I + U^T P U is not positive definite; a mode or light-curve value is out of range`);
      }
      prepared = true;
      modes.project(cross, residualProjection);
      modes.project(precision, templateProjection);
      finishWithModes(p, logDeterminantModes, out);
    },
    describe: () => [
      `path: per-supernova 3 x 3 blocks plus ${modeCount} systematic mode${modeCount === 1 ? '' : 's'} on m_B through the Woodbury identity (Woodbury 1950), ` +
        `no 3N x 3N matrix: O(N K^2) per call with N = ${n}, K = ${modeCount} (3N = ${size} observations)`,
    ],
  };
}
