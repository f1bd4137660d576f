import type { CovarianceMatrix, SupernovaTable, SystematicModes } from '../data/index.js';
import type { LikelihoodTerm, ParameterValues } from './likelihoodTerm.js';
import type { HubbleDiagram, SupernovaTermOptions } from './supernovaTermOptions.js';

/**
 * Evaluation strategies of the hierarchical term: 'blocks' when every
 * covariance is per supernova (3 x 3 blocks, O(N) per call); 'dense' when a
 * matrix couples supernovae (one 3N x 3N Cholesky factorization per change
 * of the covariance inputs).
 */
export type HierarchicalPath = 'blocks' | 'dense';

/** The population model of the latent stretch and colour. */
export interface PopulationModel {
  /**
   * true: one mean and width of x1 and of c per sample, read as
   * x1_mean_<sample>, x1_width_<sample>, color_mean_<sample>, color_width_<sample>;
   * false: one set for all, read as x1_mean, x1_width, color_mean, color_width.
   */
  perSample: boolean;
  /**
   * true: the means drift linearly with the Hubble-diagram redshift,
   * mean(z) = mean + slope z, with two global slopes x1_mean_slope and
   * color_mean_slope (per unit redshift; mag for colour).
   */
  redshiftDependentMeans: boolean;
}

/**
 * Plain options of {@link createHierarchicalSupernovaTerm} (no configuration
 * type). The shape follows SupernovaTermOptions where it applies; the table
 * must hold light-curve parameters (m_B, x1, c with errors).
 */
export interface HierarchicalTermOptions {
  /** Label of the term in messages and summaries. */
  name: string;
  /** The sample after cuts, kind 'light_curves'. */
  table: SupernovaTable;
  /** Extra covariance matrices, already scaled: N x N on m_B or 3N x 3N on (m_B, x1, c). */
  covariances: CovarianceMatrix[];
  /**
   * Systematic modes U (N x K, mag, already scaled) on m_B: the 3N covariance
   * gains V V^T, V the 3N x K matrix with U's rows in the m_B slots. Without
   * a matrix that couples supernovae the 'blocks' path stays O(N K^2) per call
   * through the Woodbury identity (hierarchicalModes.ts); with one, U U^T is
   * added to the dense 3N x 3N matrix.
   */
  systematicModes?: SystematicModes;
  /** Which FLRW family; its parameters are read by name (omega_m, omega_de, w0, wa, h0). */
  cosmologyModel: SupernovaTermOptions['cosmologyModel'];
  standardization: {
    /** Host-mass step shape; when enabled the parameter mass_step (mag) is read. */
    massStep: SupernovaTermOptions['standardization']['massStep'];
    /** Lensing, peculiar-velocity and redshift-error variance terms, added to the m_B variance. */
    scatter: SupernovaTermOptions['standardization']['scatter'];
    /** Intrinsic magnitude scatter: one sigma_int, one sigma_int_<sample> per sample, or none. */
    intrinsicScatter: 'global' | 'per_sample' | 'off';
    /**
     * Only for the 'dense' path: 'exact' refactorizes the 3N x 3N covariance
     * whenever alpha, beta, a width or sigma_int changes; 'frozen' evaluates it
     * once at `frozenAt`. The 'blocks' path is always exact.
     */
    alphaBetaCovariance: 'exact' | 'frozen';
    /**
     * Values to freeze the dense covariance at, by parameter name: alpha,
     * beta, every width and every sigma_int; missing names are taken from
     * `fixed`. (An `{ alpha, beta }` object of the conventional term fits.)
     */
    frozenAt?: Readonly<Record<string, number>>;
  };
  /** The latent stretch and colour populations. */
  population: PopulationModel;
  /** 'marginalize': integrate abs_mag out analytically (flat prior); 'sample': read abs_mag. */
  offset: 'marginalize' | 'sample';
  /** Parameters held constant for the whole run. Default: none. */
  fixed?: Readonly<Record<string, number>>;
}

/** Posterior of the true stretch and colour of each supernova, in table order. */
export interface LatentEstimates {
  ids: string[];
  /** Posterior mean of the true x1. */
  stretchMean: Float64Array;
  /** Posterior standard deviation of the true x1. */
  stretchSd: Float64Array;
  /** Posterior mean of the true c, mag. */
  colorMeanMag: Float64Array;
  /** Posterior standard deviation of the true c, mag. */
  colorSdMag: Float64Array;
  /** Posterior correlation of the true x1 and c. */
  stretchColorCorrelation: Float64Array;
  /** Absolute magnitude the estimates are conditioned on (abs_mag, or its best fit when marginalized), mag. */
  absoluteMagnitudeMag: number;
}

/** The hierarchical supernova likelihood term with its diagnostics. */
export interface HierarchicalTerm extends LikelihoodTerm {
  /** The evaluation strategy in use. */
  readonly path: HierarchicalPath;
  /** Warnings about approximations or weak constraints. */
  readonly warnings: readonly string[];
  /** Human-readable lines: path and cost, populations, normalization, covariance parts, warnings. */
  describe(): string[];
  /** Best-fit absolute magnitude given the other parameters, mag. Throws CandelaError at a rejected point. */
  bestFitOffset(p: ParameterValues): number;
  /** Hubble diagram with shrunken (population-informed) x1 and c; allocates. Throws CandelaError at a rejected point. */
  hubbleDiagram(p: ParameterValues): HubbleDiagram;
  /** Posterior mean and sd of the true x1 and c given all the data; allocates. Throws CandelaError at a rejected point. */
  latentEstimates(p: ParameterValues): LatentEstimates;
}
