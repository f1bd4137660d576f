/**
 * A short plain-text summary of what a configuration would run.
 */
import type { CandelaConfig, PriorSpec, SupernovaDataSet } from './candelaConfig.js';
import { probeDefinition } from '../probes/index.js';
import { derivedForModel } from './derivedForModel.js';
import { parametersForModel } from './parametersForModel.js';

/**
 * A prior in words.
 * @example describePrior({ kind: 'uniform', min: 0, max: 1 }) // 'uniform 0..1'
 * @example describePrior({ kind: 'gaussian', mean: 3.1, sd: 1 }) // 'gaussian 3.1 ± 1'
 */
export function describePrior(prior: PriorSpec): string {
  switch (prior.kind) {
    case 'uniform': return `uniform ${prior.min}..${prior.max}`;
    case 'log_uniform': return `log-uniform ${prior.min}..${prior.max}`;
    case 'gaussian': return `gaussian ${prior.mean} ± ${prior.sd}`;
    case 'truncated_gaussian': return `gaussian ${prior.mean} ± ${prior.sd} within ${prior.min}..${prior.max}`;
  }
}

/**
 * One line per part of the run: data sets, standardization, each model with
 * its free and fixed parameters, sampler and output. Paths are shown as
 * written in the file. Cost: O(models x parameters).
 * @param config the validated configuration.
 * @returns lines without trailing newlines.
 * @example describeConfig(config)[0] // 'title: Pantheon 2018, 40 redshift bins (file configs/pantheon2018-binned.yaml)'
 */
export function describeConfig(config: CandelaConfig): string[] {
  const lines = [`title: ${config.title} (file ${config.source.file.written})`, `seed: ${config.seed}`];
  for (const set of config.supernovae) lines.push(describeDataSet(set));
  if (config.supernovae.length > 0) lines.push(describeStandardization(config));
  for (const block of config.probes) {
    const probe = probeDefinition(block.key);
    const settings = probe.settings.flatMap((spec) => {
      const value = block.writtenPaths[spec.key] ?? block.settings[spec.key];
      return value === undefined ? [] : [`${spec.key} ${String(value)}`];
    });
    lines.push(`probe "${block.key}" (${probe.title}): ${settings.join(', ')}; reads ${probe.requires(block.settings).join(', ')}`);
  }
  config.models.forEach((model, i) => {
    const { free, fixed, awaitsSampleLabels } = parametersForModel(config, i);
    const freeText = free.map((p) => `${p.name} ${describePrior(p.prior)}`).join(', ');
    const perSample = awaitsSampleLabels ? ' (+ one per sample, known after reading the data)' : '';
    const fixedText = Object.entries(fixed).map(([name, value]) => `${name} = ${value}`).join(', ');
    lines.push(`model "${model.label}": dark energy ${model.darkEnergy}, curvature ${model.curvature}` +
      `${model.radiation ? ', with radiation' : ''}; ${free.length} free parameter${free.length === 1 ? '' : 's'}${perSample}: ${freeText}; ` +
      `fixed: ${fixedText || 'none'}; derived: ${derivedForModel(config, i).join(', ') || 'none'}`);
  });
  const s = config.sampler;
  lines.push(s.method === 'ensemble'
    ? `sampler: ${s.ensembles} ensemble${s.ensembles === 1 ? '' : 's'} of ${s.walkers} walkers, stretch scale ${s.stretchScale}` +
      `${s.differentialEvolutionWeight > 0 ? `, ${s.differentialEvolutionWeight * 100}% differential-evolution moves` : ''}; ` +
      `stops when ESS >= ${s.targetEss} and R-hat <= ${s.maxRhat} (checked every ${s.checkEvery} steps), ` +
      `or after ${s.maxSteps} steps or ${s.maxMinutes} min; workers ${s.workers}`
    : `sampler: nested sampling, ${s.nested.livePoints} live points, until the live points could add at most ` +
      `${s.nested.maxUnexploredLnZ} to ln Z or after ${s.nested.maxIterations} iterations`);
  const o = config.output;
  lines.push(`output: ${o.dir.written}/<model label>/; figures ${o.figures.join(', ') || 'none'} (SVG${o.png ? ` + PNG${o.pngDpi !== null ? ` at ${o.pngDpi} dpi` : ''}` : ''}${o.pdf ? ' + PDF' : ''}; ` +
    `${typeof o.figureWidth === 'object' ? `${o.figureWidth.inches} in` : o.figureWidth} width, ${o.font} text${o.truthFile ? `, truth from ${o.truthFile.written}` : ''}); ` +
    `contour pairs ${o.contourPairs === 'auto' ? 'auto' : o.contourPairs.map((p) => p.join('-')).join(', ')}`);
  return lines;
}

function describeDataSet(set: SupernovaDataSet): string {
  const columns = Object.entries(set.columns).map(([field, column]) => `${field}=${column}`).join(', ');
  const covariances = set.covariances.length === 0 ? 'no covariance file (diagonal errors only)'
    : set.covariances.map((c) => `${c.file.written} (${c.appliesTo === 'magnitudes' ? 'N x N' : '3N x 3N'}` +
      `${c.scale === 1 ? '' : `, x ${c.scale}`}${c.includesStatistical ? ', statistical part included' : ''})`).join(' + ');
  const modes = set.systematicModes.length === 0 ? ''
    : `; systematic modes ${set.systematicModes.map((m) => `${m.file.written} (N x K${m.scale === 1 ? '' : `, shifts x ${m.scale}`})`).join(' + ')}`;
  const cuts: string[] = [];
  const c = set.cuts;
  if (c.redshift) cuts.push(`redshift ${c.redshift[0]}..${c.redshift[1]}${c.keepCalibrators && set.columns.calibrator_mu ? ' (calibrators kept)' : ''}`);
  if (c.maxAbsX1 !== null) cuts.push(`|x1| <= ${c.maxAbsX1}`);
  if (c.maxAbsColor !== null) cuts.push(`|color| <= ${c.maxAbsColor}`);
  for (const [field, limit] of Object.entries(c.maxErrors)) cuts.push(`${field} <= ${limit}`);
  if (c.keepSamples) cuts.push(`samples ${c.keepSamples.join(', ')}`);
  if (c.dropIds.length) cuts.push(`${c.dropIds.length} ids dropped`);
  return `data set "${set.label}" (${set.kind}): ${set.table.file.written}; columns ${columns}; ${covariances}${modes}; ` +
    `cuts: ${cuts.join(', ') || 'none'}`;
}

function describeStandardization(config: CandelaConfig): string {
  const s = config.standardization;
  const parts: string[] = [];
  if (config.supernovae.some((set) => set.kind === 'light_curves')) {
    parts.push(`${s.method === 'hierarchical' ? 'hierarchical' : 'conventional'} Tripp relation`);
    parts.push(s.hostMassStep.enabled
      ? `host-mass step at log M = ${s.hostMassStep.splitLogMass} (${s.hostMassStep.shape}${s.hostMassStep.shape === 'logistic' ? `, width ${s.hostMassStep.widthDex} dex` : ''})`
      : 'no host-mass step');
    parts.push(`alpha-beta covariance ${s.alphaBetaCovariance}${s.frozenAt ? ` at alpha ${s.frozenAt.alpha}, beta ${s.frozenAt.beta}` : ''}`);
  } else {
    parts.push('standardized magnitudes used as given');
  }
  parts.push(s.scatter.intrinsic === 'off' ? 'no intrinsic scatter' : `intrinsic scatter ${s.scatter.intrinsic.replace('_', ' ')}`);
  parts.push(s.scatter.lensingPerRedshift > 0 ? `lensing ${s.scatter.lensingPerRedshift} z mag` : 'no lensing term');
  parts.push(s.scatter.peculiarVelocityKmPerS > 0 ? `peculiar velocity ${s.scatter.peculiarVelocityKmPerS} km/s` : 'no peculiar-velocity term');
  parts.push(s.scatter.redshiftErrors ? 'redshift errors propagated' : 'redshift errors ignored');
  parts.push(s.offset === 'marginalize' ? 'magnitude offset marginalized analytically' : 'abs_mag sampled');
  return `standardization: ${parts.join('; ')}`;
}
