/**
 * `supernovae[].covariances`: covariance files added to the statistical part.
 */
import type { CovarianceSource, LightCurveQuantity, SupernovaKind } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_COVARIANCE } from './defaults.js';
import { resolveConfigPath } from './resolveConfigPath.js';
import type { SystematicNames } from './systematicNames.js';

const COVARIANCE_KEYS = ['file', 'name', 'applies_to', 'block_order', 'layout', 'scale', 'symmetry_tolerance', 'includes_statistical'] as const;
const QUANTITIES: readonly LightCurveQuantity[] = ['m_b', 'x1', 'color'];

/**
 * Reads the list of covariance files of one data set. A 3N x 3N matrix
 * (`applies_to: light_curve_parameters`) needs kind light_curves; its
 * `block_order` must name m_b, x1 and color once each.
 * @param reader the document reader.
 * @param at the `covariances` value (absent: none).
 * @param kind the data set's kind (undefined when invalid).
 * @param names the configuration's register of systematic names (`name`, or the file's stem).
 * @returns the entries that could be read, defaults filled, paths resolved.
 * @example readCovariances(reader, at, 'magnitudes')[0].appliesTo // 'magnitudes'
 */
export function readCovariances(reader: ConfigReader, at: Located | undefined, kind: SupernovaKind | undefined, names: SystematicNames): CovarianceSource[] {
  const sources: CovarianceSource[] = [];
  for (const item of reader.list(at) ?? []) {
    const fields = reader.mapping(item, COVARIANCE_KEYS, ['file']);
    if (!fields) continue;
    const file = reader.text(fields.get('file'));
    const appliesTo = reader.choice(fields.get('applies_to'), ['magnitudes', 'light_curve_parameters'] as const)
      ?? DEFAULT_COVARIANCE.appliesTo;
    if (appliesTo === 'light_curve_parameters' && kind === 'magnitudes') {
      reader.report(fields.get('applies_to') ?? item, 'config.covariance_needs_light_curves',
        'a 3N x 3N covariance on (m_b, x1, color) needs light-curve parameters, but this data set has kind magnitudes', {
          expected: 'applies_to: magnitudes for kind magnitudes', found: 'applies_to: light_curve_parameters',
          fix: 'set kind: light_curves and map m_b, x1, color, or use an N x N covariance with applies_to: magnitudes',
        });
    }
    const blockOrder = readBlockOrder(reader, fields.get('block_order'));
    const layout = reader.choice(fields.get('layout'), ['interleaved', 'grouped'] as const);
    if (appliesTo === 'magnitudes') {
      for (const key of ['block_order', 'layout'] as const) {
        const value = fields.get(key);
        if (value) {
          reader.report(value, 'config.unused_setting', `${key} applies only to applies_to: light_curve_parameters`, {
            severity: 'warning', fix: `remove ${key}`,
          });
        }
      }
    }
    const scale = reader.number(fields.get('scale'), { min: 0, exclusiveMin: true });
    const symmetryTolerance = reader.number(fields.get('symmetry_tolerance'), { min: 0 });
    const includesStatistical = reader.boolean(fields.get('includes_statistical'));
    if (typeof file !== 'string') continue;
    sources.push({
      file: resolveConfigPath(reader.fileName, file),
      name: names.claim(fields.get('name'), item, file),
      appliesTo,
      blockOrder: blockOrder ?? [...DEFAULT_COVARIANCE.blockOrder],
      layout: layout ?? DEFAULT_COVARIANCE.layout,
      scale: scale ?? DEFAULT_COVARIANCE.scale,
      symmetryTolerance: symmetryTolerance ?? DEFAULT_COVARIANCE.symmetryTolerance,
      includesStatistical: includesStatistical ?? DEFAULT_COVARIANCE.includesStatistical,
    });
  }
  return sources;
}

function readBlockOrder(reader: ConfigReader, at: Located | undefined): LightCurveQuantity[] | undefined {
  const items = reader.list(at);
  if (!items || !at) return undefined;
  const order = items.map((item) => reader.choice(item, QUANTITIES));
  if (order.some((quantity) => quantity === undefined)) return undefined;
  const isPermutation = order.length === 3 && QUANTITIES.every((quantity) => order.includes(quantity));
  if (!isPermutation) {
    reader.report(at, 'config.bad_block_order', 'must name m_b, x1 and color once each', {
      expected: 'a permutation of [m_b, x1, color]', found: `[${order.join(', ')}]`, fix: 'write block_order: [m_b, x1, color] in the order the file uses',
    });
    return undefined;
  }
  return order as LightCurveQuantity[];
}
