// output layer barrel: one export per line, grouped by topic.

// Posterior summaries: intervals, MAP, correlations (the weighted statistics themselves live in math/statistics).
export { ONE_SIGMA_MASS } from './summaries/credibleMass.js';
export { TWO_SIGMA_MASS } from './summaries/credibleMass.js';
export { highestDensityInterval } from './summaries/highestDensityInterval.js';
export { highestDensityIntervalOfSorted } from './summaries/highestDensityInterval.js';
export { weightedCorrelationMatrix } from './summaries/weightedCorrelationMatrix.js';
export { sampleStatistics } from './summaries/sampleStatistics.js';
export type { SampleStatistics } from './summaries/sampleStatistics.js';
export type { SampleStatisticsOptions } from './summaries/sampleStatistics.js';
export { summarizePosterior } from './summaries/summarizePosterior.js';
export type { SummarizePosteriorOptions } from './summaries/summarizePosterior.js';
export type { ParameterDiagnostics } from './summaries/runSummary.js';
export type { ParameterSummary } from './summaries/runSummary.js';
export type { RunSummary } from './summaries/runSummary.js';
export { runWarning } from './summaries/runWarning.js';
export type { RunWarning } from './summaries/runWarning.js';

// Rounding and number text (Particle Data Group rule).
export { pdgRoundingPlace } from './summaries/pdgRoundingPlace.js';
export { roundToDecimalPlace } from './summaries/roundToDecimalPlace.js';
export { formatWithErrors } from './summaries/formatWithErrors.js';
export { formatWithError } from './summaries/formatWithErrors.js';
export { formatInterval } from './summaries/formatWithErrors.js';
export { roundingPlaceFor } from './summaries/formatWithErrors.js';
export type { NumberStyle } from './summaries/formatWithErrors.js';

// Credible regions of smoothed densities (the kernel density estimates live in math/density).
export type { MarginalDensity1D } from './density/densityTypes.js';
export type { DensityGrid2D } from './density/densityTypes.js';
export type { CredibleRegion } from './density/densityTypes.js';
export type { ContourSet2D } from './density/densityTypes.js';
export { credibleThresholds } from './density/credibleThresholds.js';
export { credibleContours } from './density/credibleContours.js';
export { credibleRegionArea } from './density/credibleRegionGeometry.js';
export { credibleRegionContains } from './density/credibleRegionGeometry.js';

// Density and contour files (text; write them with writeFileAtomic).
export { marginalDensityCsv } from './density/densityCsv.js';
export { densityGridCsv } from './density/densityCsv.js';
export { contourGeoJson } from './density/contourFiles.js';
export { contourPathsCsv } from './density/contourFiles.js';
export { contourThresholdsJson } from './density/contourFiles.js';

// Tables: Markdown, LaTeX, terminal.
export { parameterSymbols } from './tables/parameterSymbols.js';
export { parameterSymbol } from './tables/parameterSymbols.js';
export { escapeLatexText } from './tables/parameterSymbols.js';
export type { ParameterSymbol } from './tables/parameterSymbols.js';
export { summaryMarkdown } from './tables/summaryMarkdown.js';
export { summaryLatex } from './tables/summaryLatex.js';
export type { SummaryLatexOptions } from './tables/summaryLatex.js';
export { summaryTerminal } from './tables/summaryTerminal.js';
export type { SummaryTerminalOptions } from './tables/summaryTerminal.js';
export { terminalMarginals } from './tables/terminalMarginals.js';
export type { TerminalMarginalOptions } from './tables/terminalMarginals.js';

// Files.
export { writeFileAtomic } from './writeFileAtomic.js';
export { writeFileAtomicBy } from './writeFileAtomic.js';
export { writeFailure } from './writeFileAtomic.js';

// Figures: SVG documents built from strings, PNG rendering (see ./figures/index.ts for the SVG toolkit).
export { triangleFigure } from './figures/index.js';
export { hubbleFigure } from './figures/index.js';
export { traceFigure } from './figures/index.js';
export { traceStackFigure } from './figures/index.js';
export { bandFigure } from './figures/index.js';
export { residualsFigure } from './figures/index.js';
export type { ResidualsFigureInput, ResidualsFigureOptions } from './figures/index.js';
export { autocorrelationFigure } from './figures/index.js';
export type { AutocorrelationFigureOptions, AutocorrelationSeries } from './figures/index.js';
export { measurementRatioFigure } from './figures/index.js';
export type { MeasurementGroup, MeasurementRatioFigureInput } from './figures/index.js';
export { probeDiagramFileName, probeDiagramKey, probeDiagramJson, parseProbeDiagramJson } from './diagrams/probeDiagramJson.js';
export type { ProbeDiagramDocument } from './diagrams/probeDiagramJson.js';
export { svgToPng } from './figures/index.js';
export { DEFAULT_PNG_WIDTH_PX } from './figures/index.js';
export { svgToPdf } from './figures/index.js';
export { sampleWalkerTraces } from './figures/index.js';
export { pruneContourIslands } from './density/pruneContourIslands.js';
export type { FigureWidth, FontFace, WalkerLayout, WalkerTraceOptions } from './figures/index.js';
export { interpolateModelMu } from './figures/index.js';
export { parameterLabel } from './figures/index.js';
export { DEFAULT_PARAMETER_SYMBOLS } from './figures/index.js';
export type { TriangleRun, TriangleOptions } from './figures/index.js';
export type { HubbleFigureInput, HubbleFigureOptions, BinnedResidual, ModelMuCurve } from './figures/index.js';
export type { TraceEnsemble, TraceParameterPanel, TraceFigureOptions } from './figures/index.js';
export type { BandFigureInput, BandFigureOptions, ReferenceLine } from './figures/index.js';

// Report page: one self-contained HTML file per run.
export { reportHtml } from './report/index.js';
export { convergenceVerdicts } from './report/index.js';
export { runFactsForReport } from './report/index.js';
export { summaryTableNote, nestedChainChecksNote } from './report/index.js';
export type { RunFactsForReportInput, EnsembleSamplerFacts, NestedSamplerFacts, ReportTermFacts } from './report/index.js';
export type { ReportInput, ReportRunFacts, ReportSummaryTable, ReportDiagnostics, ReportDiagnosticRow, ReportFigure, ReportInputFile, ReportWarning } from './report/index.js';
export type { ConvergenceVerdicts, ParameterVerdict } from './report/index.js';
export { summaryCells } from './tables/summaryCells.js';
export { modelsLatex } from './tables/modelsLatex.js';
export type { ModelColumn } from './tables/modelColumn.js';
export { modelsIndexHtml } from './report/index.js';
export type { ModelsIndexInput } from './report/index.js';
export type { SummaryCells } from './tables/summaryCells.js';
export { darkEnergyBandsFigure } from './figures/darkEnergyBandsFigure.js';
export type { DarkEnergyBand, DarkEnergyBandsInput, DarkEnergyBandsOptions } from './figures/darkEnergyBandsFigure.js';
// Facts the summaries carry: goodness of fit, prior-edge limits, fixed-parameter notes, mass-step convention, binned residuals.
export { GOODNESS_OF_FIT_TAIL } from './summaries/goodnessOfFit.js';
export type { GoodnessOfFit } from './summaries/goodnessOfFit.js';
export { goodnessOfFit } from './summaries/goodnessOfFit.js';
export { goodnessOfFitWarning } from './summaries/goodnessOfFit.js';
export { PRIOR_EDGE_TOUCH_FRACTION } from './summaries/priorEdgeLimits.js';
export { ONE_SIDED_LIMIT_MASS } from './summaries/priorEdgeLimits.js';
export type { PriorEdgeInput } from './summaries/priorEdgeLimits.js';
export { detectPriorEdges } from './summaries/priorEdgeLimits.js';
export type { FixedParameterFacts } from './summaries/fixedParameterNotes.js';
export { fixedParameterNotes } from './summaries/fixedParameterNotes.js';
export { massStepConvention } from './summaries/massStepConvention.js';
export { binResiduals } from './summaries/binResiduals.js';
// summary.json: the document of one run's numbers (plain facts in, JSON-ready object out).
export { SUMMARY_SCHEMA } from './summaries/summaryJson.js';
export { summaryJsonText } from './summaries/summaryJson.js';
export type { SummaryJson } from './summaries/summaryJson.js';
export type { SummaryJsonInput } from './summaries/summaryJson.js';
export type { SummaryJsonBestFit } from './summaries/summaryJson.js';
export type { SummaryJsonDiagnostics } from './summaries/summaryJson.js';
export { smallestBulkEssInSummaryJson } from './summaries/summaryJsonBulkEss.js';
export type { SummaryJsonNestedFacts } from './summaries/summaryJson.js';
export { summaryJsonDocument } from './summaries/summaryJson.js';
// The terminal text after a fit (plain facts in, text out).
export { TERMINAL_COLUMNS } from './summaries/runTerminalText.js';
export type { RunTerminalFacts } from './summaries/runTerminalText.js';
export { runTerminalText } from './summaries/runTerminalText.js';
// Run-folder formats: the folder layout, the chains CSV, the binary sampler state, the checkpoint and chain record.
export { RUN_FILES } from './run/runFolder.js';
export { prepareRunFolder } from './run/runFolder.js';
export { runJsonText } from './run/runJsonText.js';
export type { NestedRunJsonFacts } from './run/nestedRunJson.js';
export type { NestedRunJsonSections } from './run/nestedRunJson.js';
export type { NestedRunSection } from './run/nestedRunJson.js';
export { nestedRunJson } from './run/nestedRunJson.js';
export { encodeBinaryState } from './run/binaryState.js';
export { decodeBinaryState } from './run/binaryState.js';
export type { ChainColumns } from './run/chainsFile.js';
export type { EnsembleDraws } from './run/chainsFile.js';
export type { ChainTable } from './run/chainsFile.js';
export { WEIGHT_COLUMN } from './run/chainsFile.js';
export { chainHeader } from './run/chainsFile.js';
export { writeChainsFile } from './run/chainsFile.js';
export { readChainsFile } from './run/readChainsFile.js';
export type { ChainsCsvOption } from './run/chainsSelection.js';
export { DEFAULT_CHAINS_CSV } from './run/chainsSelection.js';
export type { ChainsSelection } from './run/chainsSelection.js';
export { chainsSelection } from './run/chainsSelection.js';
export type { CheckpointFacts } from './run/checkpointFile.js';
export { writeCheckpoint } from './run/checkpointFile.js';
export { readCheckpoint } from './run/checkpointFile.js';
export { readCheckpointState } from './run/checkpointFile.js';
export type { ChainRecordShape } from './run/chainRecordFile.js';
export { visitChainRecord } from './run/chainRecordFile.js';
export { appendChainRecord } from './run/chainRecordFile.js';
export { writeChainRecordFrom } from './run/chainRecordFile.js';
export { readChainRecordDraws } from './run/chainRecordFile.js';
export { recordShapeOf } from './run/chainRecordFile.js';
export type { StoredDraws } from './run/storedDraws.js';
export { drawsInMemory } from './run/storedDraws.js';
export { asStoredDraws } from './run/storedDraws.js';
export { drawsFromChainRecord } from './run/storedDraws.js';
export { shiftedDraws } from './run/storedDraws.js';
export { forEachStoredBlock } from './run/storedDraws.js';
export { bestStoredDraw } from './run/storedDraws.js';
export { drawsAfterBurnIn } from './run/storedDraws.js';
export { acceptedMoveCounts } from './run/storedDraws.js';
export { ensemblesSideBySide } from './run/storedDraws.js';
export type { BestStoredDraw } from './run/storedDraws.js';

// Blinding: secret offsets, the sealed key, and the marks every page of a blinded run carries.
export { drawBlindingOffsets } from './blinding/drawBlindingOffsets.js';
export { MINIMUM_OFFSET_FRACTION } from './blinding/drawBlindingOffsets.js';
export { blindColumns } from './blinding/blindColumns.js';
export { blindValues } from './blinding/blindColumns.js';
export { sealBlindingKey } from './blinding/sealedKey.js';
export { unsealBlindingKey } from './blinding/sealedKey.js';
export { blindingRunIdentity } from './blinding/sealedKey.js';
export type { BlindingKey } from './blinding/sealedKey.js';
export { BLINDED_MARK } from './blinding/blindingNotice.js';
export { blindingNotice } from './blinding/blindingNotice.js';
export { markSvgBlinded } from './blinding/markSvgBlinded.js';

// Systematic budget: tables (Markdown, LaTeX, JSON) and the bar figure.
export { budgetMarkdown } from './budget/budgetMarkdown.js';
export { budgetLatex } from './budget/budgetLatex.js';
export { budgetJson } from './budget/budgetJson.js';
export { budgetFigure } from './budget/budgetFigure.js';
export type { BudgetFigureOptions } from './budget/budgetFigure.js';
export type { BudgetTable, BudgetTableRow } from './budget/budgetTable.js';
export { budgetTableFromJson } from './budget/budgetTableFromJson.js';
export { budgetMethod } from './budget/budgetMethod.js';
export type { BudgetMethodFacts } from './budget/budgetMethod.js';
export type { ReportBudget } from './report/budgetSection.js';

// Tables a command prints: the distance table (text, JSON, CSV) and the Fisher forecast (text, JSON).
export type { DistanceTableFacts } from './tables/distanceTableFacts.js';
export type { DistanceTableRow } from './tables/distanceTableFacts.js';
export { distanceTableText } from './tables/distanceTableText.js';
export { distanceTableJson } from './tables/distanceTableJson.js';
export { distanceTableCsv } from './tables/distanceTableCsv.js';
export type { ForecastFacts } from './forecast/forecastFacts.js';
export type { ForecastModelFacts } from './forecast/forecastFacts.js';
export { forecastText } from './forecast/forecastText.js';
export { forecastJson } from './forecast/forecastJson.js';
export type { LatentColumns } from './tables/latentColumnsCsv.js';
export { appendLatentColumns } from './tables/latentColumnsCsv.js';
export type { HubbleDiagramColumns } from './tables/hubbleDiagramCsv.js';
export { hubbleDiagramCsv } from './tables/hubbleDiagramCsv.js';
export type { HubbleModelCurve } from './tables/hubbleModelCsv.js';
export { hubbleModelCsv } from './tables/hubbleModelCsv.js';

// Cluster plans: the Slurm job-array and merge scripts (bash text).
export type { SlurmScriptInput } from './cluster/slurmScripts.js';
export { slurmBatchScript } from './cluster/slurmScripts.js';
export { slurmMergeScript } from './cluster/slurmScripts.js';
export { shellQuote } from './cluster/slurmScripts.js';
export { slurmTimeLimit } from './cluster/slurmScripts.js';
export { MERGE_TIME_MINUTES } from './cluster/slurmScripts.js';

// Mock surveys: the table CSV, the systematics (covariance text, modes CSV), truth.json.
export { MOCK_TABLE_COLUMNS } from './mock/mockTableCsv.js';
export type { MockTableFacts } from './mock/mockTableCsv.js';
export { mockTableCsv } from './mock/mockTableCsv.js';
export { hostLogMassAsWritten } from './mock/mockTableCsv.js';
export type { ModeColumns } from './mock/systematicsText.js';
export { covarianceMatrixText } from './mock/systematicsText.js';
export { systematicModesCsv } from './mock/systematicsText.js';
export type { MockSurveyFacts, MockSampleFacts, MockTruthFacts } from './mock/mockTruthJson.js';
export { mockTruthJson } from './mock/mockTruthJson.js';
export { mockTruthValues } from './mock/mockTruthValues.js';
export type { MockSurveyFiles, MockSurveyFilesInput } from './mock/mockSurveyFiles.js';
export { mockSurveyFiles } from './mock/mockSurveyFiles.js';

// candela compare: comparison.json's document type and text, and the Markdown parts that follow the compare layer's tables.
export { COMPARISON_SCHEMA } from './compare/comparisonJson.js';
export type { ComparisonJson } from './compare/comparisonJson.js';
export type { ComparisonModelJson } from './compare/comparisonJson.js';
export type { ComparisonNestedPairJson } from './compare/comparisonJson.js';
export type { ComparisonChangedInputJson } from './compare/comparisonJson.js';
export type { SavageDickeyJson } from './compare/comparisonJson.js';
export { comparisonJsonText } from './compare/comparisonJson.js';
export { comparisonMarkdownDetails } from './compare/comparisonMarkdownDetails.js';
export { dicMissingNotice } from './compare/comparisonMarkdownDetails.js';
