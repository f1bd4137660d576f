import { createHash } from 'node:crypto';
import { MOCK_TABLE_COLUMNS, mockTableCsv } from './mockTableCsv.js';
import type { MockTableFacts } from './mockTableCsv.js';
import { mockTruthJson } from './mockTruthJson.js';
import type { MockSurveyFacts } from './mockTruthJson.js';
import { covarianceMatrixText, systematicModesCsv } from './systematicsText.js';
import type { ModeColumns } from './systematicsText.js';

/** Everything the files of a mock survey hold (plain values; the simulate conductor maps the survey description and the draw to it). */
export interface MockSurveyFilesInput extends MockSurveyFacts {
  table: MockTableFacts;
  /** File names, as truth.json records them. */
  fileNames: { table: string; covariance: string; namedModes: string | null };
  /** The systematics file: the dense covariance (mag^2), or the modes with their names; null when no systematic mode is on. */
  systematics: { form: 'matrix'; matrix: Float64Array } | { form: 'modes'; modes: ModeColumns; names: readonly string[] } | null;
  /** Every systematic as a named mode (the named-modes file), or null when it is not asked for or there is none. */
  namedModes: { modes: ModeColumns; names: readonly string[] } | null;
}

/** The text of the files `candela simulate` writes. */
export interface MockSurveyFiles {
  table: string;
  /** The systematics file (matrix text or modes CSV), or null. */
  covariance: string | null;
  truth: string;
  /** The named-modes CSV, or null. */
  namedModes: string | null;
}

const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');

/**
 * The files of a mock survey: the table as CSV (mockTableCsv), the
 * systematics as a covariance text ('matrix' form) or modes CSV ('modes'
 * form), the named modes as modes CSV, and truth.json (mockTruthJson) with
 * the name, size and SHA-256 checksum of each other file. Pure: the same
 * input gives the same bytes. Cost O(N^2) for the matrix text, O(N K) for modes.
 * @param input the draw and what it was drawn from.
 * @returns the texts.
 * @throws nothing.
 * @example mockSurveyFiles(input).table.split('\n')[0] // 'id,sample,z_cmb,...'
 */
export function mockSurveyFiles(input: MockSurveyFilesInput): MockSurveyFiles {
  const count = input.table.count;
  const table = mockTableCsv(input.table);
  const systematics = input.systematics;
  const covariance = systematics === null ? null
    : systematics.form === 'modes' ? systematicModesCsv(systematics.modes, systematics.names) : covarianceMatrixText(systematics.matrix, count);
  const named = input.namedModes === null ? null : { text: systematicModesCsv(input.namedModes.modes, input.namedModes.names), names: input.namedModes.names };
  const files = {
    table: { name: input.fileNames.table, rows: count, columns: [...MOCK_TABLE_COLUMNS], sha256: sha256(table) },
    covariance: covariance === null || systematics === null ? null : systematics.form === 'modes'
      ? { name: input.fileNames.covariance, form: 'modes', size: [count, systematics.names.length], columns: systematics.names, sha256: sha256(covariance) }
      : { name: input.fileNames.covariance, size: count, sha256: sha256(covariance) },
    ...(named === null ? {} : {
      named_modes: { name: input.fileNames.namedModes, form: 'modes', size: [count, named.names.length], columns: named.names, sha256: sha256(named.text) },
    }),
  };
  return { table, covariance, truth: mockTruthJson(input, files), namedModes: named?.text ?? null };
}
