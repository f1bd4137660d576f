/**
 * What a probe (one independent likelihood term beside or instead of the
 * supernovae: BAO distances, compressed CMB distances, ...) declares so that
 * the configuration, the posterior and the outputs need no edit to take it:
 * its configuration block as data, the parameters it requires, how it loads
 * its data, and how it becomes a likelihood term.
 * Adding a probe is one folder with a definition plus one line in registry.ts.
 */
import type { CosmologyFamily } from '../cosmology/index.js';
import type { LikelihoodTerm, ParameterValues } from '../likelihood/index.js';

/** The kind of value a setting takes. `path`: a file, resolved against the configuration's folder. */
export type SettingKind = 'path' | 'text' | 'number' | 'choice' | 'boolean';

/** One key of a probe's configuration block. */
export interface SettingSpec {
  readonly key: string;
  readonly kind: SettingKind;
  /** One line for messages and the documentation. */
  readonly meaning: string;
  readonly required?: boolean;
  /** Allowed values of a `choice`. */
  readonly choices?: readonly string[];
  /** Value when the key is absent (none: absent stays absent). */
  readonly default?: string | number | boolean;
  /** Smallest allowed `number` (inclusive). */
  readonly min?: number;
}

/** A probe's settings after validation: values by key; paths are absolute. */
export type ProbeSettings = Readonly<Record<string, string | number | boolean | undefined>>;

/** One configured probe: which, its settings, and its files as the user wrote them. */
export interface ProbeBlock {
  readonly key: string;
  readonly settings: ProbeSettings;
  /** Setting key -> path as written in the configuration (for messages and checksums). */
  readonly writtenPaths: Readonly<Record<string, string>>;
}

/** The model a term is built for: its FLRW family and the H0 used when h0 is not sampled. */
export interface ProbeModel {
  readonly darkEnergy: CosmologyFamily['darkEnergy'];
  readonly flat: boolean;
  /** km/s/Mpc; used when the parameter values hold no h0. */
  readonly referenceH0KmPerSPerMpc: number;
}

/** The data of a probe, read and checked, plus a description for the run's record. */
export interface LoadedProbe {
  readonly key: string;
  readonly data: unknown;
  /** Data points it contributes (information criteria, degrees of freedom). */
  readonly dataCount: number;
  /** Lines for the terminal and check output. */
  readonly describe: readonly string[];
}

/**
 * A probe's data against its fit, as plain numbers for its figure: each
 * quantity divided by a reference model, the data with 1-sigma errors, and the
 * fitted curve (best fit and 68% band of the posterior draws).
 */
export interface ProbeDiagram {
  title: string;
  xLabel: string;
  yLabel: string;
  referenceLabel: string;
  groups: Array<{
    label: string;
    points: { x: number[]; y: number[]; error: number[] };
    curve: { x: number[]; best: number[]; low68: number[]; high68: number[] };
  }>;
}

/** The declaration of one probe. */
export interface ProbeDefinition {
  /** Key of its block under `probes:` in the configuration, and its term's name. */
  readonly key: string;
  /** A title for pages and tables. */
  readonly title: string;
  readonly settings: readonly SettingSpec[];
  /**
   * Parameter names (of the parameter registry) the term reads besides the
   * model's cosmology (omega_m, omega_de and the law's own parameters are
   * read from the model); e.g. ['h_ruler'] or ['h0', 'omega_b_h2'].
   */
  requires(settings: ProbeSettings): readonly string[];
  /** Reads and checks the data. @throws CandelaError naming the file, row and fix. */
  load(block: ProbeBlock): LoadedProbe;
  /** The likelihood term for one model (allocates its buffers once). */
  createTerm(loaded: LoadedProbe, settings: ProbeSettings, model: ProbeModel): LikelihoodTerm;
  /**
   * The data-versus-model figure of the term, from the best fit and a set of
   * posterior draws (optional: a probe without one draws no figure).
   */
  diagram?(loaded: LoadedProbe, settings: ProbeSettings, model: ProbeModel, best: ParameterValues, draws: readonly ParameterValues[]): ProbeDiagram | null;
}
