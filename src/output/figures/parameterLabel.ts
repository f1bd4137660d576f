import { parameterSymbol, parameterSymbols } from '../tables/parameterSymbols.js';

/** How a parameter is written: TeX-subset symbol, plain label and optional unit (the tables' ParameterSymbol satisfies it). */
export interface ParameterSymbol {
  /** Symbol in TeX notation, e.g. `\Omega_{\rm m}`. */
  latex: string;
  /** Plain-text label with Unicode symbols, e.g. `Ωm`. */
  label: string;
  /** Unit, e.g. `km s⁻¹ Mpc⁻¹` or `mag` (omitted for dimensionless parameters). */
  unit?: string;
}

/** The symbols figures use when the caller passes none: the output layer's `parameterSymbols` table. */
export const DEFAULT_PARAMETER_SYMBOLS: Readonly<Record<string, ParameterSymbol>> = parameterSymbols;

/**
 * The axis label of a parameter in candela's TeX subset: its symbol followed
 * by the unit in brackets. Without a symbol map the output layer's
 * `parameterSymbol` decides (known names, per-sample names such as
 * `sigma_int_LOWZ` with the sample as a superscript, other names in roman).
 * With a map, a name missing from it takes the symbol of its longest known
 * prefix and the sample in parentheses, or is written as it is.
 *
 * @param parameter parameter name, e.g. `omega_m`
 * @param symbols optional symbol map replacing the default table
 * @returns label source for richTextToSvg or richTextToHtml
 * @example parameterLabel('h0') // 'H_0 [km s⁻¹ Mpc⁻¹]'
 */
export function parameterLabel(parameter: string, symbols?: Readonly<Record<string, ParameterSymbol>>): string {
  const withUnit = (symbol: ParameterSymbol, suffix: string) => `${symbol.latex}${suffix}${symbol.unit ? ` [${symbol.unit}]` : ''}`;
  if (symbols === undefined || symbols === DEFAULT_PARAMETER_SYMBOLS) return withUnit(parameterSymbol(parameter), '');
  if (Object.hasOwn(symbols, parameter)) return withUnit(symbols[parameter], '');
  const base = Object.keys(symbols)
    .filter((key) => parameter.startsWith(`${key}_`))
    .sort((a, b) => b.length - a.length)[0];
  const literal = (text: string) => text.replace(/[\\_^{}$]/g, (character) => `\\${character}`);
  if (base !== undefined) return withUnit(symbols[base], ` (${literal(parameter.slice(base.length + 1))})`);
  return literal(parameter);
}
