import type { Issue } from '../errors.js';

/** One cut as applied: what it kept and how many rows it removed. */
export interface CutStep {
  /** The option name, e.g. `redshiftMin`, `maxErrors.x1_err`. */
  name: string;
  /** What is kept, in words, e.g. `z >= 0.01`. */
  description: string;
  /** Rows removed by this cut (among the rows that survived the earlier cuts). */
  removed: number;
  /** Rows left after it. */
  remaining: number;
}

/** Rows per sample before and after all cuts. */
export interface SampleCount {
  sample: string;
  before: number;
  after: number;
}

/** What the cuts did, in the order they were applied. */
export interface CutReport {
  initialCount: number;
  finalCount: number;
  steps: CutStep[];
  perSample: SampleCount[];
  /** Unknown samples or ids named by the cuts. */
  warnings: Issue[];
}

/**
 * The report as text lines for the terminal or a log (no trailing newlines).
 * Cost O(steps + samples).
 * @param report from applyCuts.
 * @example formatCutReport(report)[0] // '1701 supernovae before cuts'
 */
export function formatCutReport(report: CutReport): string[] {
  const lines = [`${report.initialCount} supernovae before cuts`];
  const width = Math.max(0, ...report.steps.map((step) => step.description.length));
  for (const step of report.steps) {
    lines.push(`  keep ${step.description.padEnd(width)}  removed ${String(step.removed).padStart(5)}, ${step.remaining} left`);
  }
  lines.push(`${report.finalCount} supernovae after cuts, by sample:`);
  const nameWidth = Math.max(0, ...report.perSample.map((entry) => entry.sample.length));
  for (const entry of report.perSample) {
    lines.push(`  ${entry.sample.padEnd(nameWidth)}  ${String(entry.after).padStart(5)} of ${entry.before}`);
  }
  return lines;
}
