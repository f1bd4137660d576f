import { CandelaError } from '../../errors.js';
import type { HardBounds } from './densityTypes.js';

/**
 * One axis of a binned Gaussian kernel density estimate (private to
 * math/density, not in the barrel). Samples are linearly binned onto a fine grid whose nodes
 * include every output grid point, then convolved with the sampled Gaussian
 * kernel (binned KDE: Wand & Jones 1995, "Kernel Smoothing", Appendix D;
 * linear binning: Jones & Lotwick 1984). Cost: O(n) to bin plus
 * O(outputs x kernel width) to convolve, instead of O(n x outputs).
 */

/** Kernel is cut at this many bandwidths; the neglected tail is below exp(-18) = 1.5e-8 of the peak. */
export const KERNEL_CUTOFF_BANDWIDTHS = 6;
/** Fine-grid nodes per bandwidth: linear binning then adds a variance of about (h/8)^2/6, 0.3% of h^2. */
const BINNING_CELLS_PER_BANDWIDTH = 8;
/** Default grid range: sample range padded by this many bandwidths on each side. */
const RANGE_PADDING_BANDWIDTHS = 3;

/** Layout of one axis: output grid, fine binning grid, bounds. */
export interface KernelAxis {
  /** Output grid points (parameter unit). */
  output: Float64Array;
  /** Fine-grid spacing (parameter unit). */
  fineStep: number;
  /** Position of fine node 0 (parameter unit). */
  fineStart: number;
  /** Number of fine nodes. */
  fineCount: number;
  /** Fine index of output point 0. */
  outputOffset: number;
  /** Fine nodes between output points. */
  refinement: number;
  /** Sampled kernel exp(-(k fineStep / h)^2 / 2), k = 0..taps.length-1. */
  taps: Float64Array;
  bandwidth: number;
  lower: number;
  upper: number;
}

/**
 * Lays out an axis: the output range (given, or the sample range padded by
 * RANGE_PADDING_BANDWIDTHS bandwidths), cut at hard bounds; a fine grid
 * refining it by an integer factor so that the spacing is at most h / 8
 * (fewer when the fine grid would exceed `maxFineNodes`), padded by the
 * kernel cutoff on both sides.
 * @throws CandelaError `math.bad_range` when the range is empty or not finite,
 *   `math.bad_grid` for fewer than 2 grid points, `math.bad_bandwidth`
 *   for a bandwidth that is not positive.
 */
export function planKernelAxis(name: string, sampleMin: number, sampleMax: number, bandwidth: number, points: number, maxFineNodes: number, range?: [number, number], bounds?: HardBounds): KernelAxis {
  const lower = bounds?.lower ?? -Infinity;
  const upper = bounds?.upper ?? Infinity;
  if (!(bandwidth > 0) || !Number.isFinite(bandwidth)) {
    throw new CandelaError({ code: 'math.bad_bandwidth', path: name, message: 'the kernel bandwidth must be a positive number', expected: '> 0', found: String(bandwidth) });
  }
  if (!Number.isInteger(points) || points < 2) {
    throw new CandelaError({ code: 'math.bad_grid', path: name, message: 'a density grid needs at least 2 points', expected: 'an integer >= 2', found: String(points) });
  }
  const start = Math.max(lower, range ? range[0] : sampleMin - RANGE_PADDING_BANDWIDTHS * bandwidth);
  const end = Math.min(upper, range ? range[1] : sampleMax + RANGE_PADDING_BANDWIDTHS * bandwidth);
  if (!(end > start) || !Number.isFinite(start) || !Number.isFinite(end)) {
    throw new CandelaError({ code: 'math.bad_range', path: name, message: `empty or infinite density range for ${name}`, expected: 'low < high, both finite', found: `[${start}, ${end}]` });
  }
  const step = (end - start) / (points - 1);
  const halfWidthFor = (fineStep: number): number => Math.ceil((KERNEL_CUTOFF_BANDWIDTHS * bandwidth) / fineStep);
  let refinement = Math.max(1, Math.ceil((step * BINNING_CELLS_PER_BANDWIDTH) / bandwidth));
  while (refinement > 1 && (points - 1) * refinement + 1 + 2 * halfWidthFor(step / refinement) > maxFineNodes) {
    refinement = Math.max(1, Math.floor(refinement / 2));
  }
  const fineStep = step / refinement;
  const halfWidth = halfWidthFor(fineStep);
  const taps = new Float64Array(halfWidth + 1);
  for (let k = 0; k <= halfWidth; k++) taps[k] = Math.exp(-0.5 * ((k * fineStep) / bandwidth) ** 2);
  const output = new Float64Array(points);
  for (let j = 0; j < points; j++) output[j] = j === points - 1 ? end : start + j * step;
  return {
    output, fineStep, fineStart: start - halfWidth * fineStep, fineCount: (points - 1) * refinement + 1 + 2 * halfWidth,
    outputOffset: halfWidth, refinement, taps, bandwidth, lower, upper,
  };
}

/**
 * The positions at which a sample enters the estimate: itself, plus its
 * mirror images 2a - x and 2b - x at hard bounds a, b that lie within the
 * kernel cutoff (reflection method, Schuster 1985, "Incorporating support
 * constraints into nonparametric estimators of densities", Commun. Stat.
 * Theory Methods 14, 1123; Silverman 1986, section 2.10). Samples outside a
 * bound are taken to lie on it.
 */
export function reflectedPositions(axis: KernelAxis, value: number, out: number[]): number {
  const x = Math.min(axis.upper, Math.max(axis.lower, value));
  const reach = KERNEL_CUTOFF_BANDWIDTHS * axis.bandwidth;
  out[0] = x;
  let count = 1;
  if (x - axis.lower < reach) out[count++] = 2 * axis.lower - x;
  if (axis.upper - x < reach) out[count++] = 2 * axis.upper - x;
  return count;
}

/**
 * Fine-grid coordinate of a position for linear binning: u in
 * [0, fineCount - 1] (node floor(u) gets weight 1 - (u - floor u), the next
 * node the rest), or -1 when the position is outside the fine grid, where
 * its kernel reaches no output point.
 */
export function fineCoordinate(axis: KernelAxis, position: number): number {
  const u = (position - axis.fineStart) / axis.fineStep;
  return u >= 0 && u <= axis.fineCount - 1 ? u : -1;
}

/**
 * Convolves fine-grid bins (stride `stride`, starting at `offset`) with the
 * kernel at every output point of the axis, writing outputs at
 * out[outOffset + j * outStride]. Values below the lower bound or above the
 * upper bound are zero.
 */
export function convolveAxis(axis: KernelAxis, bins: Float64Array, offset: number, stride: number, out: Float64Array, outOffset: number, outStride: number): void {
  const { taps, refinement, outputOffset, output } = axis;
  const halfWidth = taps.length - 1;
  for (let j = 0; j < output.length; j++) {
    const center = outputOffset + j * refinement;
    let sum = taps[0] * bins[offset + center * stride];
    for (let k = 1; k <= halfWidth; k++) {
      sum += taps[k] * (bins[offset + (center - k) * stride] + bins[offset + (center + k) * stride]);
    }
    const inside = output[j] >= axis.lower && output[j] <= axis.upper;
    out[outOffset + j * outStride] = inside ? sum : 0;
  }
}
