/**
 * `output`: where results go and which figures are drawn.
 */
import { isScalar } from 'yaml';
import type { FigureKind, OutputOptions } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_OUTPUT } from './defaults.js';
import { resolveConfigPath } from './resolveConfigPath.js';

const KEYS = ['dir', 'contour_pairs', 'smoothing', 'figures', 'png', 'figure_width', 'font', 'pdf', 'png_dpi', 'triangle_parameters', 'truth_file', 'chains', 'chain_memory_mb'] as const;
const CHAINS_KEYS = ['keep', 'spacing_tau'] as const;
/** Widest figure accepted, inches (a full page is about 7 in; twice that is surely a typo). */
const MAX_FIGURE_INCHES = 14;
const SMOOTHING_KEYS = ['kernel', 'bandwidth', 'factor'] as const;

/** Every figure kind, in drawing order. */
export const FIGURE_KINDS: readonly FigureKind[] = ['triangle', 'hubble', 'residuals', 'trace', 'autocorrelation'];

/**
 * Reads the output block, filling defaults; `dir` is resolved against the
 * configuration file's folder. Contour pairs are read as name pairs here and
 * checked against the models' parameters by checkCrossFieldRules.
 * @param reader the document reader.
 * @param at the `output` value (absent: all defaults).
 * @example readOutput(reader, at).dir.written // 'out/run'
 */
export function readOutput(reader: ConfigReader, at: Located): OutputOptions {
  const fields = reader.mapping(at, KEYS);
  const dir = reader.text(fields?.get('dir')) ?? DEFAULT_OUTPUT.dir;
  const options: OutputOptions = {
    ...structuredClone(DEFAULT_OUTPUT),
    dir: resolveConfigPath(reader.fileName, dir),
  };
  if (!fields) return options;
  const pairs = fields.get('contour_pairs');
  if (pairs?.node && isScalar(pairs.node) && typeof pairs.node.value === 'string') {
    options.contourPairs = reader.choice(pairs, ['auto'] as const) ?? options.contourPairs;
  } else if (pairs) {
    options.contourPairs = readPairs(reader, pairs);
  }
  const smoothing = reader.mapping(fields.get('smoothing'), SMOOTHING_KEYS);
  if (smoothing) {
    options.smoothing.kernel = reader.choice(smoothing.get('kernel'), ['gaussian', 'none'] as const) ?? options.smoothing.kernel;
    const bandwidth = smoothing.get('bandwidth');
    if (bandwidth?.node && isScalar(bandwidth.node) && typeof bandwidth.node.value === 'number') {
      options.smoothing.bandwidth = reader.number(bandwidth, { min: 0, exclusiveMin: true }) ?? options.smoothing.bandwidth;
    } else {
      options.smoothing.bandwidth = reader.choice(bandwidth, ['scott', 'silverman'] as const) ?? options.smoothing.bandwidth;
    }
    options.smoothing.factor = reader.number(smoothing.get('factor'), { min: 0, exclusiveMin: true }) ?? options.smoothing.factor;
  }
  const figures = reader.list(fields.get('figures'));
  if (figures) {
    const kinds = figures.map((item) => reader.choice(item, FIGURE_KINDS)).filter((k): k is FigureKind => k !== undefined);
    options.figures = FIGURE_KINDS.filter((kind) => kinds.includes(kind));
  }
  options.png = reader.boolean(fields.get('png')) ?? options.png;
  const width = fields.get('figure_width');
  if (width?.node && isScalar(width.node) && typeof width.node.value === 'number') {
    const inches = reader.number(width, { min: 0, exclusiveMin: true, max: MAX_FIGURE_INCHES, fix: 'write figure_width: single, double, screen, or a width in inches such as 5' });
    if (inches !== undefined) options.figureWidth = { inches };
  } else {
    options.figureWidth = reader.choice(width, ['screen', 'single', 'double'] as const) ?? options.figureWidth;
  }
  options.font = reader.choice(fields.get('font'), ['sans', 'serif'] as const) ?? options.font;
  options.pdf = reader.boolean(fields.get('pdf')) ?? options.pdf;
  const dpi = fields.get('png_dpi');
  if (dpi && dpi.node !== null && !(isScalar(dpi.node) && dpi.node.value === null)) {
    options.pngDpi = reader.number(dpi, { min: 0, exclusiveMin: true, max: 2400 }) ?? options.pngDpi;
  }
  const triangle = fields.get('triangle_parameters');
  if (triangle?.node && isScalar(triangle.node) && typeof triangle.node.value === 'string') {
    options.triangleParameters = reader.choice(triangle, ['auto'] as const) ?? options.triangleParameters;
  } else if (triangle) {
    const names = (reader.list(triangle) ?? []).map((item) => reader.text(item)).filter((name): name is string => typeof name === 'string');
    if (names.length > 0) options.triangleParameters = names;
    else if (!reader.failedAt(triangle.path)) {
      reader.report(triangle, 'config.empty_list', 'output.triangle_parameters lists no parameter', {
        expected: 'auto, or a list of parameter names', found: 'an empty list', fix: 'write e.g. [omega_m, w0, wa], or auto',
      });
    }
  }
  const truth = reader.text(fields.get('truth_file'), { nullable: true });
  if (typeof truth === 'string') options.truthFile = resolveConfigPath(reader.fileName, truth);
  const chains = reader.mapping(fields.get('chains'), CHAINS_KEYS);
  if (chains) {
    options.chains.keep = reader.choice(chains.get('keep'), ['after_burn_in', 'all'] as const) ?? options.chains.keep;
    options.chains.thinTauFraction = reader.number(chains.get('spacing_tau'), { min: 0, exclusiveMin: true, max: 100, fix: 'write spacing_tau: 0.5 (half an autocorrelation time between kept steps)' }) ?? options.chains.thinTauFraction;
  }
  const memory = reader.number(fields.get('chain_memory_mb'), { min: 16, max: 16 * 1024 * 1024, fix: 'write chain_memory_mb: 1024 (MB the chains may take when a run is summarized; at least 16)' });
  if (memory !== undefined) options.chainMemoryMb = memory;
  return options;
}

function readPairs(reader: ConfigReader, at: Located): Array<[string, string]> {
  const pairs: Array<[string, string]> = [];
  for (const item of reader.list(at) ?? []) {
    const names = reader.list(item);
    if (!names) continue;
    if (names.length !== 2) {
      reader.report(item, 'config.wrong_type', 'must name two parameters', {
        expected: '[name, name]', found: `${names.length} name${names.length === 1 ? '' : 's'}`, fix: 'write e.g. [omega_m, w0]',
      });
      continue;
    }
    const [first, second] = names.map((name) => reader.text(name));
    if (typeof first === 'string' && typeof second === 'string') pairs.push([first, second]);
  }
  return pairs;
}
