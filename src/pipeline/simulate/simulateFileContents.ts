import { createHash } from 'node:crypto';
import type { SurveyDescription, SurveySample } from '../../config/index.js';
import { analysisSystematicModes, systematicModeNames } from '../../mock/index.js';
import type { MockSurvey } from '../../mock/index.js';
import type { SystematicModes } from '../../data/index.js';
import { mockOptionsFromSurvey } from './simulateMockOptions.js';
import { VERSION } from '../run/version.js';

/** Columns of the mock table, in file order (the names a run configuration maps in `columns`). */
export const MOCK_TABLE_COLUMNS = [
  'id', 'sample', 'z_cmb', 'z_helio', 'm_b', 'm_b_err', 'x1', 'x1_err', 'color', 'color_err',
  'cov_m_b_x1', 'cov_m_b_color', 'cov_x1_color', 'host_log_mass', 'host_log_mass_err',
] as const;

/**
 * Decimals written per kind of value. 6 decimals keep redshifts, magnitudes,
 * x1 and c (and their errors, >= 0.005) to better than 2e-4 of their
 * smallest error; host masses need 4 (dex); covariances and the systematic
 * matrix keep 7 significant digits.
 */
const DECIMALS = 6;
const MASS_DECIMALS = 4;
const SIGNIFICANT_DIGITS = 7;

/** The text of the three files `candela simulate` writes. */
export interface SimulateFileContents {
  table: string;
  /** The systematics file in the survey's output.systematics_form (matrix or modes); null when the survey has no systematic mode. */
  covariance: string | null;
  truth: string;
  /** Every systematic as a named mode (output.named_modes); null when not asked for or when there is no mode. */
  namedModes: string | null;
}

/**
 * Formats a mock survey as files: the table as CSV with a header line
 * (columns {@link MOCK_TABLE_COLUMNS}), the systematics in the survey's
 * output.systematics_form -- 'matrix': the covariance as text (first line
 * N, then one row of N values per line); 'modes': the modes U as CSV (a
 * header of mode names, systematicModeNames, then one row of K values per
 * supernova, the form readSystematicModes reads) -- and truth.json (the
 * truth, the survey settings, the drawn systematic offsets, the seed, and
 * the name, size and SHA-256 checksum of the other files) and, with
 * output.named_modes, every systematic as a named mode: the drawn modes,
 * then the analysis systematics (analysisSystematicModes, on the table's
 * host masses as written). Pure: the
 * same inputs give the same bytes. Cost O(N^2) for the matrix text, O(N K)
 * for the modes.
 * @param survey the survey description (truth and settings, output file names).
 * @param mock the drawn survey.
 * @param seed the seed used, as written or given on the command line.
 * @example simulateFileContents(survey, mock, 2718).table.split('\n')[0] // 'id,sample,z_cmb,...'
 */
export function simulateFileContents(survey: SurveyDescription, mock: MockSurvey, seed: number | string): SimulateFileContents {
  const table = tableCsv(mock);
  const modes = survey.output.systematicsForm === 'modes';
  const modeNames = modes ? systematicModeNames(mockOptionsFromSurvey(survey, String(seed), false)) : [];
  const covariance = modes
    ? (mock.systematicModes ? modesText(mock.systematicModes, modeNames) : null)
    : (mock.systematicCovariance ? matrixText(mock.systematicCovariance, mock.table.count) : null);
  const named = survey.output.namedModes === null ? null : namedModesText(survey, mock, String(seed));
  const sha256 = (text: string): string => createHash('sha256').update(text, 'utf8').digest('hex');
  const analysis = survey.analysisSystematics;
  const analysisOn = analysis.hostMassSplitDex > 0 || analysis.coherentVelocityKmPerS > 0;
  const record = {
    about: 'truth of a candela mock supernova survey (see docs/simulate.md)',
    generator: { program: 'candela simulate', version: VERSION },
    survey_file: survey.sourceFile,
    title: survey.title,
    seed,
    truth: truthRecord(survey),
    scatter: {
      lensing_per_redshift: survey.lensingPerRedshift,
      peculiar_velocity_km_s: survey.peculiarVelocityKmPerS,
      redshift_drift_mag: survey.redshiftDriftMag,
    },
    ...(analysisOn ? {
      analysis_systematics: {
        host_mass_split_dex: analysis.hostMassSplitDex, coherent_velocity_km_s: analysis.coherentVelocityKmPerS,
        coherent_velocity_max_redshift: analysis.coherentVelocityMaxRedshift,
      },
    } : {}),
    samples: survey.samples.map(sampleRecord),
    drawn_systematics: {
      calibration_offset_mag: mock.systematicDraws.calibrationOffsetMag,
      redshift_drift_mag: mock.systematicDraws.redshiftDriftMag,
    },
    files: {
      table: { name: survey.output.table, rows: mock.table.count, columns: [...MOCK_TABLE_COLUMNS], sha256: sha256(table) },
      covariance: covariance === null ? null : modes
        ? { name: survey.output.covariance, form: 'modes', size: [mock.table.count, modeNames.length], columns: modeNames, sha256: sha256(covariance) }
        : { name: survey.output.covariance, size: mock.table.count, sha256: sha256(covariance) },
      ...(named === null ? {} : {
        named_modes: { name: survey.output.namedModes, form: 'modes', size: [mock.table.count, named.names.length], columns: named.names, sha256: sha256(named.text) },
      }),
    },
  };
  return { table, covariance, truth: `${JSON.stringify(record, null, 2)}\n`, namedModes: named?.text ?? null };
}

function fixed(value: number, decimals = DECIMALS): string {
  const text = value.toFixed(decimals);
  return /^-0\.0*$/.test(text) ? text.slice(1) : text;
}

function significant(value: number): string {
  return value === 0 ? '0' : value.toExponential(SIGNIFICANT_DIGITS - 1);
}

function tableCsv(mock: MockSurvey): string {
  const t = mock.table;
  const column = (values: Float64Array | undefined): Float64Array => values ?? new Float64Array(t.count);
  const [mB, mBErr, x1, x1Err, c, cErr] = [t.peakMag, t.peakMagErr, t.stretch, t.stretchErr, t.color, t.colorErr].map(column);
  const [covMX, covMC, covXC, mass, massErr] = [t.covPeakMagStretch, t.covPeakMagColor, t.covStretchColor, t.hostLogMass, t.hostLogMassErr].map(column);
  const lines = [MOCK_TABLE_COLUMNS.join(',')];
  for (let i = 0; i < t.count; i++) {
    lines.push([
      t.ids[i], t.samples[i], fixed(t.redshift[i]), fixed(t.redshiftHelio[i]),
      fixed(mB[i]), fixed(mBErr[i]), fixed(x1[i]), fixed(x1Err[i]), fixed(c[i]), fixed(cErr[i]),
      significant(covMX[i]), significant(covMC[i]), significant(covXC[i]),
      fixed(mass[i], MASS_DECIMALS), fixed(massErr[i], MASS_DECIMALS),
    ].join(','));
  }
  return `${lines.join('\n')}\n`;
}

function matrixText(values: Float64Array, n: number): string {
  const lines = [String(n)];
  const row: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) row[j] = significant(values[i * n + j]);
    lines.push(row.join(' '));
  }
  return `${lines.join('\n')}\n`;
}

/**
 * The drawn modes and the analysis modes side by side, as modes CSV; null
 * when there is none. Host masses are taken at the precision the table
 * writes them, so the file classifies hosts as a fit of the table does.
 */
function namedModesText(survey: SurveyDescription, mock: MockSurvey, seed: string): { text: string; names: string[] } | null {
  const drawnNames = systematicModeNames(mockOptionsFromSurvey(survey, seed, false));
  const t = mock.table;
  const hostLogMass = Float64Array.from(t.hostLogMass ?? new Float64Array(t.count), (mass) => Number(fixed(mass, MASS_DECIMALS)));
  const analysis = analysisSystematicModes(
    { redshift: t.redshift, hostLogMass, massStepMag: survey.truth.massStepMag, splitLogMass: survey.truth.splitLogMass }, survey.analysisSystematics,
  );
  const drawn = mock.systematicModes;
  const drawnCount = drawn ? drawn.modeCount : 0;
  const width = drawnCount + analysis.names.length;
  if (width === 0) return null;
  const values = new Float64Array(t.count * width);
  for (let i = 0; i < t.count; i++) {
    for (let j = 0; j < drawnCount; j++) values[i * width + j] = drawn!.values[i * drawnCount + j];
    for (let j = 0; j < analysis.names.length; j++) values[i * width + drawnCount + j] = analysis.values[i * analysis.names.length + j];
  }
  const names = [...(drawn ? drawnNames : []), ...analysis.names];
  return { text: modesText({ count: t.count, modeCount: width, values, sourceFile: 'named modes' }, names), names };
}

/** U as CSV: a header of mode names, then one row of K shifts (mag) per supernova. */
function modesText(modes: SystematicModes, names: readonly string[]): string {
  const k = modes.modeCount;
  const lines = [names.join(',')];
  const row: string[] = new Array(k);
  for (let i = 0; i < modes.count; i++) {
    for (let j = 0; j < k; j++) row[j] = significant(modes.values[i * k + j]);
    lines.push(row.join(','));
  }
  return `${lines.join('\n')}\n`;
}

function truthRecord(survey: SurveyDescription): Record<string, string | number> {
  const t = survey.truth;
  return {
    dark_energy: t.darkEnergy, curvature: t.curvature, omega_m: t.omegaMatter,
    ...(t.omegaDarkEnergy === null ? {} : { omega_de: t.omegaDarkEnergy }),
    w0: t.w0, wa: t.wa, h0: t.h0KmPerSPerMpc, alpha: t.alpha, beta: t.beta, abs_mag: t.absMagMag,
    mass_step: t.massStepMag, split_log_mass: t.splitLogMass, sigma_int: t.sigmaIntMag,
  };
}

function sampleRecord(sample: SurveySample) {
  const line = (model: { base: number; perRedshift: number }) => ({ base: model.base, per_z: model.perRedshift });
  return {
    label: sample.label,
    count: sample.count,
    redshift: { ...sample.redshift },
    stretch: { ...sample.stretch },
    color: { ...sample.color },
    host_log_mass: { mean: sample.hostLogMass.mean, sd: sample.hostLogMass.sd, error: sample.hostLogMass.errorDex },
    errors: {
      m_b: line(sample.errors.peakMagMag), x1: line(sample.errors.stretch), color: line(sample.errors.colorMag),
      correlations: {
        m_b_x1: sample.errors.correlations.peakMagStretch,
        m_b_color: sample.errors.correlations.peakMagColor,
        x1_color: sample.errors.correlations.stretchColor,
      },
    },
    calibration_offset_mag: sample.calibrationOffsetMag,
  };
}
