import { blindingNotice } from '../blinding/blindingNotice.js';
import type { MarginalDensity1D } from '../density/densityTypes.js';
import { summaryTerminal } from '../tables/summaryTerminal.js';
import { terminalMarginals } from '../tables/terminalMarginals.js';
import type { GoodnessOfFit } from './goodnessOfFit.js';
import type { RunSummary } from './runSummary.js';
import type { RunWarning } from './runWarning.js';

/** Terminal width the after-fit display is laid out for (columns). */
export const TERMINAL_COLUMNS = 80;

/** The facts of one finished run that the terminal shows after a fit. */
export interface RunTerminalFacts {
  /** Blinded parameter names, in the run's order (empty: the run is not blinded). */
  blindedParameters: readonly string[];
  modelLabel: string;
  /** Why the sampler stopped (`converged`, `max_steps`, ...). */
  stopReason: string;
  steps: number;
  burnInSteps: number;
  keptSamples: number;
  summary: RunSummary;
  /** The stopping targets the table marks against: largest R-hat and smallest bulk ESS. */
  maxRhat: number;
  targetEss: number;
  marginals: readonly MarginalDensity1D[];
  /** Chi-square at the best fit (null when the likelihood has none), its degrees of freedom and data points. */
  chiSquare: number | null;
  degreesOfFreedom: number;
  dataPoints: number;
  /** Per likelihood term (listed only when there are several). */
  terms: ReadonlyArray<{ name: string; chiSquare: number | null; dataPoints: number }>;
  goodness: GoodnessOfFit | null;
  warnings: readonly RunWarning[];
  /** The run folder, as the user should read it. */
  runDir: string;
}

/**
 * What `candela fit` prints after a run, laid out for 80 columns: the
 * BLINDED notice when the run is blinded, one line of how the run stopped, a
 * compact table (parameter, mean ± sd, 68% interval, R-hat, ESS), small text
 * marginals, the chi-square at the best fit (with its per-degree-of-freedom
 * value and p-value, and one line per term when there are several), every
 * warning, and where the outputs are.
 *
 * Cost: O(parameters x marginal grid points).
 * @param facts the run's facts.
 * @returns the text, lines joined by '\n', no final line break.
 * @throws nothing.
 * @example runTerminalText(facts).split('\n')[0] // '== flat_lcdm: converged after 1000 steps (burn-in 26), 124672 samples kept'
 */
export function runTerminalText(facts: RunTerminalFacts): string {
  const blinded = facts.blindedParameters;
  const lines = [
    ...(blinded.length ? [`== ${blindingNotice(blinded)}`] : []),
    `== ${facts.modelLabel}: ${facts.stopReason} after ${facts.steps} steps (burn-in ${facts.burnInSteps}), ${facts.keptSamples} samples kept`,
    summaryTerminal(facts.summary, { width: TERMINAL_COLUMNS, rHatMax: facts.maxRhat, essMin: facts.targetEss }),
    terminalMarginals(facts.marginals, { width: TERMINAL_COLUMNS - 20, height: 4 }),
  ];
  const goodness = facts.goodness;
  if (facts.chiSquare !== null) lines.push(`chi^2 at best fit = ${facts.chiSquare.toFixed(2)} for ${facts.degreesOfFreedom} degrees of freedom (${facts.dataPoints} data points)${goodness ? `; per degree of freedom ${goodness.reducedChiSquare.toFixed(3)}, p-value ${goodness.pValue.toPrecision(3)}` : ''}`);
  if (facts.terms.length > 1) for (const term of facts.terms) lines.push(`  ${term.name}: chi^2 = ${term.chiSquare === null ? 'n/a' : term.chiSquare.toFixed(2)} for ${term.dataPoints} data points`);
  for (const warning of facts.warnings) lines.push(`warning [${warning.code}${warning.parameter ? `, ${warning.parameter}` : ''}]: ${warning.message}`);
  lines.push(`outputs: ${facts.runDir} (report.html, summary.json, summary.md, table.tex, chains.csv, figures/, contours/, marginals/)`);
  return lines.join('\n');
}
