/**
 * The colour-blind-safe palette of Okabe, M. & Ito, K. (2008), "Color
 * Universal Design (CUD): how to make figures and presentations that are
 * friendly to colorblind people", https://jfly.uni-koeln.de/color/ .
 * Values as published there (sRGB hex).
 */
export const OKABE_ITO_COLORS = {
  black: '#000000',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/**
 * Order in which runs, samples and ensembles take colours: the darker Okabe-Ito
 * hues first; yellow is left out because it is too light on white paper.
 */
export const SERIES_COLORS: readonly string[] = [
  OKABE_ITO_COLORS.blue,
  OKABE_ITO_COLORS.vermillion,
  OKABE_ITO_COLORS.bluishGreen,
  OKABE_ITO_COLORS.reddishPurple,
  OKABE_ITO_COLORS.orange,
  OKABE_ITO_COLORS.skyBlue,
  OKABE_ITO_COLORS.black,
];

/**
 * Colour of the series at a position (wraps around after seven series).
 *
 * @param index 0-based series position
 * @returns a hex colour
 * @example seriesColor(1) // '#D55E00'
 */
export function seriesColor(index: number): string {
  const count = SERIES_COLORS.length;
  return SERIES_COLORS[((Math.trunc(index) % count) + count) % count];
}

/**
 * Mixes a `#rrggbb` colour with white: fraction 0 keeps the colour, 1 gives
 * white. Used to derive the darker 68% fill and the lighter 95% fill from one
 * run colour. Colours that are not `#rrggbb` are returned unchanged.
 *
 * @param hexColor colour as `#rrggbb`
 * @param whiteFraction share of white, 0 to 1
 * @returns the mixed colour as `#rrggbb`
 * @example mixWithWhite('#000000', 0.5) // '#808080'
 */
export function mixWithWhite(hexColor: string, whiteFraction: number): string {
  const match = /^#([0-9a-f]{6})$/i.exec(hexColor);
  if (!match) return hexColor;
  const share = Math.min(1, Math.max(0, whiteFraction));
  const value = Number.parseInt(match[1], 16);
  const channels = [(value >> 16) & 255, (value >> 8) & 255, value & 255];
  return `#${channels.map((channel) => Math.round(channel + (255 - channel) * share).toString(16).padStart(2, '0')).join('')}`;
}
