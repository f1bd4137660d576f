import { CandelaError } from '../errors.js';
import type { Issue } from '../errors.js';

/**
 * Fewest draws a chain half may have: the multi-chain effective sample size
 * needs at least three draws per (split) chain (Vehtari et al. 2021, as the
 * reference implementation requires), so a chain needs six.
 */
export const MINIMUM_DRAWS_PER_CHAIN = 6;

/**
 * Draws whose spread (max - min) is below this are constant: R-hat and ESS are
 * undefined for them. Double-precision epsilon, the threshold of the reference
 * implementation (R package posterior 1.4.0, `is_constant`).
 */
export const CONSTANT_SPREAD_TOLERANCE = Number.EPSILON;

/**
 * Problems that make a set of chains unusable for R-hat/ESS: no chains,
 * unequal lengths, too few draws, non-finite draws. Returns [] when fine.
 * Paths read `chains[2]` (0-based chain; `label` replaces "chains") and rows are 1-based draws.
 */
export function findChainProblems(chains: readonly Float64Array[], minimumDraws = MINIMUM_DRAWS_PER_CHAIN, label = 'chains'): Issue[] {
  if (chains.length === 0) {
    return [{ code: 'diagnostics.no_chains', message: `no ${label} were given`, expected: `at least one of the ${label}`, found: '0' }];
  }
  const issues: Issue[] = [];
  const drawCount = chains[0].length;
  chains.forEach((chain, chainIndex) => {
    if (chain.length !== drawCount) {
      issues.push({
        code: 'diagnostics.unequal_chains',
        message: `${label} have different lengths`,
        path: `${label}[${chainIndex}]`,
        expected: `${drawCount} draws like ${label}[0]`,
        found: `${chain.length} draws`,
        fix: 'cut every series to the same number of draws',
      });
      return;
    }
    for (let draw = 0; draw < chain.length; draw++) {
      if (!Number.isFinite(chain[draw])) {
        issues.push({ code: 'diagnostics.non_finite_draw', message: 'a draw is not a finite number', path: `${label}[${chainIndex}]`, row: draw + 1, found: String(chain[draw]) });
        return;
      }
    }
  });
  if (drawCount < minimumDraws) {
    issues.push({
      code: 'diagnostics.too_few_draws',
      message: `${label} are too short for convergence diagnostics`,
      expected: `at least ${minimumDraws} draws each`,
      found: `${drawCount} draws`,
      fix: 'run the sampler longer or use a shorter burn-in',
    });
  }
  return issues;
}

/** Throws a CandelaError listing every problem {@link findChainProblems} finds. */
export function assertUsableChains(chains: readonly Float64Array[], minimumDraws = MINIMUM_DRAWS_PER_CHAIN, label = 'chains'): void {
  const issues = findChainProblems(chains, minimumDraws, label);
  if (issues.length > 0) throw new CandelaError(issues);
}

/** True when every draw of every chain lies within {@link CONSTANT_SPREAD_TOLERANCE} of the others. */
export function isConstant(chains: readonly Float64Array[]): boolean {
  let smallest = Infinity;
  let largest = -Infinity;
  for (const chain of chains) {
    for (let draw = 0; draw < chain.length; draw++) {
      const value = chain[draw];
      if (value < smallest) smallest = value;
      if (value > largest) largest = value;
    }
  }
  return Math.abs(largest - smallest) < CONSTANT_SPREAD_TOLERANCE;
}

/**
 * Throws `diagnostics.constant_draws` when the draws are constant, naming
 * the quantity that is then undefined.
 */
export function assertNotConstant(chains: readonly Float64Array[], quantity: string): void {
  if (isConstant(chains)) {
    throw new CandelaError({
      code: 'diagnostics.constant_draws',
      message: `${quantity} is undefined because every draw has the same value`,
      expected: 'draws that vary',
      found: `all draws equal ${chains[0][0]}`,
      fix: 'check that the parameter is free and that the walkers move',
    });
  }
}
