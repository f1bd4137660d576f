import { describe, expect, it } from 'vitest';
import { marginalDensity1D } from '../../../src/math/index.js';
import { blindingNotice, runTerminalText, summaryTerminal, terminalMarginals, TERMINAL_COLUMNS, type RunTerminalFacts } from '../../../src/output/index.js';
import { HAND_BUILT_SUMMARY } from '../tables/handBuiltSummary.js';

// The after-fit terminal text is candela's own layout; the numbers are the
// invented ones of the tables' hand-built summary (no physics is checked).
// The chi-square line's rounding (2 decimals, 3 decimals per degree of
// freedom, 3 significant digits of p) is read off the text by hand.

const marginal = marginalDensity1D('omega_m', Float64Array.from({ length: 200 }, (_, i) => 0.25 + (i % 20) * 0.005));

function facts(overrides: Partial<RunTerminalFacts> = {}): RunTerminalFacts {
  return {
    blindedParameters: [],
    modelLabel: 'flat_w0wa',
    stopReason: 'converged',
    steps: 3000,
    burnInSteps: 113,
    keptSamples: 184768,
    summary: HAND_BUILT_SUMMARY,
    maxRhat: 1.01,
    targetEss: 2000,
    marginals: [marginal],
    chiSquare: 812.3456,
    degreesOfFreedom: 793,
    dataPoints: 800,
    terms: [{ name: 'supernovae', chiSquare: 812.3456, dataPoints: 800 }],
    goodness: { chiSquare: 812.3456, degreesOfFreedom: 793, reducedChiSquare: 812.3456 / 793, pValue: 0.3112345, flagged: false },
    warnings: [],
    runDir: 'out/kestrel',
    ...overrides,
  };
}

describe('runTerminalText', () => {
  it('prints the stop line, the 80-column table, the marginals, the chi-square line and the outputs, in that order', () => {
    const expected = [
      '== flat_w0wa: converged after 3000 steps (burn-in 113), 184768 samples kept',
      summaryTerminal(HAND_BUILT_SUMMARY, { width: 80, rHatMax: 1.01, essMin: 2000 }),
      terminalMarginals([marginal], { width: 60, height: 4 }),
      'chi^2 at best fit = 812.35 for 793 degrees of freedom (800 data points); per degree of freedom 1.024, p-value 0.311',
      'outputs: out/kestrel (report.html, summary.json, summary.md, table.tex, chains.csv, figures/, contours/, marginals/)',
    ].join('\n');
    expect(runTerminalText(facts())).toBe(expected);
    expect(TERMINAL_COLUMNS).toBe(80);
  });

  it('marks R-hat above the run target in the table (wa has R-hat 1.0124 > 1.01)', () => {
    expect(runTerminalText(facts())).toMatch(/1\.012!/);
    expect(runTerminalText(facts({ maxRhat: 1.02 }))).not.toMatch(/1\.012!/);
  });

  it('opens with the BLINDED notice when parameters are blinded', () => {
    const lines = runTerminalText(facts({ blindedParameters: ['w0', 'wa'] })).split('\n');
    expect(lines[0]).toBe(`== ${blindingNotice(['w0', 'wa'])}`);
    expect(lines[1]).toBe('== flat_w0wa: converged after 3000 steps (burn-in 113), 184768 samples kept');
  });

  it('lists the terms only when there are several, with n/a for a term without chi-square', () => {
    const text = runTerminalText(facts({
      terms: [{ name: 'supernovae', chiSquare: 790.5, dataPoints: 780 }, { name: 'bao', chiSquare: null, dataPoints: 20 }],
    }));
    expect(text).toContain('\n  supernovae: chi^2 = 790.50 for 780 data points\n  bao: chi^2 = n/a for 20 data points\n');
    expect(runTerminalText(facts())).not.toContain('  supernovae: chi^2');
  });

  it('leaves out the chi-square line without a chi-square, and the goodness part without a goodness of fit', () => {
    expect(runTerminalText(facts({ chiSquare: null }))).not.toContain('chi^2 at best fit');
    expect(runTerminalText(facts({ goodness: null }))).toContain('chi^2 at best fit = 812.35 for 793 degrees of freedom (800 data points)\n');
  });

  it('prints each warning with its code and, when it has one, its parameter, before the outputs line', () => {
    const lines = runTerminalText(facts({
      warnings: [
        { code: 'prior_edge', parameter: 'w0', message: 'w0 touches its prior edge', numbers: {} },
        { code: 'stuck_walkers', parameter: null, message: '2 walkers are stuck', numbers: { walkers: 2 } },
      ],
    })).split('\n');
    expect(lines.slice(-3)).toEqual([
      'warning [prior_edge, w0]: w0 touches its prior edge',
      'warning [stuck_walkers]: 2 walkers are stuck',
      'outputs: out/kestrel (report.html, summary.json, summary.md, table.tex, chains.csv, figures/, contours/, marginals/)',
    ]);
  });
});
