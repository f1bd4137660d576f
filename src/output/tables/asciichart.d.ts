// Type declarations for the `asciichart` package (plain JavaScript, no bundled types): only what candela uses.
declare module 'asciichart' {
  export interface PlotConfig {
    /** Rows of the chart above the lowest value. */
    height?: number;
    /** Columns reserved for the y labels and the axis. */
    offset?: number;
    /** Padding string whose length sets the label width. */
    padding?: string;
    /** Formats a y label. */
    format?: (value: number, index: number) => string;
    min?: number;
    max?: number;
    symbols?: string[];
    colors?: string[];
  }
  export function plot(series: number[] | number[][], config?: PlotConfig): string;
  const asciichart: { plot: typeof plot };
  export default asciichart;
}
