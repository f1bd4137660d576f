import { choleskyBlock, populationCovarianceBlock, whitenBlock } from './hierarchicalBlock.js';
import type { HierarchicalModel } from './hierarchicalModel.js';

/** Scratch of {@link whitenBlocks}: one block, its factor, and the ln det of the last sweep. */
export interface BlockScratch {
  readonly block: Float64Array;
  readonly factor: Float64Array;
  /** sum_i ln det Sigma_i of the last successful sweep. */
  logDeterminant: number;
}

/** A fresh {@link BlockScratch}. */
export function createBlockScratch(): BlockScratch {
  return { block: new Float64Array(6), factor: new Float64Array(6), logDeterminant: NaN };
}

/**
 * Factorizes every per-supernova block Sigma_i at the model's current point
 * (filled by model.residual) and whitens in place: e_i <- L_i^-1 e_i,
 * w_i = L_i^-1 (1, 0, 0). ln det of the block-diagonal covariance, summed
 * with Neumaier's compensation, goes to scratch.logDeterminant.
 * Cost about 60 N flops; no allocation.
 * @param model the shared model; e the 3N residual (overwritten); w the 3N template (written)
 * @returns why a block is not positive definite, or null
 */
export function whitenBlocks(model: HierarchicalModel, e: Float64Array, w: Float64Array, scratch: BlockScratch): string | null {
  const n = model.count;
  const { measurement } = model.data;
  const sampleOfRow = model.options.table.sampleIndex;
  const samples = model.sampleCount;
  const { block, factor } = scratch;
  const inputs = model.point.covarianceInputs;
  let sum = 0;
  let compensation = 0;
  for (let i = 0; i < n; i++) {
    const s = sampleOfRow[i];
    populationCovarianceBlock(measurement, 6 * i, inputs[0], inputs[1], inputs[2 + s], inputs[2 + samples + s], inputs[2 + 2 * samples + s], block);
    const term = choleskyBlock(block, factor);
    if (Number.isNaN(term)) {
      return `the 3 x 3 covariance of supernova ${model.options.table.ids[i]} (row ${i + 1}) is not positive definite (check its light-curve errors and correlations)`;
    }
    whitenBlock(factor, e[3 * i], e[3 * i + 1], e[3 * i + 2], e, 3 * i);
    whitenBlock(factor, 1, 0, 0, w, 3 * i);
    const next = sum + term;
    compensation += Math.abs(sum) >= Math.abs(term) ? sum - next + term : term - next + sum;
    sum = next;
  }
  scratch.logDeterminant = sum + compensation;
  return null;
}
