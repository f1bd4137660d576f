import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { ParameterValues } from '../../likelihood/index.js';
import { parseProbeDiagramJson, probeDiagramFileName, probeDiagramJson, probeDiagramKey, writeFileAtomic, type ProbeDiagramDocument } from '../../output/index.js';
import { probeDefinition } from '../../probes/index.js';
import type { BuiltModel } from '../run/buildModel.js';

/**
 * Writes the data-versus-model numbers of every probe that declares a
 * diagram (ProbeDefinition.diagram), from the best fit and posterior draws,
 * as output's probeDiagramJson (one file per probe, probe_<key>.json), so
 * that `report` draws the figure again byte for byte without the data.
 */
export function writeProbeDiagrams(runDir: string, model: BuiltModel, best: ParameterValues, draws: readonly ParameterValues[]): void {
  // Every parameter set holds h0 (sampled, or fixed at the configuration's reference H0).
  const probeModel = { darkEnergy: model.cosmologyModel.darkEnergy, flat: model.cosmologyModel.flat, referenceH0KmPerSPerMpc: best.h0 };
  for (const { block, loaded } of model.probes) {
    const diagram = probeDefinition(block.key).diagram?.(loaded, block.settings, probeModel, best, draws);
    if (diagram) writeFileAtomic(join(runDir, probeDiagramFileName(block.key)), probeDiagramJson(diagram));
  }
}

/** The probe diagrams stored in a run folder, by probe key, in name order. */
export function readProbeDiagrams(runDir: string): Array<{ key: string; diagram: ProbeDiagramDocument }> {
  let names: string[];
  try {
    names = readdirSync(runDir).filter((name) => probeDiagramKey(name) !== null).sort();
  } catch {
    return [];
  }
  return names.map((name) => ({ key: probeDiagramKey(name) as string, diagram: parseProbeDiagramJson(readFileSync(join(runDir, name), 'utf8')) }));
}
