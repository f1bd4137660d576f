// output/report: the self-contained HTML report page of a run.
export { reportHtml } from './reportHtml.js';
export type { ReportInput, ReportRunFacts, ReportSummaryTable, ReportDiagnostics, ReportDiagnosticRow, ReportFigure, ReportInputFile, ReportWarning } from './reportInput.js';
export { convergenceVerdicts } from './convergenceVerdicts.js';
export type { ConvergenceVerdicts, ParameterVerdict } from './convergenceVerdicts.js';
export { runFactsForReport } from './runFactsForReport.js';
export type { RunFactsForReportInput, EnsembleSamplerFacts, NestedSamplerFacts, ReportTermFacts } from './runFactsForReport.js';
export { summaryTableNote, nestedChainChecksNote } from './sampleNotes.js';
export { formatWallTime } from './formatWallTime.js';
export { namespaceSvgIds } from './namespaceSvgIds.js';
export { richTextToHtml } from './richTextHtml.js';
export { modelsIndexHtml } from './modelsIndexHtml.js';
export type { ModelsIndexInput } from './modelsIndexHtml.js';
