import type { ParameterSymbol } from '../figures/index.js';
import type { ReportBudget } from './budgetSection.js';

/** Facts about the run shown at the top of the report. */
export interface ReportRunFacts {
  /** Seed the run was started from (as the user gave it). */
  seed: string | number;
  /** Sampler steps taken per walker (steps). */
  steps: number;
  /** Walkers per ensemble and number of ensembles, when known. */
  walkers?: number;
  ensembles?: number;
  /** Why sampling stopped, in words, e.g. 'converged: chain longer than 50 autocorrelation times'. */
  stopReason: string;
  /** Elapsed wall-clock time (s). */
  wallTimeSeconds: number;
  /** candela version that wrote the report. */
  version: string;
  /** Cosmological model in words, e.g. 'flat wCDM'. */
  model?: string;
  /** Start time as an ISO 8601 text (the caller reads the clock; this layer does not). */
  startedAt?: string;
  /** Further facts, shown in order after the others. */
  extra?: readonly { label: string; value: string }[];
}

/** The parameter summary table: already-rounded text cells (e.g. from the summaries module's formatter). */
export interface ReportSummaryTable {
  /** Column headings after the parameter column, e.g. ['median and 68% interval', '95% interval']. */
  columns: readonly string[];
  /** One row per parameter: its name and one text cell per column. */
  rows: readonly { parameter: string; cells: readonly string[]; note?: string }[];
  /** Sentence shown under the table (how values and errors are defined). */
  note?: string;
}

/** Convergence numbers of one parameter. */
export interface ReportDiagnosticRow {
  parameter: string;
  /** Rank-normalized split R-hat (Vehtari et al. 2021), dimensionless. */
  rHat: number;
  /** Effective sample size (draws). */
  ess: number;
  /** Integrated autocorrelation time (steps; Goodman & Weare 2010 / Sokal 1997). */
  autocorrelationTimeSteps: number;
}

/** Convergence numbers and the thresholds they are judged against. */
export interface ReportDiagnostics {
  rows: readonly ReportDiagnosticRow[];
  /** Steps per walker in the whole chain (steps). */
  chainLengthSteps: number;
  /** Largest acceptable R-hat (e.g. 1.01, Vehtari et al. 2021). */
  rHatMax: number;
  /** Smallest acceptable ESS (draws; e.g. 400, Vehtari et al. 2021). */
  essMin: number;
  /** Chain length must reach this many autocorrelation times (e.g. 50, common practice). */
  tauMultiple: number;
  /** Mean acceptance fraction of the stretch move, if known (0..1). */
  acceptanceFraction?: number;
  /** When set, Markov-chain checks do not apply to this run (e.g. nested sampling): this sentence says why and what stands instead. */
  notApplicable?: string;
}

/** One figure of the report. */
export interface ReportFigure {
  /** Short heading. */
  title: string;
  /** The SVG document (e.g. from triangleFigure); its ids are made unique on the page. */
  svg: string;
  /** Sentence under the figure. */
  caption?: string;
  /** Name of the figure's file next to the report, shown for reference. */
  fileName?: string;
}

/** An input file and its SHA-256 digest (hex), computed by the caller. */
export interface ReportInputFile {
  /** The path as the user wrote it. */
  path: string;
  /** The same path resolved against the configuration file's folder, when it differs from `path`. */
  resolvedPath?: string;
  sha256: string;
  /** File size (bytes). */
  sizeBytes?: number;
  /** What the file is, e.g. 'supernova table', 'systematic covariance'. */
  role?: string;
}

/** A warning with its kind and the parameter it concerns (see the summaries' RunWarning). */
export interface ReportWarning {
  code: string;
  parameter: string | null;
  message: string;
}

/** Everything {@link reportHtml} puts on the page. */
export interface ReportInput {
  title: string;
  facts: ReportRunFacts;
  summary: ReportSummaryTable;
  diagnostics: ReportDiagnostics;
  figures: readonly ReportFigure[];
  /** The configuration after defaults were filled in, as YAML text. */
  configurationYaml: string;
  inputFiles: readonly ReportInputFile[];
  /**
   * Warnings of the run, shown in the box at the top: plain sentences, or
   * warning objects whose code and parameter are shown before the sentence.
   */
  warnings?: readonly (string | ReportWarning)[];
  /** Parameter symbols for table headings, replacing the output layer's parameterSymbols table. */
  symbols?: Readonly<Record<string, ParameterSymbol>>;
  /** The run's systematic budget (candela budget), shown after the figures when present. */
  budget?: ReportBudget;
}
