import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { ParameterValues } from '../../likelihood/index.js';
import { writeFileAtomic } from '../../output/index.js';
import { probeDefinition, type ProbeDiagram } from '../../probes/index.js';
import type { BuiltModel } from '../run/buildModel.js';

/** Run-folder file holding one probe's data-versus-model numbers (JSON), drawn by `report` as figures/probe-<key>. */
export const probeDiagramFileName = (key: string): string => `probe_${key}.json`;
const PROBE_DIAGRAM_FILE = /^probe_([a-z0-9_]+)\.json$/;

/**
 * Writes the data-versus-model numbers of every probe that declares a
 * diagram (ProbeDefinition.diagram), from the best fit and posterior draws,
 * so that `report` draws the figure again byte for byte without the data.
 */
export function writeProbeDiagrams(runDir: string, model: BuiltModel, best: ParameterValues, draws: readonly ParameterValues[]): void {
  // Every parameter set holds h0 (sampled, or fixed at the configuration's reference H0).
  const probeModel = { darkEnergy: model.cosmologyModel.darkEnergy, flat: model.cosmologyModel.flat, referenceH0KmPerSPerMpc: best.h0 };
  for (const { block, loaded } of model.probes) {
    const diagram = probeDefinition(block.key).diagram?.(loaded, block.settings, probeModel, best, draws);
    if (diagram) writeFileAtomic(join(runDir, probeDiagramFileName(block.key)), `${JSON.stringify(diagram)}\n`);
  }
}

/** The probe diagrams stored in a run folder, by probe key, in name order. */
export function readProbeDiagrams(runDir: string): Array<{ key: string; diagram: ProbeDiagram }> {
  let names: string[];
  try {
    names = readdirSync(runDir).filter((name) => PROBE_DIAGRAM_FILE.test(name)).sort();
  } catch {
    return [];
  }
  return names.map((name) => ({ key: (PROBE_DIAGRAM_FILE.exec(name) as RegExpExecArray)[1], diagram: JSON.parse(readFileSync(join(runDir, name), 'utf8')) as ProbeDiagram }));
}
