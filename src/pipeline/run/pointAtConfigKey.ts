import type { Issue } from '../../errors.js';
import type { CandelaConfig } from '../../config/index.js';

/** Codes of problems with a whole input file (it is missing, a folder, binary or unreadable), as the data readers report them. */
const WHOLE_FILE_CODES = new Set(['data.file_not_found', 'data.not_a_file', 'data.not_text', 'data.file_unreadable']);

/**
 * Where a key sits in the configuration file: the first of `paths` whose
 * position was recorded while reading it (e.g. `supernovae[0].table.file`,
 * then `supernovae[0].table`), or the nearest recorded parent of the last one.
 * @param config the configuration (its `source` holds the positions).
 * @param paths key paths in order of preference.
 * @returns the configuration file as written, the 1-based line and column, and the key path found.
 * @example locateConfigKey(config, ['supernovae[0].cuts', 'supernovae[0]']) // { file: 'configs/x.yaml', line: 14, column: 5, path: 'supernovae[0].cuts' }
 */
export function locateConfigKey(config: CandelaConfig, paths: readonly string[]): Pick<Issue, 'file' | 'line' | 'column' | 'path'> {
  const { file, positions } = config.source;
  for (const path of paths) {
    const at = positions[path];
    if (at) return { file: file.written, line: at.line, column: at.column, path };
  }
  let parent = paths[paths.length - 1] ?? '';
  while (parent && !positions[parent]) {
    const up = parent.replace(/(\.[^.[\]]+|\[\d+\])$/, '');
    parent = up === parent ? '' : up;
  }
  const at = parent ? positions[parent] : undefined;
  return { file: file.written, ...(at ? { line: at.line, column: at.column } : {}), path: paths[0] };
}

/**
 * Moves a whole-file problem reported by a data reader (the file is missing,
 * a folder, binary or unreadable) to the configuration key that names the
 * file, keeping the reader's words: `configs/x.yaml:12:5: error at
 * supernovae[0].table.file: the table file 'sn.txt' does not exist (found
 * nothing at /abs/sn.txt)`. Any other issue is returned unchanged, since it
 * already names the data file's line and column.
 * @param issue the reader's issue.
 * @param config the configuration that named the file.
 * @param role what the file is, for the message (e.g. `table`, `covariance`).
 * @param paths the key paths that name the file, in order of preference.
 * @example pointAtConfigKey(issue, config, 'table', ['supernovae[0].table.file', 'supernovae[0].table'])
 */
export function pointAtConfigKey(issue: Issue, config: CandelaConfig, role: string, paths: readonly string[]): Issue {
  if (!WHOLE_FILE_CODES.has(issue.code)) return issue;
  const message = issue.message.replace(/^the (file|path)/, `the ${role} file '${issue.file ?? ''}'`);
  return { ...issue, ...locateConfigKey(config, paths), message };
}
