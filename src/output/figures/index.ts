// output/figures: SVG figures built from strings (no plotting library) and their PNG rendering.
// Figures
export { triangleFigure } from './triangleFigure.js';
export type { TriangleRun, TriangleOptions } from './triangleFigure.js';
export { hubbleFigure } from './hubbleFigure.js';
export type { HubbleFigureInput, HubbleFigureOptions, BinnedResidual } from './hubbleFigure.js';
export { traceFigure } from './traceFigure.js';
export { traceStackFigure } from './traceFigure.js';
export type { TraceParameterPanel, TraceFigureOptions } from './traceFigure.js';
export type { TraceEnsemble } from './tracePanel.js';
export { bandFigure } from './bandFigure.js';
export type { BandFigureInput, BandFigureOptions, ReferenceLine } from './bandFigure.js';
export { svgToPng } from './svgToPng.js';
export { svgToPdf } from './pdf/svgToPdf.js';
// Figure inputs (density types come from ../density/densityTypes.ts)
export { interpolateModelMu } from './hubbleResiduals.js';
export type { ModelMuCurve } from './hubbleResiduals.js';
export { residualRangeMag } from './residualRange.js';
export { parameterRanges } from './triangleRanges.js';
// Labels and symbols
export { parameterLabel } from './parameterLabel.js';
export { DEFAULT_PARAMETER_SYMBOLS } from './parameterLabel.js';
export type { ParameterSymbol } from './parameterLabel.js';
export { parseRichText } from './richText.js';
export { richTextToPlain } from './richText.js';
export type { TextSegment } from './richText.js';
export { richTextToSvg } from './richTextSvg.js';
// SVG toolkit
export { escapeXml } from './escapeXml.js';
export { svgElement } from './svgElement.js';
export type { AttributeValue } from './svgElement.js';
export { svgDocument } from './svgDocument.js';
export { niceTicks } from './niceTicks.js';
export { niceNumber } from './niceTicks.js';
export type { TickSet } from './niceTicks.js';
export { logTicks } from './logTicks.js';
export type { LogTickSet } from './logTicks.js';
export { formatTickLabel } from './formatTickLabel.js';
export { createAxisScale } from './axisScale.js';
export type { AxisScale } from './axisScale.js';
export { drawAxes } from './drawAxes.js';
export type { AxisSpec } from './drawAxes.js';
export { drawLegend } from './drawLegend.js';
export type { LegendEntry, DrawnLegend } from './drawLegend.js';
export { clipPathElement } from './plotFrame.js';
export { clippedGroup } from './plotFrame.js';
export type { PlotFrame } from './plotFrame.js';
export { linePathData } from './linePathData.js';
export { bandPathData } from './bandPathData.js';
export { multiPolygonPathData } from './multiPolygonPathData.js';
export type { MultiPolygonGeometry } from './multiPolygonPathData.js';
export { errorBarsPathData } from './errorBarsPathData.js';
export { circleMarkersPathData } from './circleMarkersPathData.js';
export { decimateMinMax } from './decimateMinMax.js';
export { FIGURE_STYLE } from './figureStyle.js';
export { OKABE_ITO_COLORS } from './palette.js';
export { SERIES_COLORS } from './palette.js';
export { seriesColor } from './palette.js';
export { mixWithWhite } from './palette.js';
