/**
 * A validated configuration back in the file's own shape (snake_case keys,
 * every default written out), for the copy stored with each run.
 */
import { relative } from 'node:path';
import type { CandelaConfig, ParameterSpec, ResolvedPath, SupernovaDataSet } from './candelaConfig.js';

/** Options of configToPlainObject. */
export interface PlainConfigOptions {
  /**
   * Write file paths relative to this folder (e.g. the run folder the copy is
   * stored in), so that reading the copy from there finds the same files.
   * Absent: the resolved paths as they are.
   */
  pathsRelativeTo?: string;
}

/**
 * Converts a configuration to a plain object that parseConfigText accepts
 * and that reads back to the same configuration (nulls meaning "none" are
 * left out). Cost: linear in the configuration size.
 * @param config the validated configuration.
 * @param options where paths should be relative to.
 * @example configToPlainObject(config).sampler // { method: 'ensemble', walkers: 32, ... }
 */
export function configToPlainObject(config: CandelaConfig, options: PlainConfigOptions = {}): Record<string, unknown> {
  const path = (p: ResolvedPath): string => options.pathsRelativeTo === undefined ? p.resolved : relative(options.pathsRelativeTo, p.resolved) || '.';
  const { standardization: s, sampler, output } = config;
  return {
    title: config.title,
    seed: config.seed,
    // A run of probes alone has no supernovae block (an empty list would not validate when read back).
    ...(config.supernovae.length > 0 ? { supernovae: config.supernovae.map((set) => dataSetToPlain(set, path)) } : {}),
    standardization: {
      method: s.method,
      host_mass_step: {
        enabled: s.hostMassStep.enabled, split_log_mass: s.hostMassStep.splitLogMass, shape: s.hostMassStep.shape,
        ...(s.hostMassStep.shape === 'logistic' ? { width_dex: s.hostMassStep.widthDex } : {}),
      },
      scatter: {
        intrinsic: s.scatter.intrinsic, lensing_per_redshift: s.scatter.lensingPerRedshift,
        peculiar_velocity_km_s: s.scatter.peculiarVelocityKmPerS, redshift_errors: s.scatter.redshiftErrors,
      },
      alpha_beta_covariance: s.alphaBetaCovariance,
      ...(s.alphaBetaCovariance === 'frozen' && s.frozenAt ? { frozen_at: { ...s.frozenAt } } : {}),
      offset: s.offset,
    },
    ...(config.probes.length > 0 ? { probes: Object.fromEntries(config.probes.map((block) => [block.key, Object.fromEntries(
      Object.entries(block.settings).flatMap(([key, value]) => {
        if (value === undefined) return [];
        const written = block.writtenPaths[key];
        return [[key, written === undefined ? value : path({ written, resolved: String(value) })]];
      }),
    )])) } : {}),
    models: config.models.map((model) => ({
      label: model.label, dark_energy: model.darkEnergy, curvature: model.curvature, radiation: model.radiation,
      parameters: parametersToPlain(model.parameters),
    })),
    parameters: parametersToPlain(config.parameters),
    derived: config.derived === 'auto' ? 'auto' : [...config.derived],
    reference_h0: config.referenceH0KmPerSPerMpc,
    sampler: {
      method: sampler.method, walkers: sampler.walkers, ensembles: sampler.ensembles, stretch_scale: sampler.stretchScale,
      differential_evolution_weight: sampler.differentialEvolutionWeight, max_steps: sampler.maxSteps,
      check_every: sampler.checkEvery, target_ess: sampler.targetEss, max_rhat: sampler.maxRhat, max_minutes: sampler.maxMinutes,
      workers: sampler.workers, checkpoint_every: sampler.checkpointEvery,
      nested: { live_points: sampler.nested.livePoints, max_unexplored_ln_z: sampler.nested.maxUnexploredLnZ, max_iterations: sampler.nested.maxIterations },
    },
    output: {
      dir: path(output.dir),
      contour_pairs: output.contourPairs === 'auto' ? 'auto' : output.contourPairs.map((pair) => [...pair]),
      smoothing: { ...output.smoothing },
      figures: [...output.figures],
      png: output.png,
      figure_width: typeof output.figureWidth === 'object' ? output.figureWidth.inches : output.figureWidth,
      font: output.font,
      pdf: output.pdf,
      ...(output.pngDpi !== null ? { png_dpi: output.pngDpi } : {}),
      triangle_parameters: output.triangleParameters === 'auto' ? 'auto' : [...output.triangleParameters],
      ...(output.truthFile ? { truth_file: path(output.truthFile) } : {}),
      chains: { keep: output.chains.keep, spacing_tau: output.chains.thinTauFraction },
      ...(output.chainMemoryMb !== null ? { chain_memory_mb: output.chainMemoryMb } : {}),
    },
    ...(config.blinding ? { blinding: { parameters: [...config.blinding.parameters], offset_widths: { ...config.blinding.offsetWidths } } } : {}),
  };
}

function dataSetToPlain(set: SupernovaDataSet, path: (p: ResolvedPath) => string): Record<string, unknown> {
  const cuts = set.cuts;
  return {
    label: set.label,
    kind: set.kind,
    table: {
      file: path(set.table.file), delimiter: set.table.delimiter, comment: set.table.comment,
      index_column: set.table.indexColumn, row_prefix: set.table.rowPrefix,
    },
    columns: { ...set.columns },
    missing_values: Object.fromEntries(Object.entries(set.missingValues).map(([field, values]) => [field, [...values]])),
    covariances: set.covariances.map((c) => ({
      file: path(c.file), name: c.name, applies_to: c.appliesTo,
      ...(c.appliesTo === 'light_curve_parameters' ? { block_order: [...c.blockOrder], layout: c.layout } : {}),
      scale: c.scale, symmetry_tolerance: c.symmetryTolerance, includes_statistical: c.includesStatistical,
    })),
    systematic_modes: set.systematicModes.map((m) => ({ file: path(m.file), name: m.name, scale: m.scale, per_column: m.perColumn })),
    cuts: {
      ...(cuts.redshift ? { redshift: [...cuts.redshift] } : {}),
      keep_calibrators: cuts.keepCalibrators,
      ...(cuts.maxAbsX1 !== null ? { max_abs_x1: cuts.maxAbsX1 } : {}),
      ...(cuts.maxAbsColor !== null ? { max_abs_color: cuts.maxAbsColor } : {}),
      max_errors: { ...cuts.maxErrors },
      ...(cuts.keepSamples ? { keep_samples: [...cuts.keepSamples] } : {}),
      drop_ids: [...cuts.dropIds],
    },
    max_redshift_mismatch: set.maxRedshiftMismatch,
    ...(Object.keys(set.sampleNames).length > 0 ? { sample_names: { ...set.sampleNames } } : {}),
    binned: set.binned,
  };
}

function parametersToPlain(block: Record<string, ParameterSpec>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(block).map(([name, spec]) => {
    if (spec.mode === 'fixed') return [name, { fixed: spec.value }];
    const { kind, ...settings } = spec.prior;
    return [name, { prior: kind, ...settings }];
  }));
}
