import { describe, expect, it } from 'vitest';
import { isCandelaError } from '../../../src/errors.js';
import { createRandomStream, densityGrid2D, kernelBandwidth, marginalDensity1D } from '../../../src/math/index.js';

// Deterministic point set of test/fixtures/output/make_summary_reference.R (sections 2 and 3).
function referencePoints(): { x: Float64Array; y: Float64Array; weights: Float64Array } {
  const count = 500;
  const x = new Float64Array(count);
  const y = new Float64Array(count);
  const weights = new Float64Array(count);
  for (let k = 1; k <= count; k++) {
    x[k - 1] = Math.sin(k * 1.3) + 0.5 * Math.sin(k * 0.37);
    y[k - 1] = Math.cos(k * 0.71) * x[k - 1] + 0.3 * Math.sin(k * 2.9);
    weights[k - 1] = 1 + (k % 3);
  }
  return { x, y, weights };
}

// Linear binning on a fine grid of spacing <= h/8 acts, on average, as an extra smoothing of variance
// spacing^2 / 6 <= h^2 / 384 (Wand & Jones 1995, Kernel Smoothing, Appendix D): a few 1e-4 of the density.
// Largest relative difference measured below: 6e-4; tolerance 2e-3.
const BINNING_TOLERANCE = 2e-3;

describe('kernelBandwidth', () => {
  it("follows Scott's rule sd n^(-1/(d+4)) and Silverman's 0.9 min(sd, IQR/1.34) n^(-1/5)", () => {
    // Formulas of Scott 1992 (ch. 6) and Silverman 1986 (eq. 3.31, 4.14), evaluated by hand.
    expect(kernelBandwidth({ sd: 2 }, 1e5, 1, 'scott')).toBeCloseTo(2 * 0.1, 14);
    expect(kernelBandwidth({ sd: 2 }, 64, 2, 'scott')).toBeCloseTo(2 * 0.5, 14); // 64^(-1/6) = 1/2
    expect(kernelBandwidth({ sd: 2, interquartileRange: 1.34 }, 1e5, 1, 'silverman')).toBeCloseTo(0.9 * 1 * 0.1, 14);
    expect(kernelBandwidth({ sd: 2 }, 64, 2, 'silverman')).toBeCloseTo(kernelBandwidth({ sd: 2 }, 64, 2, 'scott'), 14);
    expect(kernelBandwidth({ sd: 2 }, 1e5, 1, 'scott', 0.5)).toBeCloseTo(0.1, 14);
  });
  it('refuses a sample without spread', () => {
    expect(() => kernelBandwidth({ sd: 0 }, 100, 1, 'scott')).toThrow(/without spread/);
  });
});

describe('marginalDensity1D', () => {
  it('matches direct sums of R stats::dnorm for a weighted sample', () => {
    // R 4.2.2: sum(w * dnorm(t, x, 0.15)) / sum(w) (make_summary_reference.R, section 3).
    const { x, weights } = referencePoints();
    const marginal = marginalDensity1D('x', x, { weights, bandwidth: 0.15, range: [-1.6, 1.6], gridPoints: 65 });
    const fromR: Array<[number, number]> = [[-1.4, 0.17754314240249122], [-0.5, 0.43211634266136029], [0, 0.33618116080106392], [0.35, 0.41546085977816855], [1.2, 0.26269215530527451]];
    for (const [point, density] of fromR) {
      const index = Math.round((point + 1.6) / 0.05);
      expect(marginal.x[index]).toBeCloseTo(point, 12);
      expect(Math.abs(marginal.density[index] / density - 1)).toBeLessThan(BINNING_TOLERANCE);
    }
  });

  it('uses the Kish effective count of the weights in the bandwidth rule', () => {
    const { x, weights } = referencePoints();
    const marginal = marginalDensity1D('x', x, { weights });
    let sum = 0, sumSquares = 0, mean = 0;
    for (let i = 0; i < x.length; i++) { sum += weights[i]; sumSquares += weights[i] ** 2; mean += weights[i] * x[i]; }
    mean /= sum;
    let squared = 0;
    for (let i = 0; i < x.length; i++) squared += weights[i] * (x[i] - mean) ** 2;
    const sd = Math.sqrt(squared / (sum - sumSquares / sum));
    expect(marginal.bandwidth).toBeCloseTo(sd * Math.pow((sum * sum) / sumSquares, -1 / 5), 12);
  });

  it('removes the edge sag of a half-normal sample by reflection at a hard lower bound', () => {
    // |N(0,1)| has density 2 phi(0) = 0.7979 at 0. The reflected estimate is the symmetrized sample's,
    // so its mean at 0 is 2 phi(0) / sqrt(1 + h^2) (a normal smoothed by a normal kernel; exact).
    // Its sd at an edge: sqrt(2 f(0) R(K) / (n h)), R(K) = 1 / (2 sqrt(pi)) (Silverman 1986, eq. 3.4
    // with the kernel folded at the edge): 0.0114 for n = 50000; tolerance 4 sd.
    const count = 50_000;
    const stream = createRandomStream('half-normal-edge');
    const values = Float64Array.from({ length: count }, () => Math.abs(stream.normal()));
    const reflected = marginalDensity1D('sigma_int', values, { bounds: { lower: 0 } });
    const h = reflected.bandwidth;
    const atEdge = 2 / Math.sqrt(2 * Math.PI);
    const sd = Math.sqrt((2 * atEdge * (1 / (2 * Math.sqrt(Math.PI)))) / (count * h));
    expect(reflected.x[0]).toBe(0);
    expect(Math.abs(reflected.density[0] - atEdge / Math.sqrt(1 + h * h))).toBeLessThan(4 * sd);
    // A plain estimate on the same grid drops to about half the true value at the edge.
    const plain = marginalDensity1D('sigma_int', values, { range: [0, reflected.x[reflected.x.length - 1]], bandwidth: h });
    expect(plain.density[0]).toBeLessThan(0.6 * atEdge);
    // The reflected estimate keeps all of its mass inside [0, inf) (trapezoid rule over the grid).
    const step = reflected.x[1] - reflected.x[0];
    let mass = 0;
    for (let j = 1; j < reflected.x.length; j++) mass += 0.5 * step * (reflected.density[j] + reflected.density[j - 1]);
    expect(Math.abs(mass - 1)).toBeLessThan(2e-3); // trapezoid error with the kink at 0, measured 1e-4
  });

  it('keeps a uniform sample flat up to both hard edges', () => {
    // Uniform on [0, 1]: density 1; sd at an edge sqrt(2 R(K) / (n h)) = 0.018 for n = 50000, tolerance 4 sd.
    const count = 50_000;
    const stream = createRandomStream('uniform-edges');
    const values = Float64Array.from({ length: count }, () => stream.uniform());
    const marginal = marginalDensity1D('omega_m', values, { bounds: { lower: 0, upper: 1 }, gridPoints: 101 });
    const sd = Math.sqrt((2 / (2 * Math.sqrt(Math.PI))) / (count * marginal.bandwidth));
    expect(marginal.x[0]).toBe(0);
    expect(marginal.x[100]).toBe(1);
    expect(Math.abs(marginal.density[0] - 1)).toBeLessThan(4 * sd);
    expect(Math.abs(marginal.density[100] - 1)).toBeLessThan(4 * sd);
    expect(Math.abs(marginal.density[50] - 1)).toBeLessThan(4 * sd);
  });

  it('refuses a grid of fewer than two points', () => {
    try {
      marginalDensity1D('w0', [0, 1, 2], { gridPoints: 1 });
      expect.unreachable();
    } catch (error) {
      expect(isCandelaError(error) && error.issues[0].code).toBe('math.bad_grid');
    }
  });
});

describe('densityGrid2D', () => {
  it('matches MASS::kde2d (direct product-kernel sums) on the same grid', () => {
    // R 4.2.2 MASS::kde2d(x, y, h = 4 * c(0.21, 0.17), n = c(25, 20), lims = c(-1.6, 1.6, -1.5, 1.4)).
    const { x, y } = referencePoints();
    const grid = densityGrid2D('x', x, 'y', y, { xRange: [-1.6, 1.6], yRange: [-1.5, 1.4], gridPoints: [25, 20], bandwidthX: 0.21, bandwidthY: 0.17 });
    const fromR: Array<[number, number, number]> = [
      [0, 0, 0.022228080560097091], [12, 9, 0.42250101632363446], [6, 14, 0.16768333576426134],
      [19, 3, 0.047906113598577257], [24, 19, 0.016874340388341621], [9, 11, 0.30901519613195028],
    ];
    for (const [ix, iy, density] of fromR) {
      expect(Math.abs(grid.density[iy * 25 + ix] / density - 1)).toBeLessThan(BINNING_TOLERANCE);
    }
    expect(grid.x[24]).toBe(1.6);
    expect(grid.y[19]).toBe(1.4);
  });

  it('reflects at hard bounds on each axis, so a uniform square stays flat at its corner', () => {
    // Uniform on [0, 1]^2: density 1 everywhere, also at the corner (0, 0) where three images enter.
    // sd at a corner: sqrt(4 R(K)^2 / (n hx hy)) = 0.04 for n = 50000; tolerance 4 sd.
    const count = 50_000;
    const stream = createRandomStream('uniform-square');
    const x = Float64Array.from({ length: count }, () => stream.uniform());
    const y = Float64Array.from({ length: count }, () => stream.uniform());
    const grid = densityGrid2D('omega_m', x, 'omega_de', y, { xBounds: { lower: 0, upper: 1 }, yBounds: { lower: 0, upper: 1 }, gridPoints: 41 });
    const kernelRoughness = 1 / (2 * Math.sqrt(Math.PI));
    const sd = Math.sqrt((4 * kernelRoughness ** 2) / (count * grid.bandwidthX * grid.bandwidthY));
    expect(Math.abs(grid.density[0] - 1)).toBeLessThan(4 * sd);
    expect(Math.abs(grid.density[41 * 41 - 1] - 1)).toBeLessThan(4 * sd);
    expect(Math.abs(grid.density[20 * 41 + 20] - 1)).toBeLessThan(4 * sd);
    // Without bounds the same kernels give about 1/4 at the corner (a quarter of each kernel is inside).
    const plain = densityGrid2D('omega_m', x, 'omega_de', y, { xRange: [0, 1], yRange: [0, 1], gridPoints: 41, bandwidthX: grid.bandwidthX, bandwidthY: grid.bandwidthY });
    expect(plain.density[0]).toBeLessThan(0.5);
  });
});
