/**
 * Every default of the configuration, in one place. docs/configuration.md
 * lists the same values; test/config/defaults.test.ts holds the two together.
 * A key the user leaves out takes the value here.
 */
import { PARAMETERS } from '../parameters/index.js';
import type {
  CovarianceSource, CutOptions, DerivedQuantity, FigureKind, ModelSpec, OutputOptions, PriorSpec,
  SamplerOptions, StandardizationOptions, SystematicModeSource, TableOptions,
} from './candelaConfig.js';

/** Seed used when the file gives none (a warning says so: results are reproducible only with a stated seed). */
export const DEFAULT_SEED = 1;

/** Title used when the file gives none. */
export const DEFAULT_TITLE = 'untitled candela run';

/**
 * Largest accepted |z_helio - z|. The CMB-dipole and peculiar-velocity
 * corrections shift redshifts by about 0.0013 (1 + z) plus ~0.002; the largest
 * difference in the bundled public releases is 0.0034. 0.01 catches swapped
 * or mislabelled columns without flagging real corrections.
 */
export const DEFAULT_MAX_REDSHIFT_MISMATCH = 0.01;

/** Table reading (`supernovae[].table`, except the required `file`). */
export const DEFAULT_TABLE: Omit<TableOptions, 'file'> = {
  delimiter: 'auto',
  comment: '#',
  indexColumn: 'auto',
  rowPrefix: null,
};

/** One covariance entry (`supernovae[].covariances[]`, except the required `file`). */
export const DEFAULT_COVARIANCE: Omit<CovarianceSource, 'file' | 'name'> = {
  appliesTo: 'magnitudes',
  blockOrder: ['m_b', 'x1', 'color'],
  layout: 'interleaved',
  scale: 1,
  // Relative asymmetry accepted in a covariance file: files written with ~10
  // significant digits differ by rounding only, well below this.
  symmetryTolerance: 1e-8,
  includesStatistical: false,
};

/** One file of systematic modes (`supernovae[].systematic_modes[]`, except the required `file`): shifts used as written. */
export const DEFAULT_SYSTEMATIC_MODES: Omit<SystematicModeSource, 'file' | 'name'> = {
  scale: 1,
  perColumn: false,
};

/** Cuts (`supernovae[].cuts`): none by default, calibrators kept. */
export const DEFAULT_CUTS: CutOptions = {
  redshift: null,
  keepCalibrators: true,
  maxAbsX1: null,
  maxAbsColor: null,
  maxErrors: {},
  keepSamples: null,
  dropIds: [],
};

/**
 * Standardization. Lensing 0.055 z mag: Jonsson et al. (2010). Peculiar
 * velocity 250 km/s: common practice for low-redshift samples. Host-mass split
 * at 10^10 M_sun: Sullivan et al. (2010).
 */
export const DEFAULT_STANDARDIZATION: StandardizationOptions = {
  method: 'conventional',
  hostMassStep: { enabled: true, splitLogMass: 10, shape: 'sharp', widthDex: 0.1 },
  scatter: { intrinsic: 'global', lensingPerRedshift: 0.055, peculiarVelocityKmPerS: 250, redshiftErrors: true },
  alphaBetaCovariance: 'exact',
  frozenAt: null,
  offset: 'marginalize',
};

/** The model fitted when `models` is absent; a listed model's missing keys take these values. */
export const DEFAULT_MODEL: Omit<ModelSpec, 'label'> = {
  darkEnergy: 'lambda',
  curvature: 'flat',
  radiation: false,
  parameters: {},
};

/**
 * Prior of every parameter a model uses when `parameters` does not name it:
 * the registry's default prior of each parameter (src/parameters).
 */
export const DEFAULT_PRIORS: Readonly<Record<string, PriorSpec>> = Object.fromEntries(
  Object.values(PARAMETERS).flatMap((definition) => (definition.defaultPrior ? [[definition.name, { ...definition.defaultPrior }]] : [])),
);

/** Values of the cosmological parameters a simpler model does not sample: a cosmological constant has w0 = -1, wa = 0. */
export const NON_SAMPLED_DARK_ENERGY: Readonly<Record<'w0' | 'wa', number>> = { w0: -1, wa: 0 };

/** H0 for ages and distances when h0 is not sampled, km/s/Mpc (`reference_h0`). */
export const DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC = 70;

/** Derived quantities when `derived` is absent: per model (see derivedForModel). */
export const DEFAULT_DERIVED_FLAT: readonly DerivedQuantity[] = ['q0', 'z_accel', 'age_gyr'];
export const DEFAULT_DERIVED_CURVED: readonly DerivedQuantity[] = ['omega_k', 'q0', 'z_accel', 'age_gyr'];

/**
 * Sampler. Stretch scale 2: Goodman & Weare (2010). R-hat 1.01: Vehtari et al. (2021).
 * One move in five a differential-evolution move (ter Braak 2006): on the
 * curved, prior-cut w0-wa ridge of a supernova-only fit it halves the
 * autocorrelation time of the stretch move alone (measured in bench/RESULTS.md:
 * 3,500 instead of 7,000 steps to bulk ESS 2,000 on 1,829 supernovae).
 */
export const DEFAULT_SAMPLER: SamplerOptions = {
  method: 'ensemble',
  walkers: 32,
  ensembles: 4,
  stretchScale: 2,
  differentialEvolutionWeight: 0.2,
  maxSteps: 50_000,
  checkEvery: 500,
  targetEss: 2000,
  maxRhat: 1.01,
  maxMinutes: 60,
  workers: 'auto',
  checkpointEvery: 500,
  nested: { livePoints: 500, maxUnexploredLnZ: 0.1, maxIterations: 200_000 },
};

/** Figures drawn when `output.figures` is absent. */
export const DEFAULT_FIGURES: readonly FigureKind[] = ['triangle', 'hubble', 'trace'];

/** Output (`output`). Bandwidth rule: Scott (1992). */
export const DEFAULT_OUTPUT: Omit<OutputOptions, 'dir'> & { dir: string } = {
  dir: 'out/run',
  contourPairs: 'auto',
  smoothing: { kernel: 'gaussian', bandwidth: 'scott', factor: 1 },
  figures: [...DEFAULT_FIGURES],
  png: true,
  figureWidth: 'screen',
  font: 'sans',
  pdf: false,
  pngDpi: null,
  triangleParameters: 'auto',
  truthFile: null,
  // chains.csv: the thinned steps after the burn-in, half an autocorrelation time apart (common practice: draws that
  // close are still correlated, so little is lost); `keep: all` writes every step.
  chains: { keep: 'after_burn_in', thinTauFraction: 0.5 },
  chainMemoryMb: null,
};

/** Parameters blinded when the `blinding` block names none: the dark-energy and expansion parameters a survey's headline is about. */
export const DEFAULT_BLINDING_PARAMETERS: readonly string[] = ['w0', 'wa', 'omega_m', 'h0'];

/**
 * Default width of each parameter's secret offset (`blinding.offset_widths`),
 * in its unit: several posterior standard deviations of a present-day
 * supernova (+ BAO) fit, so that even the smallest offset (a quarter of the
 * width) moves a value by one to two standard deviations. Typical standard
 * deviations, from memory: Omega_m 0.01-0.02, w0 0.05-0.1, wa 0.3-0.5, H0
 * about 1 km/s/Mpc with calibrators, omega_b h^2 0.0005, h r_d 1 Mpc, M_B 0.03 mag.
 */
export const DEFAULT_BLINDING_WIDTHS: Readonly<Record<string, number>> = {
  omega_m: 0.1, omega_de: 0.1, w0: 0.3, wa: 1, h0: 5, omega_b_h2: 0.003, h_ruler: 5, abs_mag: 0.2,
};
