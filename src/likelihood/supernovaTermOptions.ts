import type { CovarianceMatrix, SupernovaTable, SystematicModes } from '../data/index.js';
import type { DarkEnergyLaw } from '../cosmology/index.js';
import type { HostMassStep, ScatterTerms } from '../standardize/index.js';
import type { LikelihoodTerm, ParameterValues } from './likelihoodTerm.js';

/** The evaluation strategies of the supernova term (see createSupernovaTerm). */
export type SupernovaPath = 'general' | 'diagonal' | 'low_rank' | 'compressed';

/** Plain options of {@link createSupernovaTerm} (no configuration type). */
export interface SupernovaTermOptions {
  /** Label of the term in messages and summaries. */
  name: string;
  /** The sample, after cuts. */
  table: SupernovaTable;
  /** Extra covariance matrices (statistical or systematic), already scaled; N x N on magnitudes or 3N x 3N on (m_B, x1, c). */
  covariances: CovarianceMatrix[];
  /**
   * Systematic modes U (N x K, mag) on the magnitudes: C gains U U^T. With no
   * dense matrix besides them the covariance stays "diagonal plus low rank",
   * evaluated through the Woodbury identity without an N x N matrix.
   */
  systematicModes?: SystematicModes;
  /** Which FLRW family; its parameters are read by name (omega_m, omega_de, w0, wa, h0). */
  cosmologyModel: { darkEnergy: DarkEnergyLaw; flat: boolean; cmbTemperatureK: number; effectiveNeutrinoSpecies: number };
  standardization: {
    /** Host-mass step shape; when enabled the parameter mass_step (mag) is read. */
    massStep: HostMassStep;
    /** Lensing, peculiar-velocity and redshift-error variance terms. */
    scatter: ScatterTerms;
    /** Intrinsic scatter: one sigma_int, one sigma_int_<sample> per sample, or none. */
    intrinsicScatter: 'global' | 'per_sample' | 'off';
    /** 'exact': the covariance follows alpha and beta; 'frozen': evaluated once at frozenAt. */
    alphaBetaCovariance: 'exact' | 'frozen';
    /** Where to freeze (default: the fixed alpha and beta). */
    frozenAt?: { alpha: number; beta: number };
  };
  /** 'marginalize': integrate abs_mag out analytically; 'sample': read abs_mag as a parameter. */
  offset: 'marginalize' | 'sample';
  /** Evaluation strategy (default 'auto'). */
  fastPath?: 'auto' | SupernovaPath;
  /** Largest allowed |delta chi^2| of the compressed path against the exact model (default 1e-7). */
  compressionTolerance?: number;
  /**
   * Parameters held constant for the whole run (the posterior's fixed values).
   * A covariance that depends only on these is factorized once; parameters not
   * listed here are assumed to vary. Default: none.
   */
  fixed?: Readonly<Record<string, number>>;
}

/** The Hubble diagram at a parameter point: one entry per supernova, in table order. */
export interface HubbleDiagram {
  ids: string[];
  /** Hubble-diagram redshift. */
  redshift: Float64Array;
  /** True for calibrators (external distance modulus). */
  isCalibrator: boolean[];
  /** Observed distance modulus: standardized magnitude minus the absolute magnitude used, mag. */
  distanceModulusMag: Float64Array;
  /** sqrt of the diagonal of the full covariance C (statistical, systematic matrices and modes), mag. */
  distanceModulusErrorMag: Float64Array;
  /** Model distance modulus (calibratorMu for calibrators), mag. */
  modelDistanceModulusMag: Float64Array;
  /** Observed minus model, mag. */
  residualMag: Float64Array;
  /** The absolute magnitude used (abs_mag, or its best fit when marginalized), mag. */
  absoluteMagnitudeMag: number;
  /** H0 used for the model distance moduli, km/s/Mpc. */
  h0KmPerSPerMpc: number;
}

/** The supernova likelihood term with its diagnostics. */
export interface SupernovaTerm extends LikelihoodTerm {
  /** The evaluation strategy in use. */
  readonly path: SupernovaPath;
  /** Warnings about approximations in use (e.g. a frozen covariance). */
  readonly warnings: readonly string[];
  /** Human-readable lines: path and cost, normalization, compression nodes and error bound, warnings. */
  describe(): string[];
  /** Best-fit absolute magnitude given the other parameters (conditional maximum of L), mag. Throws CandelaError at a rejected point. */
  bestFitOffset(p: ParameterValues): number;
  /** Per-supernova observed and model distance moduli at p (exact distances; allocates). Throws CandelaError at a rejected point. */
  hubbleDiagram(p: ParameterValues): HubbleDiagram;
}
