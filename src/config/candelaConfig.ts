/**
 * The validated configuration of one candela run: what the YAML file says,
 * with every default filled in and every path resolved. Only config/,
 * pipeline/ and cli/ see this type; lower layers take small option objects.
 * YAML keys are snake_case; the same settings here are camelCase, except
 * where a key is data the user writes (column fields, parameter names).
 * docs/configuration.md explains every setting; defaults live in defaults.ts.
 */
import type { DarkEnergyLaw } from '../cosmology/index.js';
import type { ProbeBlock } from '../probes/index.js';

/** A path as written in the configuration and as resolved against the configuration file's folder. */
export interface ResolvedPath {
  /** Exactly as the user wrote it. */
  written: string;
  /** Joined to the configuration file's folder (unchanged when `written` is absolute). */
  resolved: string;
}

/** Where a key or value sits in the configuration file (1-based). */
export interface SourcePosition {
  line: number;
  column: number;
}

/** `light_curves`: peak magnitude, stretch, colour per supernova; `magnitudes`: standardized magnitudes or distance moduli. */
export type SupernovaKind = 'light_curves' | 'magnitudes';

/** Tool fields a table column can be mapped to (the keys of `columns`). */
export type ColumnField =
  | 'id' | 'sample' | 'z' | 'z_helio' | 'z_err'
  | 'magnitude' | 'magnitude_err'
  | 'm_b' | 'm_b_err' | 'x1' | 'x1_err' | 'color' | 'color_err'
  | 'cov_m_b_x1' | 'cov_m_b_color' | 'cov_x1_color'
  | 'host_log_mass' | 'host_log_mass_err'
  | 'bias_correction' | 'calibrator_mu';

/** The uncertainty fields (`*_err`) a `cuts.max_errors` entry may name. */
export type ErrorField = 'z_err' | 'magnitude_err' | 'm_b_err' | 'x1_err' | 'color_err' | 'host_log_mass_err';

/** The three light-curve quantities of a 3N x 3N covariance block. */
export type LightCurveQuantity = 'm_b' | 'x1' | 'color';

/** How the supernova table is split into fields and rows. */
export interface TableOptions {
  file: ResolvedPath;
  delimiter: 'auto' | 'comma' | 'tab' | 'whitespace';
  /** Lines starting with this text are comments (null: none). */
  comment: string | null;
  /** Whether data rows start with an unnamed running index (`auto`: detect from the header). */
  indexColumn: 'auto' | 'yes' | 'no';
  /** A fixed word every data row starts with, removed before splitting (null: none). */
  rowPrefix: string | null;
}

/** One covariance file added to the statistical covariance. */
export interface CovarianceSource {
  file: ResolvedPath;
  /** Name of this systematic in the budget (`name`, or the file's stem), unique in the configuration. */
  name: string;
  /** `magnitudes`: N x N on the magnitudes; `light_curve_parameters`: 3N x 3N on (m_b, x1, color). */
  appliesTo: 'magnitudes' | 'light_curve_parameters';
  /** Order of the three quantities within one supernova's block (3N only). */
  blockOrder: LightCurveQuantity[];
  /** `interleaved`: sn1 (a, b, c), sn2 (a, b, c) ...; `grouped`: all a, all b, all c (3N only). */
  layout: 'interleaved' | 'grouped';
  /** Every element is multiplied by this (dimensionless). */
  scale: number;
  /** Largest accepted |C_ij - C_ji| / max(|C_ij|, |C_ji|) (relative). */
  symmetryTolerance: number;
  /** The matrix already holds the statistical errors: the per-supernova error columns are then not added on its diagonal. */
  includesStatistical: boolean;
}

/**
 * One file of systematic modes: N rows (the table's order, before cuts) of K
 * magnitude shifts, one per systematic, so that the systematic covariance is
 * C_sys = U U^T without an N x N matrix.
 */
export interface SystematicModeSource {
  file: ResolvedPath;
  /** Name of this systematic in the budget (`name`, or the file's stem), unique in the configuration. */
  name: string;
  /** The budget treats each column as a systematic of its own, named `<name>.<column name>` (`<name>.<column number>` without a header). */
  perColumn: boolean;
  /** Every shift is multiplied by this (dimensionless, > 0); C_sys scales by its square. */
  scale: number;
}

/** Row selection applied after reading (null or empty: no cut). */
export interface CutOptions {
  /** Keep min <= z <= max (the `z` column). */
  redshift: [number, number] | null;
  /** Rows with a calibrator distance are kept whatever their redshift. */
  keepCalibrators: boolean;
  maxAbsX1: number | null;
  /** mag */
  maxAbsColor: number | null;
  /** Largest accepted uncertainty per `*_err` field, in that field's units. */
  maxErrors: Partial<Record<ErrorField, number>>;
  /** Keep only these values of the `sample` column (null: all). */
  keepSamples: string[] | null;
  /** Identifiers to drop. */
  dropIds: string[];
}

/** One supernova data set (several are concatenated). */
export interface SupernovaDataSet {
  /** Unique name used in outputs (letters, digits, `_`, `-`). */
  label: string;
  kind: SupernovaKind;
  table: TableOptions;
  /** Tool field -> column name in the file. */
  columns: Partial<Record<ColumnField, string>>;
  /** Sentinel values meaning "unknown", per field. */
  missingValues: Partial<Record<ColumnField, number[]>>;
  covariances: CovarianceSource[];
  /** Files of systematic modes on the magnitudes (empty: none); their columns are placed side by side. */
  systematicModes: SystematicModeSource[];
  cuts: CutOptions;
  /** Largest accepted |z_helio - z| (dimensionless); larger is a data error. */
  maxRedshiftMismatch: number;
  /** Names shown in figure legends for the codes of the `sample` column (code -> name; codes not listed are shown as they are). */
  sampleNames: Record<string, string>;
  /** The rows are already redshift bins (a compressed Hubble diagram): figures draw them as they are, without binning them again. */
  binned: boolean;
}

/** How magnitudes become distance moduli (Tripp 1998 relation and error terms). */
export interface StandardizationOptions {
  method: 'conventional' | 'hierarchical';
  hostMassStep: {
    enabled: boolean;
    /** log10(M / M_sun) where the step happens. */
    splitLogMass: number;
    shape: 'sharp' | 'logistic';
    /** Width of the logistic step, dex. */
    widthDex: number;
  };
  scatter: {
    intrinsic: 'global' | 'per_sample' | 'off';
    /** Lensing dispersion per unit redshift, mag (0 = off). */
    lensingPerRedshift: number;
    /** Peculiar-velocity dispersion, km/s (0 = off). */
    peculiarVelocityKmPerS: number;
    /** Propagate redshift uncertainties into magnitudes. */
    redshiftErrors: boolean;
  };
  /** `exact`: covariance recomputed with the sampled alpha, beta; `frozen`: computed once at `frozenAt`. */
  alphaBetaCovariance: 'exact' | 'frozen';
  frozenAt: { alpha: number; beta: number } | null;
  /** `marginalize`: the magnitude offset is integrated out analytically (flat prior); `sample`: abs_mag is a parameter. */
  offset: 'marginalize' | 'sample';
}

/** A prior density on one parameter. */
export type PriorSpec =
  | { kind: 'uniform'; min: number; max: number }
  | { kind: 'gaussian'; mean: number; sd: number }
  | { kind: 'truncated_gaussian'; mean: number; sd: number; min: number; max: number }
  | { kind: 'log_uniform'; min: number; max: number };

/** A parameter is either sampled under a prior or held fixed. */
export type ParameterSpec = { mode: 'prior'; prior: PriorSpec } | { mode: 'fixed'; value: number };

/** One cosmological model, fitted into its own run folder. */
export interface ModelSpec {
  /** Unique name, used as the folder name. */
  label: string;
  /** A law of the registry (src/cosmology/darkEnergyLaws.ts). */
  darkEnergy: DarkEnergyLaw;
  curvature: 'flat' | 'free';
  /** Include photons (T_CMB 2.7255 K) and 3.046 massless neutrino species. */
  radiation: boolean;
  /** Per-model replacements of entries of the global `parameters` block. */
  parameters: Record<string, ParameterSpec>;
}

/** Quantities computed from each sample. */
export type DerivedQuantity = 'omega_k' | 'omega_de' | 'q0' | 'z_accel' | 'age_gyr' | 'offset';

/** Settings of the posterior sampler and its stopping rule. */
export interface SamplerOptions {
  method: 'ensemble' | 'nested';
  walkers: number;
  /** Independent ensembles (for R-hat between them). */
  ensembles: number;
  /** Stretch-move scale a > 1 (Goodman & Weare 2010). */
  stretchScale: number;
  /** Fraction of differential-evolution moves (ter Braak 2006), 0..1. */
  differentialEvolutionWeight: number;
  maxSteps: number;
  checkEvery: number;
  targetEss: number;
  maxRhat: number;
  maxMinutes: number;
  /** Worker threads; `auto` = number of cores. */
  workers: 'auto' | number;
  /** Steps between checkpoints (0 = never). */
  checkpointEvery: number;
  /**
   * Nested sampling: live points; stop once the live points could add at most
   * `maxUnexploredLnZ` (nats) to ln Z; the iteration cap.
   */
  nested: { livePoints: number; maxUnexploredLnZ: number; maxIterations: number };
}

/** What to write and draw. */
export type FigureKind = 'triangle' | 'hubble' | 'residuals' | 'trace' | 'autocorrelation';

/** Output folder and figure settings. */
export interface OutputOptions {
  /** One subfolder per model label. */
  dir: ResolvedPath;
  contourPairs: 'auto' | Array<[string, string]>;
  smoothing: { kernel: 'gaussian' | 'none'; bandwidth: 'scott' | 'silverman' | number; factor: number };
  figures: FigureKind[];
  png: boolean;
  /** Width of every figure: `screen` (the on-screen design width, 640 px), one journal column, both columns, or inches. */
  figureWidth: 'screen' | 'single' | 'double' | { inches: number };
  /** Text face of the figures. */
  font: 'sans' | 'serif';
  /** Also write each figure as PDF. */
  pdf: boolean;
  /** PNG resolution in dots per inch of the figure's printed width; null: 1600 px wide whatever the width. */
  pngDpi: number | null;
  /** Parameters of the triangle figure, in order; `auto`: every sampled one up to seven, else the cosmological ones. */
  triangleParameters: 'auto' | string[];
  /** A mock's truth.json (as `candela simulate` writes it): its values are marked in the triangle figure. Null: none. */
  truthFile: ResolvedPath | null;
  /**
   * Which steps of an ensemble run chains.csv holds: `after_burn_in`, the
   * steps after the burn-in one in floor(thinTauFraction x largest tau)
   * (every walker kept), or `all`, every step with the burn-in flagged. The
   * chain record (chain-record.bin) always holds every step.
   */
  chains: { keep: 'after_burn_in' | 'all'; thinTauFraction: number };
  /**
   * Memory the chains of an ensemble run may take as numbers when the run is
   * summarized (end of the fit, `report`, `compare`, `budget`), MB; a longer
   * run is read keeping every k-th step. Null: the reader's default (1024 MB).
   */
  chainMemoryMb: number | null;
}

/**
 * Blinding (docs/blinding.md): the listed parameters are shown everywhere as
 * true value + a secret offset drawn uniformly in magnitude between a
 * quarter of its width and its width, with a random sign, until `candela unblind`.
 */
export interface BlindingOptions {
  /** Parameter names, in the order written (only those a model samples are blinded). */
  parameters: string[];
  /** Largest |offset| per listed parameter, in its unit. */
  offsetWidths: Record<string, number>;
}

/** The whole validated configuration. */
export interface CandelaConfig {
  title: string;
  /** Seed of every random stream (integer or text). */
  seed: number | string;
  supernovae: SupernovaDataSet[];
  standardization: StandardizationOptions;
  /** Likelihood terms beside the supernovae (BAO, ...), one block per probe of the registry. */
  probes: ProbeBlock[];
  models: ModelSpec[];
  /**
   * Global prior or fixed value per parameter: the user's entries plus the
   * default of every parameter some model uses (see parametersForModel).
   */
  parameters: Record<string, ParameterSpec>;
  /** `auto`: the per-model default list (see derivedForModel). */
  derived: 'auto' | DerivedQuantity[];
  /** km/s/Mpc, used for ages and distances when h0 is not a parameter. */
  referenceH0KmPerSPerMpc: number;
  sampler: SamplerOptions;
  output: OutputOptions;
  /** Blinding of chosen parameters (null: none). */
  blinding: BlindingOptions | null;
  /** The configuration file and where each key path sits in it (for messages of later stages). */
  source: { file: ResolvedPath; positions: Record<string, SourcePosition> };
}
