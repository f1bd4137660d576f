/**
 * The shape of a configuration in the file's own form (snake_case keys), as
 * configToPlainObject writes it into run.json, typed for reading it back.
 * Every key is optional: a run written by an older candela lacks the newer
 * keys, and the readers fall back to the defaults. Only the keys that the
 * commands reading a run folder use (report, compare, merge) are spelled
 * out; the rest stays unknown.
 */
export interface PlainConfiguration {
  title?: string;
  seed?: string | number;
  reference_h0?: number;
  models?: Array<{ label?: string }>;
  supernovae?: Array<{
    label?: string;
    binned?: boolean;
    sample_names?: Record<string, string>;
    table?: { file?: string };
    covariances?: Array<{ file?: string; applies_to?: string }>;
    systematic_modes?: Array<{ file?: string }>;
  }>;
  probes?: Record<string, Record<string, unknown>>;
  standardization?: { host_mass_step?: { split_log_mass?: number } };
  output?: {
    figures?: string[];
    png?: boolean;
    figure_width?: string | number;
    font?: string;
    pdf?: boolean;
    png_dpi?: number;
    triangle_parameters?: 'auto' | string[];
    truth_file?: string;
    contour_pairs?: 'auto' | Array<[string, string]>;
    smoothing?: { kernel?: string; bandwidth?: string | number; factor?: number };
    chain_memory_mb?: number;
  };
}

/**
 * A stored configuration (run.json's `configuration`) typed as
 * PlainConfiguration; anything that is not an object reads as empty, so a
 * damaged record gives the defaults rather than a crash.
 * Cost: O(1).
 * @param value the stored configuration.
 * @returns the same object, typed.
 * @throws nothing.
 * @example plainConfiguration(record.configuration).output?.png // true
 */
export function plainConfiguration(value: unknown): PlainConfiguration {
  return value !== null && typeof value === 'object' && !Array.isArray(value) ? (value as PlainConfiguration) : {};
}
