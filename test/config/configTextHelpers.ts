// Helpers for the configuration tests: parse inline YAML and locate snippets.
import { expect } from 'vitest';
import { parseConfigText } from '../../src/config/index.js';
import type { CandelaConfig } from '../../src/config/index.js';
import type { Issue } from '../../src/errors.js';

/** A valid configuration of kind magnitudes: the base every error case edits. */
export const VALID_MAGNITUDES = `title: test
seed: 7
supernovae:
  - label: bins
    kind: magnitudes
    table:
      file: table.txt
    columns:
      id: name
      z: zcmb
      magnitude: mb
      magnitude_err: dmb
standardization:
  scatter:
    intrinsic: off
models:
  - label: flat_lcdm
    dark_energy: lambda
`;

/** A valid configuration of kind light_curves. */
export const VALID_LIGHT_CURVES = `seed: 11
supernovae:
  - label: lc
    kind: light_curves
    table: { file: lc.txt }
    columns:
      id: name
      z: zcmb
      m_b: mb
      m_b_err: dmb
      x1: x1
      x1_err: dx1
      color: color
      color_err: dcolor
      host_log_mass: mass
models:
  - { label: flat_lcdm, dark_energy: lambda }
`;

/** 1-based line of the first line containing `snippet` (the test's own text is the reference). */
export function lineOf(text: string, snippet: string): number {
  const index = text.split('\n').findIndex((line) => line.includes(snippet));
  if (index < 0) throw new Error(`snippet not found: ${snippet}`);
  return index + 1;
}

/** Parses text expected to be invalid and returns its error issues. */
export function errorsOf(text: string, fileName = 'run.yaml'): Issue[] {
  const result = parseConfigText(text, fileName);
  expect(result.ok, 'expected the configuration to be rejected').toBe(false);
  return result.ok ? [] : result.issues.filter((issue) => issue.severity !== 'warning');
}

/** Parses text expected to be valid. */
export function configOf(text: string, fileName = 'run.yaml'): { config: CandelaConfig; warnings: Issue[] } {
  const result = parseConfigText(text, fileName);
  if (!result.ok) throw new Error(result.issues.map((issue) => `${issue.line}:${issue.column} ${issue.path} ${issue.message}`).join('\n'));
  return { config: result.value, warnings: result.warnings };
}

/** The single issue with this code (fails when there is not exactly one). */
export function only(issues: Issue[], code: string): Issue {
  const matching = issues.filter((issue) => issue.code === code);
  expect(matching.map((issue) => `${issue.path}: ${issue.message}`), `issues with code ${code}`).toHaveLength(1);
  return matching[0];
}

/** Asserts an issue names the file, the line of `snippet` in `text`, the key path, and gives a fix. */
export function expectLocated(issue: Issue, text: string, snippet: string, path: string): void {
  expect(issue.file).toBe('run.yaml');
  expect(issue.line, `line of "${snippet}"`).toBe(lineOf(text, snippet));
  expect(issue.column).toBeGreaterThan(0);
  expect(issue.path).toBe(path);
  expect(issue.fix, 'fix').toBeTruthy();
}
