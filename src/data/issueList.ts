import type { Issue } from '../errors.js';

/** More issues of one code than this are summarised in one closing line, so a broken 1700-row file stays readable. */
export const MAX_ISSUES_PER_CODE = 25;

/** Collects issues, keeping at most {@link MAX_ISSUES_PER_CODE} of each code. */
export interface IssueList {
  /** Records one issue (dropped, but counted, beyond the limit). */
  add(issue: Issue): void;
  /** True when at least one error (not warning) was added. */
  hasErrors(): boolean;
  /** The kept issues, plus one summary issue per code that overflowed. */
  finish(): Issue[];
}

/**
 * Creates an empty {@link IssueList}. Cost O(1) per issue.
 * @example const list = createIssueList(); list.add({ code: 'x', message: 'bad' }); list.hasErrors() // true
 */
export function createIssueList(): IssueList {
  const kept: Issue[] = [];
  const counts = new Map<string, { count: number; sample: Issue }>();
  let errors = false;
  return {
    add(issue: Issue): void {
      if (issue.severity !== 'warning') errors = true;
      const entry = counts.get(issue.code) ?? { count: 0, sample: issue };
      entry.count++;
      counts.set(issue.code, entry);
      if (entry.count <= MAX_ISSUES_PER_CODE) kept.push(issue);
    },
    hasErrors: () => errors,
    finish(): Issue[] {
      const summaries: Issue[] = [];
      for (const [code, { count, sample }] of counts) {
        if (count <= MAX_ISSUES_PER_CODE) continue;
        summaries.push({
          code,
          severity: sample.severity,
          file: sample.file,
          message: `${count - MAX_ISSUES_PER_CODE} more problems of this kind (${code}) are not listed`,
          fix: sample.fix,
        });
      }
      return [...kept, ...summaries];
    },
  };
}
