import asciichart from 'asciichart';
import type { MarginalDensity1D } from '../density/densityTypes.js';
import { roundToDecimalPlace } from '../summaries/roundToDecimalPlace.js';
import { displayWidth } from './displayWidth.js';
import { parameterSymbol } from './parameterSymbols.js';

/** Options of {@link terminalMarginals}. */
export interface TerminalMarginalOptions {
  /** Plot columns per marginal (default 60; the lines are 2 columns wider). */
  width?: number;
  /** Plot rows above the baseline (default 5). */
  height?: number;
  /** One line of text per parameter shown after its label, e.g. '0.298 ± 0.022'. */
  captions?: Readonly<Record<string, string>>;
}

/** Significant digits of the x-axis labels. */
const AXIS_DIGITS = 3;

/**
 * Small terminal plots of 1-D marginals, stacked: for each parameter a title
 * line (label, name, optional caption), the density drawn with asciichart
 * (peak scaled to `height` rows, no y labels since the scale is arbitrary)
 * and an axis line with the grid's low, middle and high values. With the
 * default width every line is 62 columns, so it fits 80.
 *
 * Cost: O(width x height) per parameter.
 * @param marginals from marginalDensity1D.
 * @param options width, height, captions.
 * @returns lines joined by newlines, one blank line between parameters, ending in a newline.
 * @example terminalMarginals([marginal]).split('\n').length // 1 + 6 + 1 + 1 for one parameter
 */
export function terminalMarginals(marginals: readonly MarginalDensity1D[], options: TerminalMarginalOptions = {}): string {
  const width = Math.max(8, Math.floor(options.width ?? 60));
  const height = Math.max(2, Math.floor(options.height ?? 5));
  const blocks = marginals.map((marginal) => {
    const symbol = parameterSymbol(marginal.parameter);
    const caption = options.captions?.[marginal.parameter];
    const title = `${symbol.label} (${marginal.parameter})${caption ? `  ${caption}` : ''}`;
    const series = resample(marginal, width);
    const peak = Math.max(...series);
    const scaled = series.map((value) => (peak > 0 ? (value / peak) * height : 0));
    const chart = asciichart.plot(scaled, { height, min: 0, max: height, offset: 2, format: () => ' ' });
    const low = marginal.x[0];
    const high = marginal.x[marginal.x.length - 1];
    const place = Math.floor(Math.log10(Math.max(Math.abs(high - low), Number.MIN_VALUE))) - AXIS_DIGITS + 1;
    const labels = [low, (low + high) / 2, high].map((value) => roundToDecimalPlace(value, place));
    return [title, ...chart.split('\n').map((line) => line.trimEnd()), axisLine(labels, width + 2)].join('\n');
  });
  return blocks.join('\n\n') + '\n';
}

/** Density at the centres of `columns` equal cells spanning the grid (linear interpolation). */
function resample(marginal: MarginalDensity1D, columns: number): number[] {
  const { x, density } = marginal;
  const last = x.length - 1;
  const span = x[last] - x[0];
  return Array.from({ length: columns }, (_, k) => {
    const position = ((k + 0.5) / columns) * last;
    const index = Math.min(last - 1, Math.floor(position));
    const fraction = position - index;
    return span > 0 ? density[index] * (1 - fraction) + density[index + 1] * fraction : density[0];
  });
}

/** Low value at the left edge, middle value centred, high value at the right edge. */
function axisLine(labels: string[], width: number): string {
  const characters = Array.from({ length: width }, () => ' ');
  const put = (text: string, start: number): void => {
    [...text].forEach((character, k) => { if (start + k >= 0 && start + k < width) characters[start + k] = character; });
  };
  put(labels[0], 2);
  put(labels[1], Math.round((width + 2) / 2 - displayWidth(labels[1]) / 2));
  put(labels[2], width - displayWidth(labels[2]));
  return characters.join('').trimEnd();
}
