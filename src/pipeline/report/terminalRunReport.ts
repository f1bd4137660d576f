import { blindingNotice, summaryTerminal, terminalMarginals } from '../../output/index.js';
import { analyzeRun } from './analyzeRun.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';
import { readRunFolder } from '../run/runFiles.js';

/** Terminal width the after-fit display is laid out for (columns). */
const TERMINAL_COLUMNS = 80;

/**
 * What `candela fit` prints after a run: a compact table (parameter,
 * mean ± sd, 68% interval, R-hat, ESS) and small text marginals, readable in
 * 80 columns, followed by warnings and where the outputs are.
 */
export function terminalRunReport(runDir: string): string {
  const run = readRunFolder(runDir);
  const analysis = analyzeRun(run);
  const blinded = blindedParametersOf(run.record);
  const lines = [
    ...(blinded.length ? [`== ${blindingNotice(blinded)}`] : []),
    `== ${run.record.model.label}: ${run.record.run.stop_reason} after ${run.record.run.steps} steps (burn-in ${analysis.burnInSteps}), ${analysis.keptSamples} samples kept`,
    summaryTerminal(analysis.summary, { width: TERMINAL_COLUMNS, rHatMax: run.record.run.max_rhat, essMin: run.record.run.target_ess }),
    terminalMarginals(analysis.marginals, { width: TERMINAL_COLUMNS - 20, height: 4 }),
  ];
  const terms = run.record.best_fit.terms ?? [];
  const goodness = analysis.goodness;
  if (run.record.best_fit.chi_square !== null) lines.push(`chi^2 at best fit = ${run.record.best_fit.chi_square.toFixed(2)} for ${run.record.best_fit.degrees_of_freedom} degrees of freedom (${run.record.best_fit.n_data} data points)${goodness ? `; per degree of freedom ${goodness.reducedChiSquare.toFixed(3)}, p-value ${goodness.pValue.toPrecision(3)}` : ''}`);
  if (terms.length > 1) for (const term of terms) lines.push(`  ${term.name}: chi^2 = ${term.chi_square === null ? 'n/a' : term.chi_square.toFixed(2)} for ${term.n_data} data points`);
  for (const warning of analysis.warnings) lines.push(`warning [${warning.code}${warning.parameter ? `, ${warning.parameter}` : ''}]: ${warning.message}`);
  lines.push(`outputs: ${runDir} (report.html, summary.json, summary.md, table.tex, chains.csv, figures/, contours/, marginals/)`);
  return lines.join('\n');
}
