import type { CandelaConfig } from '../../config/index.js';
import { derivedForModel, parametersForModel } from '../../config/index.js';
import { createHierarchicalSupernovaTerm, createPosterior, createSupernovaTerm, type Posterior, type SupernovaTerm } from '../../likelihood/index.js';
import type { DarkEnergyLaw } from '../../cosmology/index.js';
import type { HierarchicalTerm, LikelihoodTerm } from '../../likelihood/index.js';
import { probeDefinition } from '../../probes/index.js';
import { CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES } from '../../cosmology/index.js';

/** The supernova term of a model: conventional or hierarchical standardization. */
export type SupernovaLikelihood = SupernovaTerm | HierarchicalTerm;
import type { LogProbabilityModel } from '../../sampler/index.js';
import { createDerivedParameters } from '../../cosmology/index.js';
import { termStandardization } from './termStandardization.js';
import type { LoadedSupernovae } from './loadSupernovae.js';
import { loadProbes, type ProbeData } from './loadProbes.js';


/** Blob layout of every stored sample: log prior, log likelihood, then the derived quantities. */
export const BLOB_LOG_PRIOR = 0;
export const BLOB_LOG_LIKELIHOOD = 1;
export const BLOB_FIRST_DERIVED = 2;

/** One model of a configuration, ready to sample. */
export interface BuiltModel {
  label: string;
  posterior: Posterior;
  /** The supernova term, or null for a run of probes alone. */
  supernovae: SupernovaLikelihood | null;
  /** Every likelihood term of the posterior, the supernovae first, then each configured probe. */
  terms: LikelihoodTerm[];
  /** The configured probes and their data, in the order of `terms` after the supernovae. */
  probes: ProbeData[];
  /** Sampled parameter names, in theta order. */
  parameterNames: string[];
  /** Fixed parameter values. */
  fixed: Record<string, number>;
  /** Priors of the sampled parameters, as configured. */
  priors: Array<{ name: string; prior: ReturnType<typeof parametersForModel>['free'][number]['prior'] }>;
  /** Derived quantity names, in blob order. */
  derivedNames: string[];
  /** The FLRW family of the model. */
  cosmologyModel: { darkEnergy: DarkEnergyLaw; flat: boolean; radiation: boolean };
  /** Sample label per supernova (table order). */
  samples: readonly string[];
  /** The sampler's view: log posterior plus blobs. */
  logProbability: LogProbabilityModel;
}

/**
 * Builds the posterior of model `modelIndex`: the supernova likelihood term,
 * one term per configured probe (its definition in src/probes builds it) and
 * the priors, and wraps it as the sampler's log-probability model
 * whose blobs are [log prior, log likelihood, derived...].
 */
export function buildModel(config: CandelaConfig, modelIndex: number, data: LoadedSupernovae): BuiltModel {
  const model = config.models[modelIndex];
  const { free, fixed } = parametersForModel(config, modelIndex, data.table.sampleNames);
  const standardization = config.standardization;
  const termOptions = {
    name: 'supernovae',
    table: data.table,
    covariances: data.covariances,
    systematicModes: data.systematicModes,
    cosmologyModel: {
      darkEnergy: model.darkEnergy,
      flat: model.curvature === 'flat',
      cmbTemperatureK: model.radiation ? CMB_TEMPERATURE_K : 0,
      effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES,
    },
    standardization: termStandardization(standardization),
    offset: standardization.offset,
    fixed,
  };
  // Conventional Tripp likelihood, or the latent-variable one of March et al. (2011) when asked for.
  const names = [...free.map((entry) => entry.name), ...Object.keys(fixed)];
  // A run of probes alone (no supernovae configured) has no supernova term.
  const supernovae: SupernovaLikelihood | null = data.table.count === 0 ? null
    : standardization.method === 'hierarchical' && data.table.kind === 'light_curves'
    ? createHierarchicalSupernovaTerm({
      ...termOptions,
      population: {
        perSample: names.some((name) => /^(x1|color)_(mean|width)_/.test(name) && !/_slope$/.test(name)),
        redshiftDependentMeans: names.includes('x1_mean_slope') || names.includes('color_mean_slope'),
      },
    })
    : createSupernovaTerm(termOptions);
  const probes = loadProbes(config);
  const probeModel = { darkEnergy: model.darkEnergy, flat: model.curvature === 'flat', referenceH0KmPerSPerMpc: config.referenceH0KmPerSPerMpc };
  const terms: LikelihoodTerm[] = [...(supernovae ? [supernovae] : []), ...probes.map(({ block, loaded }) => probeDefinition(block.key).createTerm(loaded, block.settings, probeModel))];
  const posterior = createPosterior({ free, fixed, terms });
  const derivedNames = derivedForModel(config, modelIndex).filter((name) => !(name === 'omega_de' && model.curvature === 'free'));
  const fillDerived = createDerivedParameters(
    { darkEnergy: model.darkEnergy, flat: model.curvature === 'flat', radiation: model.radiation, referenceH0KmPerSPerMpc: config.referenceH0KmPerSPerMpc },
    derivedNames,
  );
  const parts = { logPrior: 0, logLikelihood: 0 };
  const blobCount = BLOB_FIRST_DERIVED + derivedNames.length;
  const logProbability: LogProbabilityModel = {
    dimension: posterior.dimension,
    blobCount,
    evaluate(theta, blobs, offset) {
      const logPosterior = posterior.evaluate(theta, parts);
      if (!Number.isFinite(logPosterior)) {
        blobs.fill(0, offset, offset + blobCount);
        return -Infinity;
      }
      blobs[offset + BLOB_LOG_PRIOR] = parts.logPrior;
      blobs[offset + BLOB_LOG_LIKELIHOOD] = parts.logLikelihood;
      if (derivedNames.length > 0) fillDerived(posterior.values(theta), blobs, offset + BLOB_FIRST_DERIVED);
      return logPosterior;
    },
  };
  return {
    label: model.label, posterior, cosmologyModel: { darkEnergy: model.darkEnergy, flat: model.curvature === 'flat', radiation: model.radiation }, samples: data.table.samples, supernovae, terms, probes, parameterNames: [...posterior.names], fixed, priors: free, derivedNames, logProbability };
}
