/**
 * The look of every candela figure in one place: print-ready sizes in px
 * (1 px = 1/96 inch, so 10 px is 7.5 pt), a white page, thin dark axes and a
 * sans-serif font stack that resolves on macOS, Windows and Linux (the last
 * two named families ship with most Linux distributions).
 */
export const FIGURE_STYLE = {
  /** Font families tried in order; the generic `sans-serif` is the last resort. */
  fontFamily: "'Helvetica Neue', Helvetica, Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif",
  /** Tick labels (px). */
  tickFontPx: 10,
  /** Axis labels (px). */
  labelFontPx: 12,
  /** Figure titles (px). */
  titleFontPx: 13,
  /** Legend entries (px). */
  legendFontPx: 10.5,
  /** Axis lines and tick marks: colour, width (px) and tick length (px, drawn outward). */
  axisColor: '#222222',
  axisStrokePx: 0.8,
  tickLengthPx: 4,
  minorTickLengthPx: 2.2,
  /** Space between a tick mark and its label (px). */
  tickLabelGapPx: 3,
  /** Text colour. */
  textColor: '#111111',
  /** Page colour. */
  background: '#ffffff',
  /** Model and data lines (px). */
  lineStrokePx: 1.4,
  /** Error bars and trace lines (px). */
  thinStrokePx: 0.6,
  /** Reference lines: colour, width (px) and dash pattern (px). */
  referenceColor: '#555555',
  referenceStrokePx: 0.9,
  referenceDash: '4 3',
  /** Burn-in shading in trace plots. */
  burnInFill: '#e6e6e6',
} as const;
