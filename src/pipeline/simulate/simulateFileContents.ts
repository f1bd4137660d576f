import type { SurveyDescription } from '../../config/index.js';
import { appendModeColumns } from '../../data/index.js';
import type { SystematicModes } from '../../data/index.js';
import { analysisSystematicModes, systematicModeNames } from '../../mock/index.js';
import type { MockSurvey } from '../../mock/index.js';
import { hostLogMassAsWritten, mockSurveyFiles } from '../../output/index.js';
import type { MockSurveyFiles } from '../../output/index.js';
import { mockOptionsFromSurvey } from './simulateMockOptions.js';
import { VERSION } from '../run/version.js';

/** Columns of the mock table, in file order (the output layer's). */
export { MOCK_TABLE_COLUMNS } from '../../output/index.js';

/** The text of the files `candela simulate` writes. */
export type SimulateFileContents = MockSurveyFiles;

/**
 * The files of a drawn survey (the output layer's mockSurveyFiles): the
 * table as CSV, the systematics in the survey's output.systematics_form --
 * 'matrix': the covariance as text; 'modes': the modes U as CSV under the
 * mock layer's systematicModeNames -- truth.json, and, with
 * output.named_modes, every systematic as a named mode: the drawn modes,
 * then the analysis systematics (the mock layer's analysisSystematicModes,
 * on the host masses as the table writes them). Pure: the same inputs give
 * the same bytes. Cost O(N^2) for the matrix text, O(N K) for the modes.
 * @param survey the survey description (truth and settings, output file names).
 * @param mock the drawn survey.
 * @param seed the seed used, as written or given on the command line.
 * @example simulateFileContents(survey, mock, 2718).table.split('\n')[0] // 'id,sample,z_cmb,...'
 */
export function simulateFileContents(survey: SurveyDescription, mock: MockSurvey, seed: number | string): SimulateFileContents {
  const form = survey.output.systematicsForm;
  const drawnNames = systematicModeNames(mockOptionsFromSurvey(survey, String(seed), false));
  const systematics = form === 'modes'
    ? (mock.systematicModes ? { form, modes: mock.systematicModes, names: drawnNames } : null)
    : (mock.systematicCovariance ? { form, matrix: mock.systematicCovariance } : null);
  return mockSurveyFiles({
    version: VERSION, surveyFile: survey.sourceFile, title: survey.title, seed, truth: survey.truth,
    scatter: { lensingPerRedshift: survey.lensingPerRedshift, peculiarVelocityKmPerS: survey.peculiarVelocityKmPerS, redshiftDriftMag: survey.redshiftDriftMag },
    analysisSystematics: survey.analysisSystematics, samples: survey.samples, drawnSystematics: mock.systematicDraws,
    table: mock.table,
    fileNames: { table: survey.output.table, covariance: survey.output.covariance, namedModes: survey.output.namedModes },
    systematics,
    namedModes: survey.output.namedModes === null ? null : namedModes(survey, mock, drawnNames),
  });
}

/** The drawn modes and the analysis modes side by side, with their names; null when there is none. */
function namedModes(survey: SurveyDescription, mock: MockSurvey, drawnNames: readonly string[]): { modes: SystematicModes; names: string[] } | null {
  const table = mock.table;
  const analysis = analysisSystematicModes(
    { redshift: table.redshift, hostLogMass: hostLogMassAsWritten(table), massStepMag: survey.truth.massStepMag, splitLogMass: survey.truth.splitLogMass },
    survey.analysisSystematics,
  );
  const modes = appendModeColumns(mock.systematicModes, { values: analysis.values, modeCount: analysis.names.length }, table.count, 'named modes');
  if (modes.modeCount === 0) return null;
  return { modes, names: [...(mock.systematicModes ? drawnNames : []), ...analysis.names] };
}
