/**
 * How a parameter is written: LaTeX (math mode, without $), a plain Unicode
 * label for terminals and SVG ('Ωm'), the label split into base and subscript
 * for figures that draw real subscripts, and the unit (plain and LaTeX).
 */
export interface ParameterSymbol {
  /** LaTeX math, e.g. '\\Omega_{\\rm m}'. */
  latex: string;
  /** Plain Unicode label, e.g. 'Ωm'. */
  label: string;
  /** Base of the label, e.g. 'Ω'. */
  labelBase: string;
  /** Subscript of the label, e.g. 'm' (none for α). */
  labelSubscript?: string;
  /** Unit in plain Unicode, e.g. 'km s⁻¹ Mpc⁻¹'; absent for dimensionless parameters. */
  unit?: string;
  /** Unit in LaTeX text mode, e.g. 'km\\,s$^{-1}$\\,Mpc$^{-1}$'. */
  unitLatex?: string;
}

const HUBBLE_UNIT = { unit: 'km s⁻¹ Mpc⁻¹', unitLatex: 'km\\,s$^{-1}$\\,Mpc$^{-1}$' };
const MAGNITUDE_UNIT = { unit: 'mag', unitLatex: 'mag' };

function symbol(latex: string, labelBase: string, labelSubscript?: string, unit?: { unit: string; unitLatex: string }): ParameterSymbol {
  return { latex, label: labelBase + (labelSubscript ?? ''), labelBase, ...(labelSubscript ? { labelSubscript } : {}), ...(unit ?? {}) };
}

/**
 * Symbols of the parameters candela samples or derives, keyed by their
 * configuration names (snake_case). The conventional symbols of the trade
 * (common practice): Omega_m, Omega_DE, Omega_k, w0, wa (Chevallier &
 * Polarski 2001; Linder 2003), H0 in km s^-1 Mpc^-1, the Tripp (1998)
 * coefficients alpha and beta, M_B, the host-mass step Delta_M, the
 * intrinsic scatter sigma_int, q0, the age t0 in Gyr.
 * @example parameterSymbols.omega_m.label // 'Ωm'
 */
export const parameterSymbols: Readonly<Record<string, ParameterSymbol>> = {
  omega_m: symbol('\\Omega_{\\rm m}', 'Ω', 'm'),
  omega_de: symbol('\\Omega_{\\rm DE}', 'Ω', 'DE'),
  omega_k: symbol('\\Omega_{k}', 'Ω', 'k'),
  w0: symbol('w_0', 'w', '0'),
  wa: symbol('w_a', 'w', 'a'),
  h0: symbol('H_0', 'H', '0', HUBBLE_UNIT),
  alpha: symbol('\\alpha', 'α'),
  beta: symbol('\\beta', 'β'),
  abs_mag: symbol('M_B', 'M', 'B', MAGNITUDE_UNIT),
  mass_step: symbol('\\Delta_M', 'Δ', 'M', MAGNITUDE_UNIT),
  sigma_int: symbol('\\sigma_{\\rm int}', 'σ', 'int', MAGNITUDE_UNIT),
  x1_mean: symbol('\\bar{x}_1', 'x̄', '1'),
  x1_width: symbol('\\sigma_{x_1}', 'σ', 'x1'),
  color_mean: symbol('\\bar{c}', 'c̄', undefined, MAGNITUDE_UNIT),
  color_width: symbol('\\sigma_{c}', 'σ', 'c', MAGNITUDE_UNIT),
  q0: symbol('q_0', 'q', '0'),
  z_accel: symbol('z_{\\rm acc}', 'z', 'acc'),
  age_gyr: symbol('t_0', 't', '0', { unit: 'Gyr', unitLatex: 'Gyr' }),
  offset: symbol('\\mathcal{M}', 'ℳ', undefined, MAGNITUDE_UNIT),
};

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
