import type { Prior } from './prior.js';

/**
 * Default priors of the population parameters of the hierarchical term, by
 * base name (a per-sample name `<base>_<sample>` gets the prior of its base):
 *
 * - x1_mean: uniform(-3, 3). Light-curve samples are cut at |x1| < 3
 *   (common practice), so a population mean lies inside.
 * - x1_width: log-uniform(0.05, 5). A scale parameter: flat in ln width
 *   (Jeffreys 1961, Theory of Probability) over two decades around the
 *   observed width of about 1 (from memory).
 * - color_mean: uniform(-0.3, 0.3) mag. Samples are cut at |c| < 0.3
 *   (common practice).
 * - color_width: log-uniform(0.005, 0.5) mag. Scale parameter as above, two
 *   decades around the observed width of about 0.1 mag (from memory).
 * - x1_mean_slope: uniform(-5, 5) per unit redshift; color_mean_slope:
 *   uniform(-0.5, 0.5) mag per unit redshift. Wide enough that a drift of
 *   the whole cut range across z ~ 1 stays inside.
 *
 * The bounds are wide: with tens of supernovae per population the data
 * dominate. Log-uniform widths keep the sampler away from width = 0, where
 * the term returns -Infinity.
 */
export const HIERARCHICAL_POPULATION_PRIORS: Readonly<Record<string, Prior>> = {
  x1_mean: { kind: 'uniform', min: -3, max: 3 },
  x1_width: { kind: 'log_uniform', min: 0.05, max: 5 },
  color_mean: { kind: 'uniform', min: -0.3, max: 0.3 },
  color_width: { kind: 'log_uniform', min: 0.005, max: 0.5 },
  x1_mean_slope: { kind: 'uniform', min: -5, max: 5 },
  color_mean_slope: { kind: 'uniform', min: -0.5, max: 0.5 },
};

const BASES = ['x1_mean', 'x1_width', 'color_mean', 'color_width'];

/**
 * The default prior of every population parameter among `names` (other
 * names are skipped), e.g. for the hierarchical term's `requires`.
 * Cost O(names). Never throws.
 * @param names parameter names, possibly suffixed with `_<sample>`
 * @returns name -> Prior (units: those of the parameter)
 * @example hierarchicalPopulationPriors(['omega_m', 'x1_width_north']) // { x1_width_north: { kind: 'log_uniform', min: 0.05, max: 5 } }
 */
export function hierarchicalPopulationPriors(names: readonly string[]): Record<string, Prior> {
  const priors: Record<string, Prior> = {};
  for (const name of names) {
    const base = Object.hasOwn(HIERARCHICAL_POPULATION_PRIORS, name) ? name : BASES.find((candidate) => name.startsWith(`${candidate}_`));
    if (base) priors[name] = { ...HIERARCHICAL_POPULATION_PRIORS[base] };
  }
  return priors;
}
