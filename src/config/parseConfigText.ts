/**
 * YAML text -> validated configuration, or the list of every problem.
 */
import { LineCounter, isScalar, parseDocument } from 'yaml';
import type { YAMLError } from 'yaml';
import type { Checked, Issue } from '../errors.js';
import type { CandelaConfig, DerivedQuantity, ParameterSpec } from './candelaConfig.js';
import { checkCrossFieldRules } from './checkCrossFieldRules.js';
import { ConfigReader } from './configReader.js';
import type { Located } from './configReader.js';
import { DEFAULT_PRIORS, DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC, DEFAULT_SEED, DEFAULT_TITLE } from './defaults.js';
import { parameterContext, usedParameterBases } from './modelParameterNames.js';
import { readModels } from './readModels.js';
import { readProbes } from './readProbes.js';
import { readOutput } from './readOutput.js';
import { readParameters } from './readParameters.js';
import { readSampler } from './readSampler.js';
import { readStandardization } from './readStandardization.js';
import { readSupernovae } from './readSupernovae.js';
import { readBlinding } from './readBlinding.js';
import { resolveConfigPath } from './resolveConfigPath.js';
import { lineOfNestingError, yamlSyntaxFix } from './yamlSyntaxFix.js';

/** The top-level keys, in documentation order. */
export const TOP_LEVEL_KEYS = [
  'title', 'seed', 'supernovae', 'standardization', 'probes', 'models', 'parameters', 'derived', 'reference_h0', 'sampler', 'output', 'blinding',
] as const;
const DERIVED: readonly DerivedQuantity[] = ['omega_k', 'omega_de', 'q0', 'z_accel', 'age_gyr', 'offset'];

/**
 * Parses and validates a configuration. YAML syntax errors are reported with
 * their positions (the content is then not checked); otherwise every
 * problem in every section is collected, each with file, line:column, key
 * path, what was expected, what was found and the fix. Paths are resolved
 * against the folder of `fileName`. No file is read.
 * Cost: linear in the text, plus O(models x parameters) for the rules.
 * @param text the YAML text.
 * @param fileName the file it came from (for messages and path resolution).
 * @returns the configuration with defaults filled and warnings, or all issues (errors and warnings) in file order.
 * @example parseConfigText('supernovae: ...', 'run.yaml') // { ok: true, value: {...}, warnings: [] }
 */
export function parseConfigText(text: string, fileName: string): Checked<CandelaConfig> {
  const lineCounter = new LineCounter();
  const document = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  const positionOf = (error: YAMLError): { line: number; column: number } => {
    const { line, col } = lineCounter.linePos(error.pos[0]);
    return { line, column: col };
  };
  const lines = text.split(/\r?\n/);
  const lineAbove = (line: number): string => {
    for (let k = line - 2; k >= 0; k--) if (lines[k].trim() !== '' && !lines[k].trimStart().startsWith('#')) return lines[k];
    return '';
  };
  const indentOfLine = (lineText: string): number => lineText.length - lineText.trimStart().length;
  // One issue per line: the yaml package often reports one mistake twice (e.g. two codes for one over-indented key).
  const seenLines = new Set<number>();
  const syntax: Issue[] = [];
  for (const error of document.errors) {
    const reported = positionOf(error);
    const line = lineOfNestingError(lines, reported.line, error.code);
    const position = line === reported.line ? reported : { line, column: indentOfLine(lines[line - 1]) + 1 };
    if (seenLines.has(position.line)) continue;
    seenLines.add(position.line);
    const message = error.message.split('\n')[0];
    syntax.push({
      code: 'config.yaml_syntax', message: `YAML syntax: ${message}`, file: fileName, ...position,
      fix: yamlSyntaxFix({ code: error.code, message, lineText: lines[position.line - 1] ?? '', previousText: lineAbove(position.line) }),
    });
  }
  const yamlWarnings: Issue[] = document.warnings.map((warning) => ({
    code: 'config.yaml_warning', severity: 'warning', message: warning.message.split('\n')[0], file: fileName, ...positionOf(warning),
  }));
  if (syntax.length > 0) return { ok: false, issues: [...syntax, ...yamlWarnings] };

  const reader = new ConfigReader(document, lineCounter, fileName);
  const root = reader.root();
  const fields = reader.mapping(root.node === null ? { ...root, anchor: null } : root, TOP_LEVEL_KEYS) ?? new Map<string, Located>();
  const absent = (key: string): Located => ({ node: null, path: key, anchor: root.node });
  const get = (key: string): Located => fields.get(key) ?? absent(key);

  const seed = readSeed(reader, fields.get('seed'));
  const supernovae = fields.has('supernovae') ? readSupernovae(reader, get('supernovae')) : [];
  const standardization = readStandardization(reader, get('standardization'));
  const probes = readProbes(reader, fields.get('probes'), fileName);
  if (!fields.has('supernovae') && !fields.has('probes') && !reader.failedAt('')) {
    // A run needs data: supernovae, or at least one probe (BAO alone, BAO + CMB, ...).
    reader.report(absent('supernovae'), 'config.missing_key', 'required key "supernovae" is missing: a run needs supernovae or at least one probe', {
      expected: 'supernovae, probes, or both', found: 'neither', fix: 'add "supernovae: ..." or "probes: { bao: { table: ... } }" (see docs/configuration.md)',
    });
  }
  const models = readModels(reader, get('models'));
  const userParameters = readParameters(reader, fields.get('parameters'));
  const derivedAt = fields.get('derived');
  const derived = derivedAt?.node && isScalar(derivedAt.node) && derivedAt.node.value === 'auto' ? 'auto'
    : (reader.list(derivedAt)?.map((item) => reader.choice(item, DERIVED)).filter((d): d is DerivedQuantity => d !== undefined) ?? 'auto');
  const config: CandelaConfig = {
    title: (reader.text(fields.get('title'), { numbersAsText: true }) as string | undefined) ?? DEFAULT_TITLE,
    seed,
    supernovae,
    standardization,
    probes,
    models,
    parameters: withDefaultPriors(userParameters, { supernovae, standardization, probes, models }),
    derived,
    referenceH0KmPerSPerMpc: reader.number(fields.get('reference_h0'), { min: 0, exclusiveMin: true }) ?? DEFAULT_REFERENCE_H0_KM_PER_S_PER_MPC,
    sampler: readSampler(reader, get('sampler')),
    output: readOutput(reader, get('output')),
    blinding: readBlinding(reader, fields.get('blinding')),
    source: { file: { written: fileName, resolved: fileName }, positions: reader.positions },
  };
  if (!reader.failedAt('supernovae') && !reader.failedAt('standardization')) checkCrossFieldRules(reader, config, userParameters);

  const byPosition = (a: Issue, b: Issue): number => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0);
  const issues = [...reader.issues, ...yamlWarnings].sort(byPosition);
  const warnings = issues.filter((issue) => issue.severity === 'warning');
  if (warnings.length < issues.length) return { ok: false, issues };
  return { ok: true, value: config, warnings };
}

/** Seed: an integer or text; absent gives the default with a warning. */
function readSeed(reader: ConfigReader, at: Located | undefined): number | string {
  if (!at) {
    reader.reportAtPath('seed', 'config.no_seed', `no seed given: using ${DEFAULT_SEED}`, {
      severity: 'warning', fix: 'add "seed: <integer>" so that the run can be repeated exactly and others know it',
    });
    return DEFAULT_SEED;
  }
  if (at.node && isScalar(at.node) && typeof at.node.value === 'number') {
    return reader.number(at, { integer: true, min: Number.MIN_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }) ?? DEFAULT_SEED;
  }
  return (reader.text(at) as string | undefined) ?? DEFAULT_SEED;
}

/** The user's global entries plus the default prior of every base parameter some model uses. */
function withDefaultPriors(
  user: Record<string, ParameterSpec>, parts: Pick<CandelaConfig, 'supernovae' | 'standardization' | 'probes' | 'models'>,
): Record<string, ParameterSpec> {
  const context = parameterContext(parts, Object.keys(user));
  const block: Record<string, ParameterSpec> = {};
  for (const model of parts.models) {
    for (const base of usedParameterBases(context, model)) {
      if (!block[base]) block[base] = { mode: 'prior', prior: { ...DEFAULT_PRIORS[base] } };
    }
  }
  return { ...block, ...user };
}
