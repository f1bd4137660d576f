/**
 * Reading a survey description file (the configuration layer's file access,
 * like readConfigFile).
 */
import { readFileSync } from 'node:fs';
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
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'does not exist' : code === 'EISDIR' ? 'is a folder' : `cannot be read (${code ?? String(error)})`;
    return {
      ok: false,
      issues: [{ code: 'config.unreadable', message: `the survey file ${reason}`, file: path, fix: 'give the path of a readable YAML survey description (see docs/simulate.md)' }],
    };
  }
  return surveyFromText(text.replace(/^\uFEFF/, ''), path);
}
