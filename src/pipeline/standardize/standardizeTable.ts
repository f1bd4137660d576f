import { loadConfigFile } from '../../config/index.js';
import { CandelaError, type Issue } from '../../errors.js';
import { closestWord, createRandomStream, deriveSeed } from '../../math/index.js';
import { priorSearchStep, samplePrior } from '../../likelihood/index.js';
import { appendLatentColumns, hubbleDiagramCsv } from '../../output/index.js';
import { createInProcessEvaluator, locatePosteriorMode } from '../../sampler/index.js';
import { buildModel } from '../run/buildModel.js';
import { loadSupernovae } from '../run/loadSupernovae.js';
import { checkStandardizeBlinding } from '../blinding/checkStandardizeBlinding.js';

/** Starting points of the best-fit search when some parameters are not given. */
const SEARCH_STARTS = 6;
/** Evaluation budget per parameter of each search. */
const SEARCH_EVALUATIONS_PER_PARAMETER = 800;

/** What `candela standardize` produced. */
export interface StandardizedTable {
  csv: string;
  /** Every parameter value used (given, fixed or best fit). */
  values: Record<string, number>;
  /** Names of the parameters that were fitted (not given with --at). */
  fitted: string[];
  chiSquare: number | null;
  model: string;
}

/**
 * `candela standardize`: the Hubble-diagram table (id, sample, z, mu_obs,
 * sigma_mu, mu_model, residual) of a configuration's data for one model, at
 * the parameter values given; parameters not given are set to the maximum of
 * the posterior with the others held at the given values (Nelder & Mead 1965
 * searches from prior draws). With the hierarchical standardization the table
 * also holds each supernova's posterior-mean latent x1 and c and their sds.
 */
export async function standardizeTable(configPath: string, given: Record<string, number>, modelLabel?: string): Promise<StandardizedTable> {
  const config = loadConfigFile(configPath);
  const modelIndex = modelLabel === undefined ? 0 : config.models.findIndex((m) => m.label === modelLabel);
  if (modelIndex < 0) {
    const labels = config.models.map((m) => m.label);
    const closest = closestWord(modelLabel ?? '', labels);
    throw new CandelaError({ code: 'standardize.unknown_model', path: '--model', message: `no model is labelled '${modelLabel}'`, expected: labels.join(', '), fix: closest ? `did you mean --model ${closest}?` : 'use one of the model labels of the configuration' });
  }
  const data = loadSupernovae(config);
  const model = buildModel(config, modelIndex, data);
  const names = model.parameterNames;
  const issues: Issue[] = [];
  for (const name of Object.keys(given)) {
    if (!names.includes(name)) {
      const closest = closestWord(name, names);
      issues.push({ code: 'standardize.unknown_parameter', path: `--at ${name}`, message: `${name} is not a sampled parameter of model ${model.label}`, expected: names.join(', '), fix: closest ? `did you mean --at ${closest}=...?` : 'give values only for the sampled parameters' });
    }
  }
  if (issues.length) throw new CandelaError(issues);
  checkStandardizeBlinding(config, names, Object.keys(given));
  const fittedIndices = names.map((_, i) => i).filter((i) => !(names[i] in given));
  const theta = Float64Array.from(names, (name) => given[name] ?? Number.NaN);
  if (fittedIndices.length > 0) {
    const random = createRandomStream(deriveSeed(String(config.seed), 'standardize'));
    const full = new Float64Array(names.length);
    const sub = {
      dimension: fittedIndices.length,
      blobCount: 0,
      evaluate(point: Float64Array): number {
        full.set(theta);
        fittedIndices.forEach((index, k) => { full[index] = point[k]; });
        return model.posterior.logPosterior(full);
      },
    };
    const evaluator = createInProcessEvaluator(sub);
    const starts = Array.from({ length: SEARCH_STARTS }, () => Float64Array.from(fittedIndices, (index) => samplePrior(model.priors[index].prior, random)));
    const steps = fittedIndices.map((index) => priorSearchStep(model.priors[index].prior, random));
    const mode = await locatePosteriorMode(evaluator, starts, steps, SEARCH_EVALUATIONS_PER_PARAMETER * fittedIndices.length);
    if (!Number.isFinite(mode.logProb)) {
      throw new CandelaError({ code: 'standardize.no_best_fit', message: 'no parameter values with a finite posterior were found', fix: 'give values with --at or widen the priors' });
    }
    fittedIndices.forEach((index, k) => { theta[index] = mode.point[k]; });
    await evaluator.close();
  }
  const reason = model.posterior.rejectionReason(theta);
  if (reason) throw new CandelaError({ code: 'standardize.unphysical', message: `the parameter values have zero posterior density: ${reason}`, fix: 'give values inside the priors and with a physical cosmology' });
  const values = { ...model.posterior.values(theta) };
  const supernovae = model.supernovae;
  if (!supernovae) throw new CandelaError({ code: 'standardize.no_supernovae', path: 'supernovae', message: 'the configuration has no supernovae to standardize (probes only)', fix: 'add a supernovae block, or use fit for a probes-only run' });
  const diagram = supernovae.hubbleDiagram(values);
  const extras = supernovae.bestFitExtras?.(values) ?? {};
  const table = hubbleDiagramCsv(diagram, model.samples);
  // Hierarchical standardization: the posterior mean and sd of each supernova's true x1 and c as four more columns.
  const csv = 'latentEstimates' in supernovae ? appendLatentColumns(table, supernovae.latentEstimates(values)) : table;
  return { csv, values, fitted: fittedIndices.map((i) => names[i]), chiSquare: extras.chi_square ?? null, model: model.label };
}
