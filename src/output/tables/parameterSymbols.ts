import { PARAMETERS, type ParameterSymbol } from '../../parameters/index.js';

export type { ParameterSymbol } from '../../parameters/index.js';

/**
 * Symbols of the parameters candela samples or derives, keyed by their
 * configuration names (snake_case): the parameter registry's symbols
 * (src/parameters/parameterRegistry.ts, which cites them).
 * @example parameterSymbols.omega_m.label // 'Ωm'
 */
export const parameterSymbols: Readonly<Record<string, ParameterSymbol>> = Object.fromEntries(
  Object.values(PARAMETERS).map((definition) => [definition.name, definition.symbol]),
);

/** Per-sample parameters: `<base>_<sample label>`, e.g. sigma_int_LOWZ. */
const PER_SAMPLE_BASES = ['sigma_int', 'x1_mean', 'x1_width', 'color_mean', 'color_width', 'abs_mag', 'mass_step'];

/**
 * Escapes the characters that have a meaning in LaTeX (\ { } _ ^ # $ % & ~)
 * so that a name can go into \mathrm{...} or a text cell.
 * Cost: O(length).
 * @param text any text.
 * @example escapeLatexText('sigma_int_LOWZ') // 'sigma\_int\_LOWZ'
 */
export function escapeLatexText(text: string): string {
  return text.replace(/[\\{}_^#$%&~]/g, (character) => (character === '\\' ? '\\textbackslash{}' : character === '~' ? '\\textasciitilde{}' : character === '^' ? '\\textasciicircum{}' : `\\${character}`));
}

/**
 * A note (a sign convention, a quantity at a fixed parameter) in LaTeX text
 * mode: special characters escaped, comparison signs in math mode (in text
 * mode they print as other glyphs with the default font encoding).
 * @param note plain text.
 * @example latexNote('> 0: hosts above 10^10 M_sun brighter') // '$>$ 0: hosts above 10\\textasciicircum{}10 M\\_sun brighter'
 */
export function latexNote(note: string): string {
  return escapeLatexText(note).replace(/[<>]/g, (sign) => `$${sign}$`);
}

/**
 * The symbol of any parameter name: the table entry; for a per-sample name
 * (`sigma_int_LOWZ`) the base symbol with the sample as a superscript
 * (LaTeX `\sigma_{\rm int}^{\rm LOWZ}`, label 'σint[LOWZ]'); otherwise the
 * name itself in roman type.
 *
 * Cost: O(number of per-sample bases).
 * @param name parameter name as in the configuration.
 * @example parameterSymbol('sigma_int_LOWZ').label // 'σint[LOWZ]'
 * @example parameterSymbol('my_nuisance').latex // '\\mathrm{my\\_nuisance}'
 */
export function parameterSymbol(name: string): ParameterSymbol {
  if (Object.hasOwn(parameterSymbols, name)) return parameterSymbols[name];
  for (const base of PER_SAMPLE_BASES) {
    if (name.startsWith(`${base}_`) && name.length > base.length + 1) {
      const sample = name.slice(base.length + 1);
      const known = parameterSymbols[base];
      const labelSubscript = `${known.labelSubscript ?? ''}[${sample}]`;
      return { ...known, latex: `${known.latex}^{\\rm ${escapeLatexText(sample)}}`, label: known.labelBase + labelSubscript, labelSubscript };
    }
  }
  return { latex: `\\mathrm{${escapeLatexText(name)}}`, label: name, labelBase: name };
}
