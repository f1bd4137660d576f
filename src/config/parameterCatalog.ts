/**
 * The parameter names candela knows, what they mean, their units and the
 * range in which a value is physical. Names are snake_case; a few accept a
 * per-sample suffix (`sigma_int_<sample>`).
 */

/** What one parameter name means and where its values are physical. */
export interface ParameterInfo {
  meaning: string;
  unit: string;
  /** Smallest physical value (-Infinity: none). */
  physicalMin: number;
  /** Whether `physicalMin` itself is physical. */
  includesMin: boolean;
  /** Only computed from others, never sampled or fixed. */
  derivedOnly: boolean;
  /** Accepts a `_<sample>` suffix. */
  perSample: boolean;
}

const ANY = { physicalMin: -Infinity, includesMin: false, derivedOnly: false, perSample: false };

/** Every base parameter name with its meaning, unit and physical range. */
export const PARAMETER_CATALOG: Readonly<Record<string, ParameterInfo>> = {
  omega_m: { ...ANY, meaning: 'matter density today, Omega_m', unit: '', physicalMin: 0, includesMin: true },
  omega_de: { ...ANY, meaning: 'dark-energy density today, Omega_DE (free only with curvature: free)', unit: '' },
  omega_k: { ...ANY, meaning: 'curvature density today, Omega_k = 1 - Omega_m - Omega_DE', unit: '', derivedOnly: true },
  w0: { ...ANY, meaning: 'dark-energy equation of state today', unit: '' },
  wa: { ...ANY, meaning: 'its evolution, w(a) = w0 + wa (1 - a) (Chevallier & Polarski 2001; Linder 2003)', unit: '' },
  h0: { ...ANY, meaning: 'Hubble constant (needs calibrators)', unit: 'km/s/Mpc', physicalMin: 0, includesMin: false },
  alpha: { ...ANY, meaning: 'stretch coefficient of the Tripp (1998) relation', unit: 'mag' },
  beta: { ...ANY, meaning: 'colour coefficient of the Tripp (1998) relation', unit: '' },
  abs_mag: { ...ANY, meaning: 'absolute magnitude (magnitude offset) of a standardized supernova', unit: 'mag' },
  mass_step: { ...ANY, meaning: 'host-mass step added for hosts above the split mass', unit: 'mag' },
  sigma_int: { ...ANY, meaning: 'intrinsic magnitude scatter', unit: 'mag', physicalMin: 0, includesMin: true, perSample: true },
  x1_mean: { ...ANY, meaning: 'mean of the stretch population (hierarchical)', unit: '', perSample: true },
  x1_width: { ...ANY, meaning: 'width of the stretch population (hierarchical)', unit: '', physicalMin: 0, perSample: true },
  color_mean: { ...ANY, meaning: 'mean of the colour population (hierarchical)', unit: 'mag', perSample: true },
  color_width: { ...ANY, meaning: 'width of the colour population (hierarchical)', unit: 'mag', physicalMin: 0, perSample: true },
};

/** Sample suffix: letters, digits, `_`, `.` or `-`. */
const SAMPLE_SUFFIX = /^[A-Za-z0-9][A-Za-z0-9_.-]*$/;

/** A parameter name split into its base name and optional sample suffix. */
export interface ParameterName {
  base: string;
  sample: string | null;
}

/**
 * Splits a parameter name into base and sample suffix, or returns null when
 * the name is not one candela knows. Cost: O(catalog size).
 * @param name parameter name as written, e.g. `sigma_int_SNLS`.
 * @example parseParameterName('sigma_int_SNLS') // { base: 'sigma_int', sample: 'SNLS' }
 * @example parseParameterName('omega_l') // null
 */
export function parseParameterName(name: string): ParameterName | null {
  if (Object.hasOwn(PARAMETER_CATALOG, name)) return { base: name, sample: null };
  for (const [base, info] of Object.entries(PARAMETER_CATALOG)) {
    if (!info.perSample || !name.startsWith(`${base}_`)) continue;
    const sample = name.slice(base.length + 1);
    if (SAMPLE_SUFFIX.test(sample)) return { base, sample };
  }
  return null;
}

/**
 * Whether a value lies in the physical range of a (base) parameter.
 * @param base base parameter name (see PARAMETER_CATALOG).
 * @param value the value, in the parameter's unit.
 * @example isPhysicalValue('h0', 0) // false
 */
export function isPhysicalValue(base: string, value: number): boolean {
  const info = PARAMETER_CATALOG[base];
  if (!info || !Number.isFinite(value)) return false;
  return info.includesMin ? value >= info.physicalMin : value > info.physicalMin;
}

/**
 * The physical range of a base parameter in words, for messages.
 * @example physicalRangeText('sigma_int') // '>= 0'
 */
export function physicalRangeText(base: string): string {
  const info = PARAMETER_CATALOG[base];
  if (!info || info.physicalMin === -Infinity) return 'any finite number';
  return `${info.includesMin ? '>=' : '>'} ${info.physicalMin}`;
}
