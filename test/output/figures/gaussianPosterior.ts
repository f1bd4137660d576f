// Test helper: exact densities of a correlated bivariate Gaussian posterior, in the shapes the
// figure functions take. The highest-density region holding mass p of a 2-D Gaussian is the
// ellipse chi^2 = -2 ln(1 - p) (exact for two degrees of freedom; e.g. Press et al.,
// Numerical Recipes, section 15.6: 2.30 for 68.3%, 6.18 for 95.4%).
import type { ContourSet2D, MarginalDensity1D } from '../../../src/output/density/densityTypes.js';

export interface GaussianSpec {
  parameters: string[];
  means: number[];
  sigmas: number[];
  /** Correlation of each pair, keyed `i,j` with i < j (default 0). */
  correlations?: Record<string, number>;
}

const MASSES = [0.6827, 0.9545];

export function gaussianMarginals(spec: GaussianSpec, points = 81): MarginalDensity1D[] {
  return spec.parameters.map((parameter, index) => {
    const x = Float64Array.from({ length: points }, (_, k) => spec.means[index] + spec.sigmas[index] * (-5 + (10 * k) / (points - 1)));
    const density = x.map((value) => Math.exp(-0.5 * ((value - spec.means[index]) / spec.sigmas[index]) ** 2) / (spec.sigmas[index] * Math.sqrt(2 * Math.PI)));
    return { parameter, x, density, bandwidth: spec.sigmas[index] / 10 };
  });
}

export function gaussianContours(spec: GaussianSpec, vertices = 64): ContourSet2D[] {
  const sets: ContourSet2D[] = [];
  for (let i = 0; i < spec.parameters.length; i++) {
    for (let j = i + 1; j < spec.parameters.length; j++) {
      const rho = spec.correlations?.[`${i},${j}`] ?? 0;
      const regions = MASSES.map((mass) => {
        const radius = Math.sqrt(-2 * Math.log(1 - mass));
        const ring: number[][] = [];
        for (let k = 0; k <= vertices; k++) {
          const angle = (2 * Math.PI * (k % vertices)) / vertices;
          // Cholesky factor of the correlation matrix maps the unit circle onto the ellipse.
          const u = Math.cos(angle);
          const v = rho * Math.cos(angle) + Math.sqrt(1 - rho * rho) * Math.sin(angle);
          ring.push([spec.means[i] + radius * spec.sigmas[i] * u, spec.means[j] + radius * spec.sigmas[j] * v]);
        }
        return { mass, threshold: Math.exp(-0.5 * radius * radius), geometry: { type: 'MultiPolygon' as const, coordinates: [[ring]] } };
      });
      const grid = { xParameter: spec.parameters[i], yParameter: spec.parameters[j], x: new Float64Array(0), y: new Float64Array(0), density: new Float64Array(0), bandwidthX: 0, bandwidthY: 0 };
      sets.push({ grid, regions: regions.reverse() });
    }
  }
  return sets;
}
