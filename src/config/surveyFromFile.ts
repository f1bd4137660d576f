/**
 * Reading a survey description file (the configuration layer's file access,
 * through readTextFile).
 */
import { readTextFile } from './readTextFile.js';
import type { Checked } from '../errors.js';
import type { SurveyDescription } from './surveyDescription.js';
import { surveyFromText } from './surveyFromText.js';

/**
 * Reads and validates a survey description, returning it (with warnings) or
 * every problem. An unreadable file is one problem. Cost: one file read plus
 * surveyFromText.
 * @param path the survey file, relative to the working folder or absolute.
 * @example surveyFromFile('configs/demo-survey.yaml').ok // true
 */
export function surveyFromFile(path: string): Checked<SurveyDescription> {
  const read = readTextFile(path, 'survey file', 'give the path of a readable YAML survey description (see docs/simulate.md)');
  return read.ok ? surveyFromText(read.text, path) : { ok: false, issues: [read.issue] };
}
