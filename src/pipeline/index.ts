// pipeline layer barrel: the command entry points (one per command of src/cli) and the types their
// requests and outcomes use, one export per line. Everything else stays inside its feature folder:
//   run/        what every command shares: loading the data, building the posterior, the run record and run folder reader
//   fit/        candela fit: the sampling loop, signals, nested sampling
//   report/     candela report: every output of a run folder, rebuilt from its chains
//   compare/    candela compare
//   forecast/   candela simulate --forecast
//   simulate/   candela simulate
//   cluster/    candela fit --plan slurm / --part, candela merge
//   budget/     candela budget: the systematic budget of a run, by reweighting its chains
//   blinding/   blinded runs: their offsets and key, the blinded view every command reads, candela unblind
//   check/, distances/, standardize/   the commands of the same names
export {};
export { checkConfiguration } from './check/checkConfiguration.js';
export type { ConfigurationCheck } from './check/checkConfiguration.js';
export { computeDistanceTable } from './distances/distanceTable.js';
export { formatDistanceTableText } from './distances/distanceTable.js';
export { formatDistanceTableJson } from './distances/distanceTable.js';
export { formatDistanceTableCsv } from './distances/distanceTable.js';
export { readRedshiftFile } from './distances/distanceTable.js';
export type { DistanceTable, DistanceTableOptions, DistanceTableRow } from './distances/distanceTable.js';
export { VERSION } from './run/version.js';
export { standardizeTable } from './standardize/standardizeTable.js';
export type { StandardizedTable } from './standardize/standardizeTable.js';
export { runFit } from './fit/runFit.js';
export { isFitInterrupted } from './fit/runFit.js';
export type { FitRequest, FitProgress, FitOutcome } from './fit/runFit.js';
export { fitSideBySide } from './fit/fitSideBySide.js';
export { sideBySidePlanFor } from './fit/fitSideBySide.js';
export type { SideBySideRequest, SideBySideOutcome, SideBySideModel } from './fit/fitSideBySide.js';
export type { SideBySidePlan } from './fit/sideBySidePlan.js';
export { buildRunOutputs } from './report/buildRunOutputs.js';
export { terminalRunReport } from './report/terminalRunReport.js';
export { unblindRun } from './blinding/unblindRun.js';
export type { UnblindOutcome } from './blinding/unblindRun.js';
export { simulateSurvey } from './simulate/simulateSurvey.js';
export type { SimulateRequest } from './simulate/simulateSurvey.js';
export type { SimulateOutcome } from './simulate/simulateSurvey.js';
export { forecastSurvey } from './forecast/forecastSurvey.js';
export { formatForecastText } from './forecast/forecastReport.js';
export { formatForecastJson } from './forecast/forecastReport.js';
export type { ForecastRequest } from './forecast/forecastSurvey.js';
export type { ForecastResult } from './forecast/forecastSurvey.js';
export { compareRuns } from './compare/compareRuns.js';
export type { CompareRequest } from './compare/compareRuns.js';
export type { CompareOutcome } from './compare/compareRuns.js';
export { planSlurmArray } from './cluster/slurmPlan.js';
export type { SlurmPlanRequest } from './cluster/slurmPlan.js';
export type { SlurmPlan } from './cluster/slurmPlan.js';
export { mergeParts } from './cluster/mergeParts.js';
export type { MergeRequest } from './cluster/mergeParts.js';
export type { MergedRunRecord } from './cluster/mergeParts.js';
export { runBudget } from './budget/runBudget.js';
export type { BudgetRequest, BudgetOutcome } from './budget/runBudget.js';
