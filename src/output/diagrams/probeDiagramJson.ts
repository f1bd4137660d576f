import type { MeasurementRatioFigureInput } from '../figures/index.js';

/** One probe's data-versus-model numbers as stored in a run folder: what measurementRatioFigure draws, and its title. */
export interface ProbeDiagramDocument extends MeasurementRatioFigureInput {
  /** Heading of the figure on the report page. */
  title: string;
}

/** Run-folder file names of the probe diagrams: `probe_<key>.json`, the key in lower case, digits and underscores. */
const PROBE_DIAGRAM_FILE = /^probe_([a-z0-9_]+)\.json$/;

/**
 * The run-folder file name of one probe's diagram.
 * @param key the probe's key (its block under `probes:`), e.g. 'bao'.
 * @returns `probe_<key>.json`.
 * @throws nothing.
 * @example probeDiagramFileName('bao') // 'probe_bao.json'
 */
export function probeDiagramFileName(key: string): string {
  return `probe_${key}.json`;
}

/**
 * The probe key of a run-folder file name, or null when the name is not a
 * probe diagram's (the inverse of {@link probeDiagramFileName}).
 * @param fileName a file name without folder.
 * @returns the key, or null.
 * @throws nothing.
 * @example probeDiagramKey('probe_bao.json') // 'bao'
 */
export function probeDiagramKey(fileName: string): string | null {
  return PROBE_DIAGRAM_FILE.exec(fileName)?.[1] ?? null;
}

/**
 * The JSON text of one probe diagram (one line, then a line break), keys
 * in a fixed order: title, xLabel, yLabel, referenceLabel, then per group
 * label, points (x, y, error) and curve (x, best, low68, high68), so that
 * `candela report` draws the figure again byte for byte without the data.
 * Numbers as JSON.stringify writes them (shortest round-trip decimal).
 *
 * Cost: O(points).
 * @param diagram the probe's numbers (ratios to its reference model, dimensionless; x in redshift).
 * @returns the file's text.
 * @throws nothing.
 * @example probeDiagramJson({ title: 'BAO', xLabel: 'z', yLabel: 'ratio', referenceLabel: 'ref', groups: [] })
 *   // '{"title":"BAO","xLabel":"z","yLabel":"ratio","referenceLabel":"ref","groups":[]}\n'
 */
export function probeDiagramJson(diagram: ProbeDiagramDocument): string {
  const document = {
    title: diagram.title,
    xLabel: diagram.xLabel,
    yLabel: diagram.yLabel,
    referenceLabel: diagram.referenceLabel,
    groups: diagram.groups.map((group) => ({
      label: group.label,
      points: { x: group.points.x, y: group.points.y, error: group.points.error },
      curve: { x: group.curve.x, best: group.curve.best, low68: group.curve.low68, high68: group.curve.high68 },
    })),
  };
  return `${JSON.stringify(document)}\n`;
}

/**
 * Reads back the text written by {@link probeDiagramJson}.
 * @param text the file's text.
 * @returns the diagram.
 * @throws SyntaxError when the text is not JSON.
 * @example parseProbeDiagramJson(probeDiagramJson(diagram)).title // diagram.title
 */
export function parseProbeDiagramJson(text: string): ProbeDiagramDocument {
  return JSON.parse(text) as ProbeDiagramDocument;
}
