/**
 * Rules that involve several parts of the configuration at once: parameters
 * that the data cannot constrain or that do not apply, columns a setting
 * needs, and the walker count against the number of free parameters.
 */
import type { CandelaConfig, ParameterSpec } from './candelaConfig.js';
import { closestWord } from '../math/index.js';
import type { ConfigReader } from './configReader.js';
import { derivedForModel } from './derivedForModel.js';
import { parameterContext, usedParameterBases } from './modelParameterNames.js';
import { probeDefinition } from '../probes/index.js';
import { parametersForModel } from './parametersForModel.js';
import { parseParameterName } from '../parameters/index.js';

/** Light-curve-only parameters: standardized magnitudes already contain these corrections. */
const LIGHT_CURVE_PARAMETERS = ['alpha', 'beta', 'mass_step'];

/**
 * The affine-invariant ensemble needs at least twice as many walkers as
 * free parameters, or the walkers cannot span the parameter space
 * (Foreman-Mackey et al. 2013, section 4).
 */
export const MIN_WALKERS_PER_PARAMETER = 2;

/**
 * Checks the rules across sections and reports each problem at the key it
 * concerns. Sections that already failed are skipped, so one mistake does
 * not produce a cascade of messages.
 * @param reader the document reader (positions and issue list).
 * @param config the configuration read so far (defaults filled).
 * @param userParameters the global `parameters` entries as written (without defaults).
 */
export function checkCrossFieldRules(reader: ConfigReader, config: CandelaConfig, userParameters: Record<string, ParameterSpec>): void {
  const hasCalibrators = config.supernovae.some((set) => set.columns.calibrator_mu !== undefined);
  const hasLightCurves = config.supernovae.some((set) => set.kind === 'light_curves');
  const context = parameterContext(config, Object.keys(userParameters));
  const probesRequireH0 = usedByProbes(config, 'h0');
  const blocks = [{ prefix: 'parameters', entries: userParameters, modelIndices: config.models.map((_, i) => i) },
    ...config.models.map((model, i) => ({ prefix: `models[${i}].parameters`, entries: model.parameters, modelIndices: [i] }))];

  for (const { prefix, entries, modelIndices } of blocks) {
    for (const [name, spec] of Object.entries(entries)) {
      const path = `${prefix}.${name}`;
      const base = parseParameterName(name)?.base ?? name;
      if (base === 'h0' && spec.mode === 'prior' && !hasCalibrators && !probesRequireH0) {
        reader.reportAtPath(path, 'config.h0_degenerate',
          'h0 cannot be sampled without calibrators or a probe that reads it (bao with ruler: computed): the supernovae constrain only the combination abs_mag - 5 log10(h0), ' +
          `so h0 and the magnitude offset (${config.standardization.offset === 'sample' ? 'sampled' : 'marginalized'}) are fully degenerate`, {
            expected: 'h0 fixed, or a calibrator_mu column', found: `${path} with a prior and no calibrator_mu column`,
            fix: 'write h0: { fixed: 70 } (or remove it), add probes.bao with ruler: computed, or map calibrator_mu to a column of external distance moduli of calibrator hosts',
          });
        continue;
      }
      if (LIGHT_CURVE_PARAMETERS.includes(base) && spec.mode === 'prior' && !hasLightCurves) {
        reader.reportAtPath(path, 'config.parameter_not_for_kind',
          `${name} does not apply: every data set has kind magnitudes, whose standardized magnitudes already include ` +
          'the stretch, colour and host-mass corrections', {
            expected: 'no prior on alpha, beta or mass_step for kind magnitudes', found: `a prior on ${name}`,
            fix: `remove ${name}, or use a data set of kind light_curves`,
          });
        continue;
      }
      const usedSomewhere = modelIndices.some((i) => usedParameterBases(context, config.models[i]).includes(base));
      const perSampleMismatch = base === 'sigma_int' && name !== base && config.standardization.scatter.intrinsic !== 'per_sample';
      if (!usedSomewhere || perSampleMismatch) {
        reader.reportAtPath(path, 'config.unused_parameter', `${name} is not used by ${modelIndices.length > 1 ? 'any model' : 'this model'}`, {
          severity: 'warning', fix: unusedFix(base, perSampleMismatch),
        });
      }
    }
  }

  config.supernovae.forEach((set, i) => {
    if (set.kind === 'light_curves' && config.standardization.hostMassStep.enabled && set.columns.host_log_mass === undefined &&
        !reader.failedAt(`supernovae[${i}].columns`)) {
      reader.reportAtPath(`supernovae[${i}].columns.host_log_mass`, 'config.missing_column',
        'the host-mass step needs host masses, but host_log_mass is not mapped', {
          expected: 'columns.host_log_mass', found: 'nothing',
          fix: 'map host_log_mass to the host stellar mass column, or set standardization.host_mass_step.enabled: false',
        });
    }
  });
  if (config.standardization.method === 'hierarchical' && !hasLightCurves && config.supernovae.length > 0) {
    reader.reportAtPath('standardization.method', 'config.method_needs_light_curves',
      'the hierarchical method models the stretch and colour populations, which needs light-curve data', {
        expected: 'a data set of kind light_curves', found: 'only kind magnitudes', fix: 'set method: conventional',
      });
  }
  checkWalkers(reader, config);
  checkContourPairs(reader, config);
}

function unusedFix(base: string, perSampleMismatch: boolean): string {
  if (perSampleMismatch) return 'set standardization.scatter.intrinsic: per_sample, or rename it sigma_int';
  switch (base) {
    case 'omega_de': return 'set curvature: free in a model to sample omega_de, or remove it';
    case 'w0': case 'wa': return 'add a model with dark_energy: constant_w (w0) or cpl (w0, wa), or remove it';
    case 'abs_mag': return 'set standardization.offset: sample to sample abs_mag (it is now marginalized analytically), or remove it';
    case 'mass_step': return 'enable standardization.host_mass_step, or remove it';
    case 'sigma_int': return 'set standardization.scatter.intrinsic to global or per_sample, or remove it';
    default: return `remove ${base}, or change the settings that would use it`;
  }
}

function checkWalkers(reader: ConfigReader, config: CandelaConfig): void {
  if (config.sampler.method !== 'ensemble' || reader.failedAt('sampler.walkers') || reader.failedAt('parameters') ||
      config.models.some((_, i) => reader.failedAt(`models[${i}]`))) return;
  config.models.forEach((model, i) => {
    const { free, awaitsSampleLabels } = parametersForModel(config, i);
    const count = free.length + (awaitsSampleLabels && free.every((p) => !p.name.startsWith('sigma_int')) ? 1 : 0);
    const needed = MIN_WALKERS_PER_PARAMETER * count;
    if (config.sampler.walkers >= needed) return;
    reader.reportAtPath('sampler.walkers', 'config.too_few_walkers',
      `model "${model.label}" has ${awaitsSampleLabels ? 'at least ' : ''}${count} free parameters ` +
      `(${free.map((p) => p.name).join(', ')}); the ensemble needs at least ${MIN_WALKERS_PER_PARAMETER} walkers per free parameter`, {
        expected: `walkers >= ${needed}`, found: String(config.sampler.walkers), fix: `set sampler.walkers to ${needed} or more`,
      });
  });
}

function checkContourPairs(reader: ConfigReader, config: CandelaConfig): void {
  if (config.output.contourPairs === 'auto') return;
  const known = new Set<string>();
  config.models.forEach((_, i) => {
    parametersForModel(config, i).free.forEach((p) => known.add(p.name));
    derivedForModel(config, i).forEach((name) => known.add(name));
  });
  config.output.contourPairs.forEach((pair, i) => pair.forEach((name, j) => {
    if (known.has(name) || parseParameterName(name)?.base === 'sigma_int') return;
    const suggestion = closestWord(name, [...known]);
    reader.reportAtPath(`output.contour_pairs[${i}][${j}]`, 'config.unknown_parameter', `"${name}" is neither a free nor a derived parameter of any model`, {
      expected: `one of ${[...known].join(', ')}`, found: `"${name}"`,
      fix: suggestion ? `did you mean "${suggestion}"?` : 'name free or derived parameters of the models',
    });
  }));
}

/** Whether some configured probe requires a parameter (its definition says). */
function usedByProbes(config: CandelaConfig, name: string): boolean {
  return config.probes.some((block) => probeDefinition(block.key).requires(block.settings).includes(name));
}
