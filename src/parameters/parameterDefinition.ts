/**
 * What candela knows about one parameter name: what it means, its unit, how it
 * is written, whether it can carry a sample suffix, where its values are
 * physical and the prior it gets when the configuration names none.
 */

/** A prior density, in the parameter's unit (the configuration's `prior` block). */
export type DefaultPrior =
  | { kind: 'uniform'; min: number; max: number }
  | { kind: 'log_uniform'; min: number; max: number };

/** How a parameter is written in tables and figures. */
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

/** Which part of the analysis a parameter belongs to (tables list them in this order). */
export type ParameterRole = 'cosmology' | 'early_universe' | 'probe' | 'standardization' | 'population' | 'derived';

/** One entry of the parameter registry. */
export interface ParameterDefinition {
  /** snake_case name used in configurations, chains and tables. */
  readonly name: string;
  /** One line saying what it is. */
  readonly meaning: string;
  /** Unit in plain text ('' for dimensionless). */
  readonly unit: string;
  readonly role: ParameterRole;
  readonly symbol: ParameterSymbol;
  /** Accepts a `_<sample>` suffix (one value per supernova sample). */
  readonly perSample: boolean;
  /** Only computed from others (a derived quantity), never sampled or fixed. */
  readonly derivedOnly: boolean;
  /** Smallest physical value (-Infinity: none). */
  readonly physicalMin: number;
  /** Whether `physicalMin` itself is physical. */
  readonly includesMin: boolean;
  /** Prior used when the configuration names none (absent for derived quantities). */
  readonly defaultPrior?: DefaultPrior;
}
