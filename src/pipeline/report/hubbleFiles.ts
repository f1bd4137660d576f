import { writeProbeDiagrams } from './probeDiagramFiles.js';
import { join } from 'node:path';
import { CMB_TEMPERATURE_K, DEFAULT_EFFECTIVE_NEUTRINO_SPECIES, distanceModulusBand, distanceModulusCurve, type DistanceModulusCurveDraw } from '../../cosmology/index.js';
import { createRandomStream, deriveSeed, logSpacedGrid } from '../../math/index.js';
import { hubbleDiagramCsv, hubbleModelCsv, writeFileAtomic } from '../../output/index.js';
import type { BuiltModel } from '../run/buildModel.js';
import { asStoredDraws, drawsAfterBurnIn, type EnsembleDraws, type StoredDraws } from '../../output/index.js';
import { arrayExtent } from '../../math/index.js';
import { RUN_FILES } from '../../output/index.js';

/** Posterior draws used for the model band of the Hubble diagram. */
const BAND_DRAWS = 200;
/** Points of the model curve, log-spaced in redshift. */
const CURVE_POINTS = 120;

/**
 * Writes the two Hubble-diagram files of a run, at the best fit `bestTheta`
 * (the best stored draw after the burn-in, the one run.json records):
 * - hubble_diagram.csv: per supernova at the best-fit sample (id, sample, z,
 *   mu_obs, sigma_mu, mu_model, residual, calibrator), with mu_obs = standardized
 *   magnitude minus the best-fit absolute magnitude;
 * - hubble_model.csv: on a log-spaced redshift grid, the best-fit model
 *   distance modulus and the median and 68% band over posterior draws, each
 *   draw shifted by its own absolute magnitude minus the best fit's, so that
 *   curve and data share one frame;
 * and, from the same best fit and a seeded set of draws, each probe term's
 * data-versus-model numbers (probeDiagramFiles.ts). A run of probes alone
 * writes only those. `blinded`: only hubble_diagram.csv, with mu_obs and
 * mu_model left empty (docs/blinding.md).
 */
export function writeHubbleFiles(runDir: string, model: BuiltModel, stored: StoredDraws | EnsembleDraws[], burnInSteps: number, bestTheta: Float64Array, seed: string, options: { blinded?: boolean } = {}): void {
  const { posterior, supernovae } = model;
  // The draws are read from the source one step at a time (the seeded picks), never whole: a chain of any length
  // gives these files in bounded memory. Picks among the draws after the burn-in, counted ensemble after ensemble.
  const { count: rowCount, at: pointAt } = drawsAfterBurnIn(asStoredDraws(stored), burnInSteps);
  const bestValues = posterior.values(bestTheta);
  if (model.probes.length > 0 && !options.blinded) {
    const probeRandom = createRandomStream(deriveSeed(seed, 'probe-band'));
    const probeDraws = Array.from({ length: Math.min(BAND_DRAWS, rowCount) }, () => {
      return posterior.values(pointAt(probeRandom.integer(rowCount)));
    });
    writeProbeDiagrams(runDir, model, bestValues, probeDraws);
  }
  if (!supernovae) return; // a run of probes alone has no Hubble diagram
  const diagram = supernovae.hubbleDiagram(bestValues);
  // Blinded (docs/blinding.md): the residuals stay; mu_obs and mu_model (whose difference they are) and the model curve would show the true best fit.
  const hidden = new Float64Array(diagram.ids.length).fill(Number.NaN);
  writeFileAtomic(join(runDir, RUN_FILES.hubbleData), hubbleDiagramCsv(options.blinded ? { ...diagram, distanceModulusMag: hidden, modelDistanceModulusMag: hidden } : diagram, model.samples));
  if (options.blinded) return;

  const [zLow, zHigh] = arrayExtent(diagram.redshift);
  const zMin = Math.max(1e-3, zLow * 0.9);
  const zMax = zHigh * 1.05;
  const grid = logSpacedGrid(zMin, zMax, CURVE_POINTS);
  const family = {
    darkEnergy: model.cosmologyModel.darkEnergy, flat: model.cosmologyModel.flat,
    cmbTemperatureK: model.cosmologyModel.radiation ? CMB_TEMPERATURE_K : 0, effectiveNeutrinoSpecies: DEFAULT_EFFECTIVE_NEUTRINO_SPECIES,
  };
  // The curves use the H0 of the Hubble diagram (the likelihood's), whatever h0 the values hold.
  const curveOptions = { h0KmPerSPerMpc: diagram.h0KmPerSPerMpc, maxRedshift: zMax };
  const bestCurve = new Float64Array(CURVE_POINTS);
  distanceModulusCurve(family, { values: bestValues, shiftMag: 0 }, grid, curveOptions, bestCurve);
  // The seeded picks, in order; each draw is shifted by its own absolute magnitude minus the best fit's (a draw without a finite one is left out).
  const random = createRandomStream(deriveSeed(seed, 'hubble-band'));
  const draws: DistanceModulusCurveDraw[] = [];
  for (let d = 0; d < Math.min(BAND_DRAWS, rowCount); d++) {
    const values = posterior.values(pointAt(random.integer(rowCount)));
    const absMag = values.abs_mag ?? supernovae.bestFitOffset(values);
    if (Number.isFinite(absMag)) draws.push({ values, shiftMag: absMag - diagram.absoluteMagnitudeMag });
  }
  const { medianMag, low68Mag, high68Mag } = distanceModulusBand(family, draws, grid, curveOptions);
  writeFileAtomic(join(runDir, RUN_FILES.hubbleModel), hubbleModelCsv({ redshift: grid, bestMag: bestCurve, medianMag, low68Mag, high68Mag }));
}
