import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { essBasic, essBulk, essMean, essTail, mcseMean, rankNormalizedSplitRhat, splitRhat } from '../../src/diagnostics/index.js';
import { readRecords } from './readReferenceChains.js';

// Source: test/diagnostics/fixtures/posterior_edge_reference.csv, computed by the R package
// posterior 1.4.0 (Debian r-cran-posterior, R 4.2.2) with fixtures/make_posterior_edge_cases.R
// from the draws in fixtures/posterior_edge_chains.csv. The cases reach the branches the
// shared reference does not: an odd chain length (the split drops the middle draw), heavy ties
// (average ranks, a quantile that falls on a tie), antithetic chains (ESS above the draw count),
// the ESS cap mn log10(mn), a single chain, the shortest allowed chains (7 draws) and a chain
// whose first half is constant. Values are printed with 15 significant digits.
// Tolerance: 1e-9 relative (the implementation follows the reference step by step, so only
// rounding differs; measured worst case 4.8e-15).
const RELATIVE_TOLERANCE = 1e-9;
const FIXTURES = 'test/diagnostics/fixtures';

const QUANTITIES = [
  ['rhat', rankNormalizedSplitRhat],
  ['rhat_basic', splitRhat],
  ['ess_bulk', essBulk],
  ['ess_tail', essTail],
  ['ess_basic', essBasic],
  ['ess_mean', essMean],
  ['mcse_mean', mcseMean],
] as const;

function readLongChains(path: string): Map<string, Float64Array[]> {
  const byCase = new Map<string, number[][]>();
  for (const row of readRecords(path)) {
    const chains = byCase.get(row.case) ?? [];
    const chainIndex = Number(row.chain) - 1;
    (chains[chainIndex] ??= []).push(Number(row.value));
    byCase.set(row.case, chains);
  }
  return new Map([...byCase].map(([name, chains]) => [name, chains.map((chain) => Float64Array.from(chain))]));
}

const chainsByCase = readLongChains(`${FIXTURES}/posterior_edge_chains.csv`);
const references = readRecords(`${FIXTURES}/posterior_edge_reference.csv`);

describe('diagnostics against the R package posterior 1.4.0 (edge cases)', () => {
  it('has the seven edge cases with their chain shapes', () => {
    const shapes = Object.fromEntries([...chainsByCase].map(([name, chains]) => [name, `${chains.length}x${chains[0].length}`]));
    expect(shapes).toEqual({
      odd_length: '3x101', heavy_ties: '4x60', antithetic: '2x200', alternating: '2x40',
      single_chain: '1x150', shortest: '4x7', stuck_half: '3x100',
    });
    expect(references.map((row) => row.case)).toEqual([...chainsByCase.keys()]);
  });
  for (const row of references) {
    describe(`case ${row.case}`, () => {
      for (const [column, compute] of QUANTITIES) {
        it(`${compute.name} reproduces ${column} = ${row[column]}`, () => {
          const expected = Number(row[column]);
          const found = compute(chainsByCase.get(row.case)!);
          expect(Math.abs(found - expected) / Math.abs(expected)).toBeLessThan(RELATIVE_TOLERANCE);
        });
      }
    });
  }
});
