import { join } from 'node:path';
import { bandFigure, darkEnergyBandsFigure, DEFAULT_PNG_WIDTH_PX, svgToPng, triangleFigure, writeFileAtomic } from '../../output/index.js';
import { COSMOLOGICAL_PARAMETERS } from '../report/analyzeRun.js';
import { contoursForTriangle } from '../report/buildRunOutputs.js';
import type { AnalyzedRun } from './compareInputs.js';
import type { RebuiltRunModel } from './compareRebuildModel.js';
import { distanceDifferenceBands } from './darkEnergyFiguresDistance.js';
import { equationOfStateBand } from './darkEnergyFiguresEquationOfState.js';

/** Largest redshift of the w(z) band for runs without supernovae (BAO reach z ~ 2.3; common practice). */
const PROBES_ONLY_MAX_REDSHIFT = 2.5;


/** What {@link writeDarkEnergyFigures} drew, and what it could not. */
export interface DarkEnergyFigureFiles {
  /** File stems written (each as .svg, and .png when asked). */
  written: string[];
  /** Figures left out, with the reason. */
  skipped: string[];
}

/**
 * Writes the comparison figures into `outDir` (SVG, and PNG when `png`):
 * - `posteriors_triangle`: every run's posterior overlaid on the sampled
 *   cosmological parameters they share (all shared ones when none is cosmological);
 * - `w_of_z_<label>`: for each run with a free w0, w(z) with its median and
 *   68% / 95% bands for 0 <= z <= the data's largest redshift, w = -1 dashed;
 * - `distance_modulus_difference`: each model's Delta mu against the
 *   reference flat LambdaCDM with 68% bands and the binned data residuals
 *   (needs the base model rebuilt from its run folder).
 * Deterministic for a seed.
 *
 * Cost: the density grids of the shared pairs plus a few thousand distance
 * curves and likelihood evaluations.
 * @param runs the analyzed runs.
 * @param rebuilt each run's rebuilt model or null.
 * @param baseIndex index of the base run.
 * @param outDir output folder (must exist).
 * @param options `png` to add PNG renderings; `seed` of the draw selection.
 * @returns the stems written and the figures skipped with reasons.
 * @throws CandelaError from the figures; Error from the file system.
 * @example writeDarkEnergyFigures(runs, rebuilt, 0, 'out/comparison', { png: true, seed: '1' }).written
 */
export function writeDarkEnergyFigures(runs: readonly AnalyzedRun[], rebuilt: ReadonlyArray<RebuiltRunModel | null>, baseIndex: number, outDir: string, options: { png: boolean; seed: string }): DarkEnergyFigureFiles {
  const written: string[] = [];
  const skipped: string[] = [];
  const save = (stem: string, svg: string) => {
    writeFileAtomic(join(outDir, `${stem}.svg`), svg);
    if (options.png) writeFileAtomic(join(outDir, `${stem}.png`), svgToPng(svg, DEFAULT_PNG_WIDTH_PX));
    written.push(stem);
  };
  const shared = runs[0].analysis.sampled.filter((name) => runs.every((entry) => entry.analysis.sampled.includes(name)));
  const cosmological = shared.filter((name) => COSMOLOGICAL_PARAMETERS.includes(name));
  const parameters = cosmological.length > 0 ? cosmological : shared;
  if (parameters.length > 0) {
    save('posteriors_triangle', triangleFigure(runs.map(({ run, analysis }) => ({
      label: run.record.model.label,
      marginals: analysis.marginals.filter((marginal) => parameters.includes(marginal.parameter)),
      contours: contoursForTriangle(run, analysis, parameters),
    })), parameters, { idPrefix: 'posteriors' }));
  } else {
    skipped.push('posteriors_triangle: the runs share no sampled parameter');
  }
  // Runs of probes alone have no supernova redshift range: their w(z) is drawn to z = 2.5, the reach of today's BAO.
  const zMax = Math.max(...runs.map(({ run }) => (run.record.data.supernovae > 0 ? run.record.data.redshift_range[1] : PROBES_ONLY_MAX_REDSHIFT)));
  for (const analyzed of runs) {
    const input = equationOfStateBand(analyzed, zMax, `${options.seed}/w-of-z/${analyzed.run.record.model.label}`);
    if (input) save(`w_of_z_${analyzed.run.record.model.label}`, bandFigure(input, { idPrefix: `w-${analyzed.run.record.model.label}` }));
  }
  if (!runs.some((analyzed) => analyzed.analysis.sampled.includes('w0'))) skipped.push('w_of_z: no run samples w0');
  const distance = distanceDifferenceBands(runs, rebuilt, baseIndex, `${options.seed}/distance-modulus`);
  if (distance && distance.input.bands.length > 0) {
    save('distance_modulus_difference', darkEnergyBandsFigure(distance.input, { xScale: 'log', idPrefix: 'delta-mu' }));
  } else {
    skipped.push(runs[baseIndex].run.record.data.supernovae === 0
      ? 'distance_modulus_difference: the base run has no supernovae (the figure compares supernova distance moduli)'
      : 'distance_modulus_difference: the base model could not be rebuilt from its run folder (see the warnings)');
  }
  return { written, skipped };
}
