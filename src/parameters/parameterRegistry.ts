import type { DefaultPrior, ParameterDefinition, ParameterRole, ParameterSymbol } from './parameterDefinition.js';

const HUBBLE_UNIT = { unit: 'km s⁻¹ Mpc⁻¹', unitLatex: 'km\\,s$^{-1}$\\,Mpc$^{-1}$' };
const MAGNITUDE_UNIT = { unit: 'mag', unitLatex: 'mag' };
const MPC_UNIT = { unit: 'Mpc', unitLatex: 'Mpc' };

function symbol(latex: string, labelBase: string, labelSubscript?: string, unit?: { unit: string; unitLatex: string }): ParameterSymbol {
  return { latex, label: labelBase + (labelSubscript ?? ''), labelBase, ...(labelSubscript ? { labelSubscript } : {}), ...(unit ?? {}) };
}

interface Entry {
  meaning: string;
  unit: string;
  role: ParameterRole;
  symbol: ParameterSymbol;
  prior?: DefaultPrior;
  perSample?: boolean;
  derivedOnly?: boolean;
  /** [physicalMin, includesMin]. */
  physical?: [number, boolean];
}

const uniform = (min: number, max: number): DefaultPrior => ({ kind: 'uniform', min, max });
const logUniform = (min: number, max: number): DefaultPrior => ({ kind: 'log_uniform', min, max });

/*
 * The registry. Order matters: chains, tables and figures list parameters in
 * this order (cosmology first, then the early-universe and probe parameters,
 * then the supernova nuisance parameters, then derived quantities).
 * Symbols are the conventional ones of the trade (common practice): Omega_m,
 * Omega_DE, Omega_k, w0 and wa (Chevallier & Polarski 2001; Linder 2003), H0,
 * omega_b h^2, r_d, the Tripp (1998) coefficients alpha and beta, M_B, the
 * host-mass step, sigma_int, q0, t0.
 * Default priors: wide and flat, except scale parameters (log-uniform).
 * abs_mag spans both standardized peak magnitudes (M near -19.3) and distance
 * moduli given with M already removed (offset near 0).
 */
const ENTRIES: ReadonlyArray<[string, Entry]> = [
  ['omega_m', { meaning: 'matter density today, Omega_m', unit: '', role: 'cosmology', symbol: symbol('\\Omega_{\\rm m}', 'Ω', 'm'), prior: uniform(0, 1), physical: [0, true] }],
  ['omega_de', { meaning: 'dark-energy density today, Omega_DE (free only with curvature: free)', unit: '', role: 'cosmology', symbol: symbol('\\Omega_{\\rm DE}', 'Ω', 'DE'), prior: uniform(0, 2) }],
  ['omega_k', { meaning: 'curvature density today, Omega_k = 1 - Omega_m - Omega_DE', unit: '', role: 'derived', symbol: symbol('\\Omega_{k}', 'Ω', 'k'), derivedOnly: true }],
  ['w0', { meaning: 'dark-energy equation of state today', unit: '', role: 'cosmology', symbol: symbol('w_0', 'w', '0'), prior: uniform(-3, 1) }],
  ['wa', { meaning: 'its evolution, w(a) = w0 + wa (1 - a) (Chevallier & Polarski 2001; Linder 2003)', unit: '', role: 'cosmology', symbol: symbol('w_a', 'w', 'a'), prior: uniform(-5, 5) }],
  ['h0', { meaning: 'Hubble constant (needs calibrators, a computed sound horizon, or a prior)', unit: 'km/s/Mpc', role: 'cosmology', symbol: symbol('H_0', 'H', '0', HUBBLE_UNIT), prior: uniform(50, 100), physical: [0, false] }],
  ['omega_b_h2', { meaning: 'physical baryon density today, omega_b h^2 = Omega_b (H0 / 100 km/s/Mpc)^2', unit: '', role: 'early_universe', symbol: symbol('\\omega_{\\rm b}', 'ω', 'b'), prior: uniform(0.005, 0.05), physical: [0, false] }],
  ['h_ruler', { meaning: 'the BAO ruler in Hubble units, h r_d = (H0 / 100 km/s/Mpc) x sound horizon at the drag epoch', unit: 'Mpc', role: 'probe', symbol: symbol('h\\,r_{\\rm d}', 'h·r', 'd', MPC_UNIT), prior: uniform(50, 200), physical: [0, false] }],
  ['abs_mag', { meaning: 'absolute magnitude (magnitude offset) of a standardized supernova', unit: 'mag', role: 'standardization', symbol: symbol('M_B', 'M', 'B', MAGNITUDE_UNIT), prior: uniform(-25, 5) }],
  ['alpha', { meaning: 'stretch coefficient of the Tripp (1998) relation', unit: 'mag', role: 'standardization', symbol: symbol('\\alpha', 'α'), prior: uniform(0, 0.5) }],
  ['beta', { meaning: 'colour coefficient of the Tripp (1998) relation', unit: '', role: 'standardization', symbol: symbol('\\beta', 'β'), prior: uniform(0, 6) }],
  ['mass_step', { meaning: 'host-mass step added for hosts above the split mass', unit: 'mag', role: 'standardization', symbol: symbol('\\Delta_M', 'Δ', 'M', MAGNITUDE_UNIT), prior: uniform(-0.5, 0.5) }],
  ['sigma_int', { meaning: 'intrinsic magnitude scatter', unit: 'mag', role: 'standardization', symbol: symbol('\\sigma_{\\rm int}', 'σ', 'int', MAGNITUDE_UNIT), prior: logUniform(0.01, 0.5), perSample: true, physical: [0, true] }],
  ['x1_mean', { meaning: 'mean of the stretch population (hierarchical)', unit: '', role: 'population', symbol: symbol('\\bar{x}_1', 'x̄', '1'), prior: uniform(-3, 3), perSample: true }],
  ['x1_width', { meaning: 'width of the stretch population (hierarchical)', unit: '', role: 'population', symbol: symbol('\\sigma_{x_1}', 'σ', 'x1'), prior: logUniform(0.05, 5), perSample: true, physical: [0, false] }],
  ['color_mean', { meaning: 'mean of the colour population (hierarchical)', unit: 'mag', role: 'population', symbol: symbol('\\bar{c}', 'c̄', undefined, MAGNITUDE_UNIT), prior: uniform(-0.3, 0.3), perSample: true }],
  ['color_width', { meaning: 'width of the colour population (hierarchical)', unit: 'mag', role: 'population', symbol: symbol('\\sigma_{c}', 'σ', 'c', MAGNITUDE_UNIT), prior: logUniform(0.01, 0.5), perSample: true, physical: [0, false] }],
  ['x1_mean_slope', { meaning: 'redshift slope of the stretch population mean, mean(z) = x1_mean + slope z (hierarchical; used when named)', unit: '', role: 'population', symbol: symbol('\\partial\\bar{x}_1/\\partial z', 'x̄', '1,z'), prior: uniform(-5, 5) }],
  ['color_mean_slope', { meaning: 'redshift slope of the colour population mean (hierarchical; used when named)', unit: 'mag', role: 'population', symbol: symbol('\\partial\\bar{c}/\\partial z', 'c̄', 'z', MAGNITUDE_UNIT), prior: uniform(-0.5, 0.5) }],
  ['q0', { meaning: 'deceleration parameter today', unit: '', role: 'derived', symbol: symbol('q_0', 'q', '0'), derivedOnly: true }],
  ['z_accel', { meaning: 'redshift where the expansion began to accelerate', unit: '', role: 'derived', symbol: symbol('z_{\\rm acc}', 'z', 'acc'), derivedOnly: true }],
  ['age_gyr', { meaning: 'age of the Universe', unit: 'Gyr', role: 'derived', symbol: symbol('t_0', 't', '0', { unit: 'Gyr', unitLatex: 'Gyr' }), derivedOnly: true }],
  ['r_drag', { meaning: 'comoving sound horizon at the drag epoch', unit: 'Mpc', role: 'derived', symbol: symbol('r_{\\rm d}', 'r', 'd', MPC_UNIT), derivedOnly: true }],
  ['offset', { meaning: 'magnitude offset M + 5 log10(c/H0 / Mpc) + 25', unit: 'mag', role: 'derived', symbol: symbol('\\mathcal{M}', 'ℳ', undefined, MAGNITUDE_UNIT), derivedOnly: true }],
];

/**
 * Every parameter candela knows, keyed by name, in listing order.
 * @example PARAMETERS.omega_m.symbol.label // 'Ωm'
 * @example PARAMETERS.h0.defaultPrior // { kind: 'uniform', min: 50, max: 100 }
 */
export const PARAMETERS: Readonly<Record<string, ParameterDefinition>> = Object.freeze(Object.fromEntries(ENTRIES.map(([name, entry]) => [name, Object.freeze({
  name,
  meaning: entry.meaning,
  unit: entry.unit,
  role: entry.role,
  symbol: entry.symbol,
  perSample: entry.perSample ?? false,
  derivedOnly: entry.derivedOnly ?? false,
  physicalMin: entry.physical?.[0] ?? -Infinity,
  includesMin: entry.physical?.[1] ?? false,
  ...(entry.prior ? { defaultPrior: entry.prior } : {}),
})])));

/** Every base name in listing order (samplable parameters, then derived quantities). */
export const PARAMETER_ORDER: readonly string[] = Object.freeze(ENTRIES.map(([name]) => name));
