import { PARAMETERS, PARAMETER_ORDER } from './parameterRegistry.js';

/** Sample suffix: letters, digits, `_`, `.` or `-`. */
const SAMPLE_SUFFIX = /^[A-Za-z0-9][A-Za-z0-9_.-]*$/;

/** A parameter name split into its base name and optional sample suffix. */
export interface ParameterName {
  base: string;
  sample: string | null;
}

/**
 * Splits a parameter name into base and sample suffix, or returns null when
 * the name is not one candela knows. A name that is itself in the registry is
 * never split (`x1_mean` is the base, never `x1` of sample `mean`), and the
 * longest matching per-sample base wins. Cost: O(registry size).
 * @param name parameter name as written, e.g. `sigma_int_SNLS`.
 * @example parseParameterName('sigma_int_SNLS') // { base: 'sigma_int', sample: 'SNLS' }
 * @example parseParameterName('omega_l') // null
 */
export function parseParameterName(name: string): ParameterName | null {
  if (Object.hasOwn(PARAMETERS, name)) return { base: name, sample: null };
  let best: ParameterName | null = null;
  for (const base of PARAMETER_ORDER) {
    if (!PARAMETERS[base].perSample || !name.startsWith(`${base}_`)) continue;
    const sample = name.slice(base.length + 1);
    if (SAMPLE_SUFFIX.test(sample) && (best === null || base.length > best.base.length)) best = { base, sample };
  }
  return best;
}

/**
 * Listing rank of a (possibly per-sample) name: its base's place in the
 * registry, unknown names last.
 * @example parameterRank('omega_m') < parameterRank('sigma_int_LOWZ') // true
 */
export function parameterRank(name: string): number {
  const base = parseParameterName(name)?.base;
  const rank = base === undefined ? -1 : PARAMETER_ORDER.indexOf(base);
  return rank < 0 ? PARAMETER_ORDER.length : rank;
}

/**
 * Whether a value lies in the physical range of a (base) parameter.
 * @param base base parameter name (see PARAMETERS).
 * @param value the value, in the parameter's unit.
 * @example isPhysicalValue('h0', 0) // false
 */
export function isPhysicalValue(base: string, value: number): boolean {
  const info = PARAMETERS[base];
  if (!info || !Number.isFinite(value)) return false;
  return info.includesMin ? value >= info.physicalMin : value > info.physicalMin;
}

/**
 * The physical range of a base parameter in words, for messages.
 * @example physicalRangeText('sigma_int') // '>= 0'
 */
export function physicalRangeText(base: string): string {
  const info = PARAMETERS[base];
  if (!info || info.physicalMin === -Infinity) return 'any finite number';
  return `${info.includesMin ? '>=' : '>'} ${info.physicalMin}`;
}
