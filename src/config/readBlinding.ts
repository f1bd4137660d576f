/**
 * `blinding`: which sampled parameters every output shows as true value +
 * a secret offset until `candela unblind` (docs/blinding.md).
 */
import type { BlindingOptions } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_BLINDING_PARAMETERS, DEFAULT_BLINDING_WIDTHS } from './defaults.js';
import { PARAMETERS } from '../parameters/index.js';

/** Keys of the block. */
export const BLINDING_KEYS = ['parameters', 'offset_widths'] as const;

/** Names a blinding list may hold: every parameter of the registry that can be sampled (not the derived quantities). */
const SAMPLABLE = Object.keys(PARAMETERS).filter((name) => !PARAMETERS[name].derivedOnly);

/**
 * Reads the blinding block. Absent: null (no blinding). Present (even empty):
 * the listed parameters (default w0, wa, omega_m, h0), each with the width
 * of its secret offset (`offset_widths`, else the default of
 * DEFAULT_BLINDING_WIDTHS). Every name must be a samplable parameter of the
 * registry; a parameter without a default width needs one in offset_widths.
 * Whether a model samples a listed parameter is decided per model at fit
 * time (a fixed parameter is not blinded: its value is in the configuration).
 * @param reader the document reader.
 * @param at the `blinding` value, or undefined when the key is absent.
 * @returns the options, or null.
 * @example readBlinding(reader, at)?.parameters // ['w0', 'wa', 'omega_m', 'h0']
 */
export function readBlinding(reader: ConfigReader, at: Located | undefined): BlindingOptions | null {
  if (!at) return null;
  const fields = reader.mapping(at, BLINDING_KEYS);
  const listAt = fields?.get('parameters');
  const parameters: string[] = [];
  if (listAt) {
    for (const item of reader.list(listAt) ?? []) {
      const name = reader.text(item);
      if (typeof name !== 'string') continue;
      if (!SAMPLABLE.includes(name)) {
        if (PARAMETERS[name]?.derivedOnly) {
          reader.report(item, 'config.derived_parameter', `${name} is derived from the sampled parameters, never sampled`, {
            expected: 'a sampled parameter', found: `"${name}"`, fix: 'blind the parameters it is computed from; a blinded run withholds every derived quantity',
          });
        } else {
          reader.unknownKey(item, name, SAMPLABLE, 'parameter');
        }
        continue;
      }
      if (parameters.includes(name)) {
        reader.report(item, 'config.duplicate', `${name} is listed twice`, { found: `"${name}" twice`, fix: `remove the second ${name}` });
        continue;
      }
      parameters.push(name);
    }
    if (parameters.length === 0 && !reader.failedAt(listAt.path)) {
      reader.report(listAt, 'config.empty_list', 'blinding.parameters lists no parameter', {
        expected: 'one or more sampled parameters', found: 'an empty list', fix: `write e.g. [${DEFAULT_BLINDING_PARAMETERS.join(', ')}], or remove the blinding block`,
      });
    }
  } else {
    parameters.push(...DEFAULT_BLINDING_PARAMETERS);
  }
  const widths: Record<string, number> = {};
  const widthsAt = fields?.get('offset_widths');
  for (const [name, value] of reader.mapping(widthsAt, null) ?? []) {
    if (!parameters.includes(name)) {
      if (!reader.failedAt(listAt?.path ?? 'blinding.parameters')) {
        reader.report({ ...value, node: value.anchor }, 'config.unused_key', `offset_widths names ${name}, which blinding.parameters does not list`, {
          expected: `one of ${parameters.join(', ')}`, found: `"${name}"`, fix: `add ${name} to blinding.parameters, or remove its width`,
        });
      }
      continue;
    }
    const width = reader.number(value, { min: 0, exclusiveMin: true, fix: `set blinding.offset_widths.${name} to a positive number in the unit of ${name} (several posterior standard deviations)` });
    if (width !== undefined) widths[name] = width;
  }
  const resolved: Record<string, number> = {};
  for (const name of parameters) {
    const width = widths[name] ?? DEFAULT_BLINDING_WIDTHS[name];
    if (width !== undefined) {
      resolved[name] = width;
    } else if (!reader.failedAt(`${at.path}.offset_widths.${name}`)) {
      reader.report(widthsAt ?? { node: null, path: `${at.path}.offset_widths`, anchor: at.node }, 'config.missing_key', `${name} has no default offset width`, {
        expected: `a width for ${name} under blinding.offset_widths`, found: 'nothing',
        fix: `add "offset_widths: { ${name}: <width> }" with a width of several posterior standard deviations, in the unit of ${name}`,
      });
    }
  }
  return { parameters, offsetWidths: resolved };
}
