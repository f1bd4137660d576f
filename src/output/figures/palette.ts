/**
 * candela's own "lantern" palette (see docs/style.md). Six series colours,
 * chosen so that every pair stays at least 28 CIELAB units apart (CIE 1976
 * colour difference) for normal colour vision and for simulated
 * protanopia, deuteranopia and tritanopia (the simulation matrices of
 * Machado, Oliveira & Fernandes 2009, severity 1), with lightness between
 * 35 and 66 so that thin lines and small markers read on white paper.
 * Two neutral colours take the roles no data series may take: ink (axes,
 * text, the model line, binned means, truth markers) and haze (model bands,
 * burn-in). A series never borrows a role colour, and a role never borrows a
 * series colour.
 */
export const LANTERN_COLORS = {
  /** Series 1: a deep blue-violet. */
  indigo: '#4C32D5',
  /** Series 2: a burnt orange-brown. */
  rust: '#AC3E06',
  /** Series 3: a dark blue-green. */
  pine: '#007553',
  /** Series 4: a greyed lilac. */
  pewter: '#8889A9',
  /** Series 5: a warm yellow-orange. */
  amber: '#DE8E07',
  /** Series 6: a light clear blue. */
  sky: '#17A9F6',
  /** Role: axes, text, model curves, binned means, truth markers. */
  ink: '#22252B',
  /** Role: model bands and burn-in shading. */
  haze: '#B8BEC9',
} as const;

/** Order in which runs, samples and ensembles take colours. */
export const SERIES_COLORS: readonly string[] = [
  LANTERN_COLORS.indigo,
  LANTERN_COLORS.rust,
  LANTERN_COLORS.pine,
  LANTERN_COLORS.pewter,
  LANTERN_COLORS.amber,
  LANTERN_COLORS.sky,
];

/**
 * Colour of the series at a position (wraps around after six series; the
 * figures then change the marker shape, see seriesMarkerShape).
 *
 * @param index 0-based series position
 * @returns a hex colour
 * @example seriesColor(1) // '#AC3E06'
 */
export function seriesColor(index: number): string {
  const count = SERIES_COLORS.length;
  return SERIES_COLORS[((Math.trunc(index) % count) + count) % count];
}

/**
 * Marker shape of the series at a position: circles for the first six
 * series, squares for the next six, diamonds after that, so that series
 * sharing a colour still differ.
 *
 * @param index 0-based series position
 * @returns the shape name
 * @example seriesMarkerShape(7) // 'square'
 */
export function seriesMarkerShape(index: number): 'circle' | 'square' | 'diamond' {
  const round = Math.floor(Math.max(0, Math.trunc(index)) / SERIES_COLORS.length);
  return round === 0 ? 'circle' : round === 1 ? 'square' : 'diamond';
}

/**
 * Mixes a `#rrggbb` colour with white: fraction 0 keeps the colour, 1 gives
 * white. Colours that are not `#rrggbb` are returned unchanged.
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
