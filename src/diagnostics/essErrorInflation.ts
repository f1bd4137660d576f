import { CandelaError } from '../errors.js';

/**
 * The factor by which a Monte Carlo error computed as if `drawCount` draws
 * were independent grows when, being autocorrelated, they are worth only
 * `effectiveSampleSize` independent ones: sqrt(drawCount / ESS), from the
 * Monte Carlo standard error of a mean sd / sqrt(ESS) (Vehtari, Gelman,
 * Simpson, Carpenter & Buerkner 2021, sec. 3.2; Geyer 1992). Never below 1:
 * fewer draws than the ESS (e.g. a thinned subset) are taken as independent
 * (common practice).
 *
 * Cost: O(1).
 * @param drawCount draws the error was computed from (> 0).
 * @param effectiveSampleSize their effective sample size, draws (> 0; e.g. the smallest bulk ESS of a run).
 * @returns max(1, sqrt(drawCount / effectiveSampleSize)), dimensionless.
 * @throws CandelaError `diagnostics.bad_effective_sample_size` when either count is not a positive finite number.
 * @example essErrorInflation(4000, 1000) // 2
 */
export function essErrorInflation(drawCount: number, effectiveSampleSize: number): number {
  for (const [name, value] of [['draw count', drawCount], ['effective sample size', effectiveSampleSize]] as const) {
    if (!(value > 0) || !Number.isFinite(value)) {
      throw new CandelaError({
        code: 'diagnostics.bad_effective_sample_size', message: `the ${name} must be a positive finite number`,
        expected: '> 0', found: String(value), fix: 'pass the counts of a run that has draws',
      });
    }
  }
  return Math.sqrt(Math.max(1, drawCount / effectiveSampleSize));
}
