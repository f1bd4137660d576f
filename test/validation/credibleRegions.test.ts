import { describe, expect, it } from 'vitest';
import { densityGrid2D } from '../../src/math/index.js';
import { credibleContours, credibleRegionArea, credibleRegionContains } from '../../src/output/index.js';
import { DET, deltaChiSquare, gaussianDraws, RHO, SD_X, SD_Y, trueMassInsideEllipse } from '../output/density/correlatedGaussian.js';

// Statistical validation of the smoothed credible regions on a correlated 2-D Gaussian (sd 1 and 2,
// correlation 0.6), over many seeds. For each seed: the region of mass m from densityGrid2D (Scott bandwidth)
// + credibleContours, compared with the ellipse Delta chi^2 = -2 ln(1 - m) (Press et al., Numerical Recipes,
// section 15.6) of the kernel-widened covariance Sigma + diag(hx^2, hy^2):
// - area ratio: mean over seeds within 4 standard errors of 1 plus the lattice error of the cell-sorting level
//   (under 1%, see test/output/density/credibleContours.test.ts); spread close to 1/sqrt(n) (sample covariance);
// - fraction of an independent sample inside: mean within 4 standard errors of the true mass of the widened
//   ellipse (trueMassInsideEllipse).

interface Outcome { areaRatio: number[]; fractionExcess: number[]; widening: number[] }

function run(replicates: number, count: number, label: string): Outcome[] {
  const outcomes: Outcome[] = [0, 1].map(() => ({ areaRatio: [], fractionExcess: [], widening: [] }));
  for (let replicate = 0; replicate < replicates; replicate++) {
    const { x, y } = gaussianDraws(`validation/${label}/${replicate}`, count);
    const set = credibleContours(densityGrid2D('omega_m', x, 'w0', y));
    const { bandwidthX, bandwidthY } = set.grid;
    const smoothed: [number, number, number] = [SD_X ** 2 + bandwidthX ** 2, RHO * SD_X * SD_Y, SD_Y ** 2 + bandwidthY ** 2];
    const smoothedDet = smoothed[0] * smoothed[2] - smoothed[1] ** 2;
    const test = gaussianDraws(`validation/${label}/${replicate}/test`, count);
    set.regions.forEach((region, level) => {
      const c = deltaChiSquare(region.mass);
      outcomes[level].areaRatio.push(credibleRegionArea(region) / (Math.PI * Math.sqrt(smoothedDet) * c));
      outcomes[level].widening.push(Math.sqrt(smoothedDet / DET));
      let inside = 0;
      for (let i = 0; i < count; i++) if (credibleRegionContains(region, test.x[i], test.y[i])) inside++;
      outcomes[level].fractionExcess.push(inside / count - trueMassInsideEllipse(smoothed, c));
    });
  }
  return outcomes;
}

function summarize(values: number[]): { mean: number; sd: number } {
  const mean = values.reduce((sum, value) => sum + value, 0) / values.length;
  const sd = Math.sqrt(values.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (values.length - 1));
  return { mean, sd };
}

function check(outcomes: Outcome[], replicates: number, count: number): void {
  for (const outcome of outcomes) {
    const area = summarize(outcome.areaRatio);
    const excess = summarize(outcome.fractionExcess);
    expect(Math.abs(area.mean - 1)).toBeLessThan(4 * area.sd / Math.sqrt(replicates) + 0.01);
    expect(area.sd).toBeLessThan(2 / Math.sqrt(count));
    expect(Math.abs(excess.mean)).toBeLessThan(4 * excess.sd / Math.sqrt(replicates) + 1e-3);
  }
}

describe('credible regions of a correlated Gaussian (fast subset)', () => {
  it('hold their mass and area over 3 seeds of 5000 draws', () => {
    const outcomes = run(3, 5000, 'fast');
    for (const outcome of outcomes) {
      for (const ratio of outcome.areaRatio) expect(Math.abs(ratio - 1)).toBeLessThan(4 / Math.sqrt(5000) + 0.01);
    }
  });
});

describe.skipIf(!process.env.CANDELA_VALIDATE)('credible regions of a correlated Gaussian (validation)', () => {
  it('hold their mass and area over 30 seeds of 20000 draws', () => {
    check(run(30, 20_000, 'full'), 30, 20_000);
  });
});
