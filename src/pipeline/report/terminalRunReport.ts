import { runTerminalText } from '../../output/index.js';
import { analyzeRun, type RunAnalysis } from './analyzeRun.js';
import { blindedParametersOf } from '../blinding/runBlinding.js';
import { readRunFolder, type RunOnDisk } from '../run/runFiles.js';

/**
 * What `candela fit` prints after a run: reads the run folder, analyzes it
 * and hands the facts to the output layer's runTerminalText (the layout
 * lives there: table, text marginals, chi-square, warnings, outputs).
 * @param runDir the run folder.
 * @param prepared the run as already read back and analysed (the end of a fit), to avoid reading it twice.
 * @returns the text, no final line break.
 * @throws CandelaError when the folder cannot be read back (see readRunFolder).
 * @example process.stdout.write(`${terminalRunReport('out/demo')}\n`)
 */
export function terminalRunReport(runDir: string, prepared?: { run: RunOnDisk; analysis: RunAnalysis }): string {
  const run = prepared?.run ?? readRunFolder(runDir);
  const analysis = prepared?.analysis ?? analyzeRun(run);
  const { record } = run;
  return runTerminalText({
    blindedParameters: blindedParametersOf(record),
    modelLabel: record.model.label,
    stopReason: record.run.stop_reason,
    steps: record.run.steps,
    burnInSteps: analysis.burnInSteps,
    keptSamples: analysis.keptSamples,
    summary: analysis.summary,
    maxRhat: record.run.max_rhat,
    targetEss: record.run.target_ess,
    marginals: analysis.marginals,
    chiSquare: record.best_fit.chi_square,
    degreesOfFreedom: record.best_fit.degrees_of_freedom,
    dataPoints: record.best_fit.n_data,
    terms: (record.best_fit.terms ?? []).map((term) => ({ name: term.name, chiSquare: term.chi_square, dataPoints: term.n_data })),
    goodness: analysis.goodness,
    warnings: analysis.warnings,
    runDir,
  });
}
