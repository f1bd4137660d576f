import { describe, expect, it } from 'vitest';
import { createRandomStream, densityGrid2D, marginalDensity1D } from '../../../src/math/index.js';
import {
  contourGeoJson, contourPathsCsv, contourThresholdsJson, credibleContours, credibleRegionArea, credibleRegionContains,
  credibleThresholds, densityGridCsv, marginalDensityCsv, ONE_SIGMA_MASS, TWO_SIGMA_MASS,
} from '../../../src/output/index.js';
import type { ContourSet2D, DensityGrid2D } from '../../../src/output/index.js';
import { DET, deltaChiSquare, gaussianDraws, MEAN_X, MEAN_Y, RHO, SD_X, SD_Y, trueMassInsideEllipse } from './correlatedGaussian.js';

/** The exact Gaussian density on a grid (no sampling), as densityGrid2D would lay it out. */
function exactGaussianGrid(nx: number, ny: number): DensityGrid2D {
  const x = Float64Array.from({ length: nx }, (_, i) => MEAN_X - 4.5 * SD_X + (9 * SD_X * i) / (nx - 1));
  const y = Float64Array.from({ length: ny }, (_, j) => MEAN_Y - 4.5 * SD_Y + (9 * SD_Y * j) / (ny - 1));
  const density = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const dx = x[i] - MEAN_X;
      const dy = y[j] - MEAN_Y;
      const chi2 = (SD_Y * SD_Y * dx * dx - 2 * RHO * SD_X * SD_Y * dx * dy + SD_X * SD_X * dy * dy) / DET;
      density[j * nx + i] = Math.exp(-chi2 / 2) / (2 * Math.PI * Math.sqrt(DET));
    }
  }
  return { xParameter: 'omega_m', yParameter: 'w0', x, y, density, bandwidthX: 0, bandwidthY: 0 };
}

function signedArea(ring: number[][]): number {
  let twice = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) twice += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return twice / 2;
}

describe('credibleThresholds', () => {
  it('sums sorted grid values until the mass is reached, interpolating between neighbours', () => {
    // By hand: total 10; 70% = 7 = 4 + 3 -> level 3; 55% = 5.5 lies halfway into the cell of value 3 -> 4 - 0.5 = 3.5.
    expect(credibleThresholds(Float64Array.of(1, 4, 2, 3), [0.7, 0.55])).toEqual([3, 3.5]);
  });
  it('finds the analytic density level (1 - m) / (2 pi sqrt(det)) of a Gaussian on a grid', () => {
    // Level of the Delta chi^2 ellipse: exp(-Delta chi^2 / 2) / (2 pi sqrt(det)) = (1 - m) / (2 pi sqrt(det)).
    // Sorting cells counts whole grid points inside a curve, so the level carries a lattice-counting error:
    // measured 0.5% and 0.7% on this 181 x 151 grid (0.26% / 0.08% on 301 x 301, 0.02% / 0.08% on 601 x 601).
    // Tolerance 1%.
    const grid = exactGaussianGrid(181, 151);
    const levels = credibleThresholds(grid.density, [ONE_SIGMA_MASS, TWO_SIGMA_MASS]);
    expect(Math.abs(levels[0] / ((1 - ONE_SIGMA_MASS) / (2 * Math.PI * Math.sqrt(DET))) - 1)).toBeLessThan(0.01);
    expect(Math.abs(levels[1] / ((1 - TWO_SIGMA_MASS) / (2 * Math.PI * Math.sqrt(DET))) - 1)).toBeLessThan(0.01);
  });
});

describe('credibleContours of an exact Gaussian grid', () => {
  const grid = exactGaussianGrid(181, 151);
  const set = credibleContours(grid);
  it('traces the Delta chi^2 = 2.30 and 6.18 ellipses: area pi sqrt(det) Delta chi^2, centre and half-widths sd sqrt(Delta chi^2)', () => {
    // Press et al., Numerical Recipes, section 15.6: the region of mass m for 2 parameters is Delta chi^2 < -2 ln(1 - m);
    // an ellipse x^T S^-1 x < c has area pi sqrt(det S) c and half-widths sqrt(c S_xx), sqrt(c S_yy).
    // Tolerance 1% from the level's lattice error above (measured area errors 0.5% and 0.2%). The centre
    // does not depend on the level: it must sit on the mean within a tenth of a grid step, which catches any
    // half-cell shift in the grid-index to parameter mapping.
    expect(set.regions.map((region) => region.mass)).toEqual([ONE_SIGMA_MASS, TWO_SIGMA_MASS]);
    const stepX = grid.x[1] - grid.x[0];
    const stepY = grid.y[1] - grid.y[0];
    for (const region of set.regions) {
      const c = deltaChiSquare(region.mass);
      expect(Math.abs(credibleRegionArea(region) / (Math.PI * Math.sqrt(DET) * c) - 1)).toBeLessThan(0.01);
      const ring = region.geometry.coordinates[0][0];
      const xs = ring.map((point) => point[0]);
      const ys = ring.map((point) => point[1]);
      expect(Math.abs((Math.max(...xs) + Math.min(...xs)) / 2 - MEAN_X)).toBeLessThan(0.1 * stepX);
      expect(Math.abs((Math.max(...ys) + Math.min(...ys)) / 2 - MEAN_Y)).toBeLessThan(0.1 * stepY);
      expect(Math.abs((Math.max(...xs) - Math.min(...xs)) / 2 / (SD_X * Math.sqrt(c)) - 1)).toBeLessThan(0.01);
      expect(Math.abs((Math.max(...ys) - Math.min(...ys)) / 2 / (SD_Y * Math.sqrt(c)) - 1)).toBeLessThan(0.01);
    }
  });
  it('writes closed rings with the exterior counterclockwise (RFC 7946, section 3.1.6)', () => {
    for (const region of set.regions) {
      expect(region.geometry.coordinates.length).toBe(1);
      const ring = region.geometry.coordinates[0][0];
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      expect(signedArea(ring)).toBeGreaterThan(0);
    }
  });
});

describe('credibleContours of 20,000 Gaussian samples', () => {
  // Scott's kernel widens the estimate: its expectation is the Gaussian convolved with the kernel, covariance
  // Sigma + diag(hx^2, hy^2) (a normal convolved with a normal), so the regions follow the ellipses of that
  // matrix: area pi sqrt(det(Sigma + H)) Delta chi^2, about 5.6% above pi sqrt(det Sigma) Delta chi^2 at n = 20000.
  // Monte Carlo error of the area: sd(ln sqrt(det S)) = 1/sqrt(n) for a sample covariance S of n draws in 2-D
  // (Var ln det S = 2p/n, Anderson 2003, An Introduction to Multivariate Statistical Analysis, section 7.5), 0.0071;
  // measured over 8 seeds: 0.007 (68%) and 0.005 (95%). Tolerance 4/sqrt(n) = 2.8%.
  const count = 20_000;
  const { x, y } = gaussianDraws('gaussian-contours', count);
  const set = credibleContours(densityGrid2D('omega_m', x, 'w0', y));
  const { bandwidthX, bandwidthY } = set.grid;
  const smoothed: [number, number, number] = [SD_X * SD_X + bandwidthX * bandwidthX, RHO * SD_X * SD_Y, SD_Y * SD_Y + bandwidthY * bandwidthY];
  const smoothedDet = smoothed[0] * smoothed[2] - smoothed[1] * smoothed[1];

  it('encloses the smoothed Delta chi^2 = 2.30 and 6.18 ellipses by area', () => {
    expect(bandwidthX).toBeCloseTo(SD_X * Math.pow(count, -1 / 6), 1); // Scott 1992, d = 2
    for (const region of set.regions) {
      const c = deltaChiSquare(region.mass);
      const area = credibleRegionArea(region);
      expect(Math.abs(area / (Math.PI * Math.sqrt(smoothedDet) * c) - 1)).toBeLessThan(4 / Math.sqrt(count));
      // And it is larger than the unsmoothed analytic ellipse by the kernel's widening only.
      const widening = Math.sqrt(smoothedDet / DET);
      expect(area / (Math.PI * Math.sqrt(DET) * c)).toBeGreaterThan(widening * (1 - 4 / Math.sqrt(count)));
      expect(area / (Math.PI * Math.sqrt(DET) * c)).toBeLessThan(widening * (1 + 4 / Math.sqrt(count)));
    }
  });

  it('holds the expected fraction of an independent sample', () => {
    // Expected: the true mass inside the smoothed ellipse (trueMassInsideEllipse): 0.703 and 0.962 here.
    // Error: binomial sqrt(P (1 - P) / N) for N = 20000 test draws (0.0032, 0.0014) combined with the region's own
    // noise, (c/2) exp(-c/2) x 0.0071 (0.0026, 0.0010); tolerance 4 combined sd: 0.016 and 0.007.
    const test = gaussianDraws('gaussian-contours-test', count);
    for (const region of set.regions) {
      const c = deltaChiSquare(region.mass);
      // The helper's own check: for the unsmoothed matrix it gives the chi-square law 1 - exp(-c/2) = m.
      expect(trueMassInsideEllipse([SD_X * SD_X, RHO * SD_X * SD_Y, SD_Y * SD_Y], c)).toBeCloseTo(region.mass, 12);
      const expected = trueMassInsideEllipse(smoothed, c);
      let inside = 0;
      for (let i = 0; i < count; i++) if (credibleRegionContains(region, test.x[i], test.y[i])) inside++;
      const binomial = Math.sqrt((expected * (1 - expected)) / count);
      const regionNoise = (c / 2) * Math.exp(-c / 2) / Math.sqrt(count);
      expect(Math.abs(inside / count - expected)).toBeLessThan(4 * Math.hypot(binomial, regionNoise));
    }
  });
});

describe('credibleContours at a hard prior edge', () => {
  it('ends the regions exactly on the edge, never outside it', () => {
    const stream = createRandomStream('edge-contours');
    const x = Float64Array.from({ length: 20_000 }, () => Math.abs(stream.normal()) * 0.05);
    const y = Float64Array.from({ length: 20_000 }, () => stream.normal());
    const set = credibleContours(densityGrid2D('sigma_int', x, 'abs_mag', y, { xBounds: { lower: 0 }, gridPoints: 64 }));
    const xs = set.regions.flatMap((region) => region.geometry.coordinates.flat(2).map((point) => point[0]));
    expect(Math.min(...xs)).toBe(0);
  });
});

describe('density and contour files', () => {
  const { x, y } = gaussianDraws('gaussian-files', 2000);
  const set: ContourSet2D = credibleContours(densityGrid2D('omega_m', x, 'w0', y, { gridPoints: [30, 20] }));

  it('contourGeoJson writes an RFC 7946 FeatureCollection of MultiPolygons that says its coordinates are parameters', () => {
    const document = JSON.parse(contourGeoJson(set));
    expect(document.type).toBe('FeatureCollection');
    expect(document.features).toHaveLength(2);
    for (const [k, feature] of document.features.entries()) {
      expect(feature.type).toBe('Feature');
      expect(feature.geometry.type).toBe('MultiPolygon');
      expect(feature.geometry.coordinates).toEqual(set.regions[k].geometry.coordinates);
      expect(feature.properties).toMatchObject({ mass: set.regions[k].mass, threshold: set.regions[k].threshold, xParameter: 'omega_m', yParameter: 'w0' });
      expect(feature.properties.coordinateSpace).toMatch(/not longitude\/latitude/);
    }
  });

  it('contourPathsCsv writes one row per vertex with mass, polygon, ring and point numbers', () => {
    const lines = contourPathsCsv(set).trimEnd().split('\n');
    expect(lines[0]).toBe('mass,polygon,ring,point,omega_m,w0');
    const vertices = set.regions.reduce((sum, region) => sum + region.geometry.coordinates.flat(1).reduce((s, ring) => s + ring.length, 0), 0);
    expect(lines).toHaveLength(vertices + 1);
    const first = set.regions[0].geometry.coordinates[0][0][0];
    expect(lines[1]).toBe(`${ONE_SIGMA_MASS},0,0,0,${first[0]},${first[1]}`);
  });

  it('densityGridCsv runs x fastest and contourThresholdsJson lists the levels with their areas', () => {
    const lines = densityGridCsv(set.grid).trimEnd().split('\n');
    expect(lines).toHaveLength(30 * 20 + 1);
    expect(lines[0]).toBe('omega_m,w0,density');
    expect(lines[2]).toBe(`${set.grid.x[1]},${set.grid.y[0]},${set.grid.density[1]}`);
    expect(lines[31]).toBe(`${set.grid.x[0]},${set.grid.y[1]},${set.grid.density[30]}`);
    const levels = JSON.parse(contourThresholdsJson(set));
    expect(Object.keys(levels)).toEqual(['x_parameter', 'y_parameter', 'bandwidth_x', 'bandwidth_y', 'grid_points', 'x_range', 'y_range', 'levels']);
    expect(levels.grid_points).toEqual([30, 20]);
    expect([levels.x_parameter, levels.y_parameter]).toEqual(['omega_m', 'w0']);
    expect(levels.levels[1]).toEqual({ mass: TWO_SIGMA_MASS, threshold: set.regions[1].threshold, area: credibleRegionArea(set.regions[1]) });
  });

  it('marginalDensityCsv writes the grid and the density, numbers read back exactly', () => {
    const marginal = marginalDensity1D('omega_m', x, { gridPoints: 16 });
    const lines = marginalDensityCsv(marginal).trimEnd().split('\n');
    expect(lines[0]).toBe('omega_m,density');
    expect(lines).toHaveLength(17);
    const [value, density] = lines[5].split(',').map(Number);
    expect(value).toBe(marginal.x[4]);
    expect(density).toBe(marginal.density[4]);
  });
});
