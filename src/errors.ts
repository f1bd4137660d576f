/**
 * Problems are data: an {@link Issue} records what went wrong and where
 * (file, line:column or row, key path or column), what was expected, what was
 * found and how to fix it. Wording and printing live in {@link formatIssue}.
 * This module imports nothing, so every layer may use it.
 */

/** One problem found in a configuration, a data file or a parameter set. */
export interface Issue {
  /** Stable machine-readable code, e.g. `config.unknown_key`, `data.non_numeric`. */
  code: string;
  /** Human sentence saying what is wrong. */
  message: string;
  /** `error` stops the run (exit 2); `warning` is printed and the run goes on. */
  severity?: 'error' | 'warning';
  /** File the problem is in (as the user wrote it). */
  file?: string;
  /** 1-based line in that file. */
  line?: number;
  /** 1-based column in that file. */
  column?: number;
  /** 1-based data row (when lines and rows differ). */
  row?: number;
  /** Key path in the configuration (`sampler.walkers`) or a column name. */
  path?: string;
  /** What was expected, in words. */
  expected?: string;
  /** What was found, as the user wrote it. */
  found?: string;
  /** What the user should do. */
  fix?: string;
}

/** Exit codes of the command-line tool. */
export const EXIT_OK = 0;
export const EXIT_INTERNAL = 1;
export const EXIT_BAD_INPUT = 2;

/**
 * The one error class of candela: carries every issue found, so that all
 * problems are reported at once. Thrown for bad input (exit code 2).
 */
export class CandelaError extends Error {
  readonly issues: Issue[];
  readonly exitCode = EXIT_BAD_INPUT;
  constructor(issues: Issue[] | Issue) {
    const list = Array.isArray(issues) ? issues : [issues];
    super(list.map(formatIssue).join('\n'));
    this.name = 'CandelaError';
    this.issues = list;
  }
}

/** True when `error` is a {@link CandelaError} (works across module copies). */
export function isCandelaError(error: unknown): error is CandelaError {
  return error instanceof Error && error.name === 'CandelaError' && Array.isArray((error as CandelaError).issues);
}

/** Location prefix `file:line:column` (or `file row N`). */
export function formatLocation(issue: Issue): string {
  let where = issue.file ?? '';
  if (issue.line !== undefined) {
    where += `${where ? ':' : 'line '}${issue.line}`;
    if (issue.column !== undefined) where += `:${issue.column}`;
  } else if (issue.row !== undefined) {
    where += `${where ? ' ' : ''}row ${issue.row}`;
  }
  return where;
}

/**
 * One issue as one or more readable lines:
 * `file:line:col: error at sampler.walkers: ... (expected X, found Y). Fix: ...`
 */
export function formatIssue(issue: Issue): string {
  const where = formatLocation(issue);
  const level = issue.severity === 'warning' ? 'warning' : 'error';
  let text = `${where ? `${where}: ` : ''}${level}${issue.path ? ` at ${issue.path}` : ''}: ${issue.message}`;
  const parts: string[] = [];
  if (issue.expected !== undefined) parts.push(`expected ${issue.expected}`);
  if (issue.found !== undefined) parts.push(`found ${issue.found}`);
  if (parts.length) text += ` (${parts.join(', ')})`;
  if (issue.fix) text += `\n  fix: ${issue.fix}`;
  return text;
}

/** All issues, errors first, each formatted, with a count line. */
export function formatIssues(issues: readonly Issue[]): string {
  const errors = issues.filter((i) => i.severity !== 'warning');
  const warnings = issues.filter((i) => i.severity === 'warning');
  const lines = [...errors, ...warnings].map(formatIssue);
  const count = `${errors.length} error${errors.length === 1 ? '' : 's'}` +
    (warnings.length ? `, ${warnings.length} warning${warnings.length === 1 ? '' : 's'}` : '');
  return `${lines.join('\n')}\n${count}`;
}

/** Result of a validation: the value, or the list of problems. */
export type Checked<T> = { ok: true; value: T; warnings: Issue[] } | { ok: false; issues: Issue[] };
