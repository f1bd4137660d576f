/**
 * Runs one benchmark case in its own Node.js process, so that its peak
 * resident set size is its own, and reads back its report: the case script
 * prints one line `CASE_REPORT <json>` (see reportCase) as its last output.
 */
import { execFile } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { peakRssMb } from '../suite.js';

const REPORT_MARKER = 'CASE_REPORT ';
/** Longest a single case may run (the slowest, a 1,829-supernova fit, takes well under this). */
const CASE_TIMEOUT_MS = 20 * 60 * 1000;

/** Plain data reported by a case; `peak_rss_mb` is always present. */
export type CaseReport = Record<string, number | string | number[] | string[] | null>;

/**
 * Starts `node <script> ...args` (script: a URL relative to the compiled
 * bench/ folder, e.g. new URL('./cases/likelihoodCase.js', import.meta.url)),
 * waits for it and returns its report. Rejects with the child's stderr when
 * it fails or prints no report.
 */
export function runChildCase(script: URL, args: string[]): Promise<CaseReport> {
  return new Promise((resolve, reject) => {
    execFile(process.execPath, [fileURLToPath(script), ...args], { maxBuffer: 64 * 1024 * 1024, timeout: CASE_TIMEOUT_MS }, (error, stdout, stderr) => {
      const line = stdout.split('\n').reverse().find((text) => text.startsWith(REPORT_MARKER));
      if (error || !line) {
        reject(new Error(`benchmark case ${script.pathname.split('/').pop()} ${args.join(' ')} failed: ${error?.message ?? 'no report'}\n${stderr}`));
        return;
      }
      resolve(JSON.parse(line.slice(REPORT_MARKER.length)) as CaseReport);
    });
  });
}

/** Inside a case script: prints the report line with the process's peak RSS added. */
export function reportCase(report: CaseReport): void {
  process.stdout.write(`${REPORT_MARKER}${JSON.stringify({ ...report, peak_rss_mb: peakRssMb() })}\n`);
}

/** Inside a case script: runs `main`, reporting a failure on stderr with exit code 1. */
export function runCaseMain(main: () => Promise<void> | void): void {
  Promise.resolve().then(main).catch((error: unknown) => {
    process.stderr.write(`${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`);
    process.exitCode = 1;
  });
}

/** Reads `--name value` pairs from the command line. */
export function caseArguments(): Record<string, string> {
  const args = process.argv.slice(2);
  const out: Record<string, string> = {};
  for (let i = 0; i + 1 < args.length; i += 2) out[args[i].replace(/^--/, '')] = args[i + 1];
  return out;
}
