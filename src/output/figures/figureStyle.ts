import { LANTERN_COLORS } from './palette.js';

/** Text face of a figure: `sans` (the default) or `serif`, to match a journal's body text. */
export type FontFace = 'sans' | 'serif';

/**
 * The look of every candela figure in one place (described for people in
 * docs/style.md): sizes in px (1 px = 1/96 inch, so 10 px is 7.5 pt), a
 * white page, framed panels with ticks pointing inwards, thin ink axes, and
 * font stacks that resolve on macOS, Windows and Linux; their generic last
 * family also picks the PDF font (Helvetica or Times-Roman).
 */
export const FIGURE_STYLE = {
  /** Font families tried in order, by face. */
  fontFamilies: {
    sans: "'Helvetica Neue', Helvetica, Arial, 'Liberation Sans', 'DejaVu Sans', sans-serif",
    serif: "'Times New Roman', Times, 'Nimbus Roman', 'Liberation Serif', 'DejaVu Serif', serif",
  },
  /** Tick labels (px). */
  tickFontPx: 10,
  /** Axis labels (px). */
  labelFontPx: 12,
  /** Figure titles (px). */
  titleFontPx: 13,
  /** Legend entries (px). */
  legendFontPx: 10,
  /** Panel frame and tick marks: colour, width (px) and tick lengths (px, drawn into the panel). */
  axisColor: LANTERN_COLORS.ink,
  axisStrokePx: 0.75,
  tickLengthPx: 4,
  minorTickLengthPx: 2.2,
  /** Space between the frame and a tick label (px). */
  tickLabelGapPx: 4,
  /** Text colour. */
  textColor: LANTERN_COLORS.ink,
  /** Page colour. */
  background: '#ffffff',
  /** Model and data lines (px). */
  lineStrokePx: 1.4,
  /** Error bars and trace lines (px). */
  thinStrokePx: 0.6,
  /** Reference lines (truth, w = -1, flat universe): colour, width (px) and dot-dash pattern (px). */
  referenceColor: LANTERN_COLORS.ink,
  referenceStrokePx: 0.8,
  referenceDash: '5 2 1 2',
  /** Constraint lines (a flat universe): dotted (px). */
  constraintDash: '1 2.2',
  /** Burn-in shading in trace plots. */
  burnInFill: '#eceef2',
  /** Model bands. */
  bandFill: LANTERN_COLORS.haze,
  /** Legend caption strip: rule colour and width (px) above the entries. */
  captionRuleColor: LANTERN_COLORS.haze,
  captionRuleStrokePx: 0.75,
} as const;
