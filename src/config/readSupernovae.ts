/**
 * `supernovae`: one or more data sets, concatenated in the order given.
 */
import { isMap, isScalar } from 'yaml';
import type { SupernovaDataSet, SupernovaKind, TableOptions } from './candelaConfig.js';
import type { ConfigReader, Located } from './configReader.js';
import { DEFAULT_MAX_REDSHIFT_MISMATCH, DEFAULT_TABLE } from './defaults.js';
import { readColumns, readMissingValues } from './readColumns.js';
import { readCovariances } from './readCovariances.js';
import { readCuts } from './readCuts.js';
import { readLabel } from './readLabel.js';
import { readSystematicModeSources } from './readSystematicModeSources.js';
import { createSystematicNames } from './systematicNames.js';
import { resolveConfigPath } from './resolveConfigPath.js';

const DATA_SET_KEYS = ['label', 'kind', 'table', 'columns', 'missing_values', 'covariances', 'systematic_modes', 'cuts', 'max_redshift_mismatch', 'sample_names', 'binned'] as const;
const TABLE_KEYS = ['file', 'delimiter', 'comment', 'index_column', 'row_prefix'] as const;
const KINDS: readonly SupernovaKind[] = ['light_curves', 'magnitudes'];

/**
 * Reads every data set. Labels default to `main` for a single set and
 * `set1`, `set2`, ... otherwise, and must be unique.
 * @param reader the document reader.
 * @param at the `supernovae` value (a list; one mapping alone is accepted as a list of one).
 * @returns the data sets that could be read (problems go to the reader).
 * @example readSupernovae(reader, at)[0].kind // 'magnitudes'
 */
export function readSupernovae(reader: ConfigReader, at: Located): SupernovaDataSet[] {
  const items = isMap(at.node) ? [{ ...at, path: `${at.path}[0]` }] : reader.list(at) ?? [];
  if (at.node !== null && items.length === 0 && !reader.failedAt(at.path)) {
    reader.report(at, 'config.empty_list', 'supernovae lists no data set', {
      expected: 'at least one data set', found: 'an empty list', fix: 'add a data set with label, kind, table and columns',
    });
  }
  const sets: SupernovaDataSet[] = [];
  const seen = new Set<string>();
  const systematicNames = createSystematicNames(reader);
  items.forEach((item, index) => {
    const fields = reader.mapping(item, DATA_SET_KEYS, ['kind', 'table', 'columns']);
    if (!fields) return;
    const label = readLabel(reader, fields.get('label'), items.length === 1 ? 'main' : `set${index + 1}`);
    if (seen.has(label)) {
      reader.report(fields.get('label') ?? item, 'config.duplicate_label', `data-set label "${label}" is used twice`, {
        expected: 'a label used once', found: `"${label}"`, fix: 'give each data set its own label',
      });
    }
    seen.add(label);
    const kind = reader.choice(fields.get('kind'), KINDS);
    const table = readTable(reader, fields.get('table'));
    const columns = readColumns(reader, fields.get('columns') ?? { node: null, path: `${item.path}.columns`, anchor: item.node }, kind);
    const missingValues = fields.has('missing_values') ? readMissingValues(reader, fields.get('missing_values')!, columns) : {};
    const covariances = readCovariances(reader, fields.get('covariances'), kind, systematicNames);
    const systematicModes = readSystematicModeSources(reader, fields.get('systematic_modes'), systematicNames);
    const cuts = readCuts(reader, fields.get('cuts') ?? { node: null, path: `${item.path}.cuts`, anchor: item.node }, kind, columns);
    const mismatch = reader.number(fields.get('max_redshift_mismatch'), { min: 0, exclusiveMin: true });
    const sampleNames = readSampleNames(reader, fields.get('sample_names'));
    const binned = reader.boolean(fields.get('binned')) ?? false;
    if (!kind || !table) return;
    sets.push({ label, kind, table, columns, missingValues, covariances, systematicModes, cuts, maxRedshiftMismatch: mismatch ?? DEFAULT_MAX_REDSHIFT_MISMATCH, sampleNames, binned });
  });
  return sets;
}

/** `sample_names`: a mapping from codes of the `sample` column (numbers or words) to the names figure legends show. */
function readSampleNames(reader: ConfigReader, at: Located | undefined): Record<string, string> {
  const names: Record<string, string> = {};
  for (const [code, value] of reader.mapping(at, null) ?? []) {
    const name = reader.text(value, { numbersAsText: true });
    if (typeof name === 'string') names[code] = name;
  }
  return names;
}

function readTable(reader: ConfigReader, at: Located | undefined): TableOptions | undefined {
  const fields = reader.mapping(at, TABLE_KEYS, ['file']);
  if (!fields) return undefined;
  const file = reader.text(fields.get('file'));
  const delimiter = reader.choice(fields.get('delimiter'), ['auto', 'comma', 'tab', 'whitespace'] as const);
  const comment = reader.text(fields.get('comment'), { nullable: true });
  const indexAt = fields.get('index_column');
  const indexFlag = indexAt?.node && isScalar(indexAt.node) && typeof indexAt.node.value === 'boolean' ? indexAt.node.value : undefined;
  const indexColumn = indexFlag === undefined ? reader.choice(indexAt, ['auto', 'yes', 'no'] as const) : indexFlag ? 'yes' : 'no';
  const rowPrefix = reader.text(fields.get('row_prefix'), { nullable: true });
  if (typeof file !== 'string') return undefined;
  return {
    file: resolveConfigPath(reader.fileName, file),
    delimiter: delimiter ?? DEFAULT_TABLE.delimiter,
    comment: comment === undefined ? DEFAULT_TABLE.comment : comment,
    indexColumn: indexColumn ?? DEFAULT_TABLE.indexColumn,
    rowPrefix: rowPrefix === undefined ? DEFAULT_TABLE.rowPrefix : rowPrefix,
  };
}
