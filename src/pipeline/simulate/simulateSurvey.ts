import { existsSync, mkdirSync, rmSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { surveyFromFile } from '../../config/index.js';
import type { SurveyDescription } from '../../config/index.js';
import { CandelaError, isCandelaError } from '../../errors.js';
import type { Issue } from '../../errors.js';
import { generateMockSurvey } from '../../mock/index.js';
import type { MockSurvey } from '../../mock/index.js';
import { writeFileAtomic } from '../../output/index.js';
import { simulateFileContents } from './simulateFileContents.js';
import { mockOptionsFromSurvey } from './simulateMockOptions.js';

/** What the caller asks of `candela simulate` (without --forecast). */
export interface SimulateRequest {
  /** The survey description file. */
  surveyPath: string;
  /** Replaces output.dir (relative to the working folder). */
  outDir?: string;
  /** Replace existing output files. */
  force?: boolean;
  /** Replaces the description's seed. */
  seed?: string;
}

/** What `candela simulate` wrote. */
export interface SimulateOutcome {
  /** The folder written to. */
  dir: string;
  /** Every file written, in writing order, with its size in bytes. */
  files: Array<{ path: string; bytes: number }>;
  supernovae: number;
  /** Supernovae per sample label. */
  samples: Record<string, number>;
  /** The seed used. */
  seed: number | string;
  /** The drawn systematic offsets, mag. */
  systematicDraws: MockSurvey['systematicDraws'];
  /**
   * How a data set of a fit configuration loads the systematics file just
   * written: under `covariances` (the 'matrix' form, on the magnitudes) or
   * `systematic_modes` (the 'modes' form), with the path written; null when
   * the survey has no systematic mode.
   */
  systematicsEntry: { key: 'covariances' | 'systematic_modes'; file: string } | null;
  /** Problems that did not stop the run (e.g. no seed). */
  warnings: Issue[];
  /** Wall-clock time of reading, drawing and writing, s. */
  wallSeconds: number;
}

/**
 * Reads a survey description and draws the survey into a CSV table, a file
 * of the systematics (output.systematics_form: the dense covariance, or the
 * modes U with C = U U^T) and truth.json (see simulateFileContents).
 * Byte-identical output for the same description and seed. Nothing is
 * written when any problem is found, and no existing file is replaced
 * unless `force` (with `force`, a stale systematics file is removed when the
 * survey has no systematic mode).
 * Cost: 'matrix' form O(N^2) time and memory, plus writing it (~7 MB for
 * N = 800; at most 10,000 supernovae with a mode on); 'modes' form O(N K).
 * @param request survey file, output folder, force, seed.
 * @throws CandelaError with every problem of the description (file, line, key, fix),
 *   an unphysical truth, the files that would be overwritten, or `mock.covariance_too_large`
 *   (the 'matrix' form above 10,000 supernovae with a mode on).
 * @example simulateSurvey({ surveyPath: 'configs/demo-survey.yaml', force: true }).supernovae // 800
 */
export function simulateSurvey(request: SimulateRequest): SimulateOutcome {
  const started = Date.now();
  const survey = loadSurvey(request.surveyPath);
  const seed = request.seed ?? survey.value.seed;
  const mock = drawSurvey(survey.value, String(seed), false);
  const contents = simulateFileContents(survey.value, mock, seed);
  const dir = request.outDir ?? survey.value.output.dir.resolved;
  const names = survey.value.output;
  const planned: Array<{ path: string; text: string | null }> = [
    { path: join(dir, names.table), text: contents.table },
    { path: join(dir, names.covariance), text: contents.covariance },
    { path: join(dir, names.truth), text: contents.truth },
    ...(names.namedModes === null ? [] : [{ path: join(dir, names.namedModes), text: contents.namedModes }]),
  ];
  const existing = planned.filter((file) => existsSync(file.path));
  const notFiles = existing.filter((file) => !statSync(file.path).isFile());
  if (notFiles.length > 0 || (existing.length > 0 && !request.force)) {
    throw new CandelaError((notFiles.length > 0 ? notFiles : existing).map((file) => ({
      code: notFiles.length > 0 ? 'simulate.not_a_file' : 'simulate.would_overwrite',
      file: file.path,
      message: notFiles.length > 0 ? 'an output name is taken by a folder' : 'the output file exists already',
      fix: notFiles.length > 0 ? 'choose another output folder with --out' : 'pass --force to replace it, or choose another folder with --out',
    })));
  }
  mkdirSync(dir, { recursive: true });
  const files: SimulateOutcome['files'] = [];
  for (const file of planned) {
    if (file.text === null) {
      if (existsSync(file.path)) rmSync(file.path);
      continue;
    }
    writeFileAtomic(file.path, file.text);
    files.push({ path: file.path, bytes: Buffer.byteLength(file.text, 'utf8') });
  }
  const samples: Record<string, number> = {};
  for (const sample of survey.value.samples) samples[sample.label] = sample.count;
  const systematicsEntry: SimulateOutcome['systematicsEntry'] = contents.covariance === null ? null
    : { key: names.systematicsForm === 'modes' ? 'systematic_modes' : 'covariances', file: planned[1].path };
  return {
    dir, files, supernovae: mock.table.count, samples, seed, systematicDraws: mock.systematicDraws, systematicsEntry,
    warnings: survey.warnings, wallSeconds: (Date.now() - started) / 1000,
  };
}

/**
 * Reads and validates a survey description or throws with every problem.
 * @param path the survey file.
 * @throws CandelaError listing every problem (syntax, unknown keys with did-you-mean, types, ranges, cross-field rules).
 * @example loadSurvey('configs/demo-survey.yaml').value.samples.length // 3
 */
export function loadSurvey(path: string): { value: SurveyDescription; warnings: Issue[] } {
  const result = surveyFromFile(path);
  if (!result.ok) throw new CandelaError(result.issues);
  return { value: result.value, warnings: result.warnings };
}

/**
 * Draws the survey of a description (with noise, or its noise-free expectation).
 * @param survey the description.
 * @param seed the seed, as text.
 * @param noiseless draw the expected data (see MockSurveyOptions.noiseless).
 * @throws CandelaError from the mock generator (e.g. an unphysical truth), naming the survey file.
 * @example drawSurvey(survey, '2718', true).table.count // the sum of the sample counts
 */
export function drawSurvey(survey: SurveyDescription, seed: string, noiseless: boolean): MockSurvey {
  try {
    return generateMockSurvey(mockOptionsFromSurvey(survey, seed, noiseless));
  } catch (error) {
    if (!isCandelaError(error)) throw error;
    throw new CandelaError(error.issues.map((issue) => ({ ...issue, file: issue.file ?? survey.sourceFile })));
  }
}
