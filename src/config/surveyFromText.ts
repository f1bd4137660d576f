/**
 * Survey-description YAML text -> validated SurveyDescription, or the list of
 * every problem (the same reader, positions and wording as the run
 * configuration).
 */
import { LineCounter, isScalar, parseDocument } from 'yaml';
import type { Checked, Issue } from '../errors.js';
import { ConfigReader } from './configReader.js';
import type { Located } from './configReader.js';
import { DEFAULT_SEED } from './defaults.js';
import { LABEL_PATTERN } from './readLabel.js';
import { resolveConfigPath } from './resolveConfigPath.js';
import type { SurveyAnalysisSystematics, SurveyDescription, SurveyOutput } from './surveyDescription.js';
import { DEFAULT_ANALYSIS_SYSTEMATICS, DEFAULT_SURVEY_OUTPUT, DEFAULT_SURVEY_SCATTER, DEFAULT_SURVEY_TITLE } from './surveyDefaults.js';
import { surveyMissingKey } from './surveyMissingKey.js';
import { readSurveySamples } from './surveySampleReader.js';
import { readSurveyTruth } from './surveyTruthReader.js';

/** The top-level keys of a survey description, in documentation order. */
export const SURVEY_TOP_LEVEL_KEYS = [
  'title', 'seed', 'truth', 'lensing_per_redshift', 'peculiar_velocity_km_s', 'redshift_drift_mag', 'analysis_systematics', 'samples', 'output',
] as const;
const OUTPUT_KEYS = ['dir', 'table', 'covariance', 'truth', 'systematics_form', 'named_modes'] as const;
const ANALYSIS_KEYS = ['host_mass_split_dex', 'coherent_velocity_km_s', 'coherent_velocity_max_redshift'] as const;
/** Values of output.systematics_form. */
const SYSTEMATICS_FORMS = ['matrix', 'modes'] as const;

/**
 * Parses and validates a survey description. YAML syntax errors are reported
 * with their positions (the content is then not checked); otherwise every
 * problem is collected, each with file, line:column, key path, what was
 * expected and found, and a fix (did-you-mean for unknown keys and values).
 * `output.dir` is resolved against the folder of `fileName`. No file is read.
 * Cost: linear in the text.
 * @param text the YAML text.
 * @param fileName the file it came from (for messages and path resolution).
 * @returns the description with defaults filled and its warnings, or all issues in file order.
 * @example surveyFromText('seed: 1\ntruth: ...\nsamples: ...', 'configs/demo-survey.yaml') // { ok: true, value: {...}, warnings: [] }
 */
export function surveyFromText(text: string, fileName: string): Checked<SurveyDescription> {
  const lineCounter = new LineCounter();
  const document = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true });
  const positionOf = (offset: number) => {
    const { line, col } = lineCounter.linePos(offset);
    return { line, column: col };
  };
  const syntax: Issue[] = document.errors.map((error) => ({
    code: 'config.yaml_syntax', message: `YAML syntax: ${error.message.split('\n')[0]}`, file: fileName, ...positionOf(error.pos[0]),
    fix: 'check the indentation, the ":" after each key and matching quotes and brackets near this position',
  }));
  if (syntax.length > 0) return { ok: false, issues: syntax };

  const reader = new ConfigReader(document, lineCounter, fileName);
  const root = reader.root();
  const rootAt: Located = root.node === null ? { ...root, anchor: null } : root;
  const fields = reader.mapping(rootAt, SURVEY_TOP_LEVEL_KEYS);
  const empty = root.node === null || (isScalar(root.node) && (root.node.value === null || root.node.value === undefined));
  if (fields || empty) surveyMissingKey(reader, rootAt, fields, ['truth', 'samples']);
  const get = (key: string): Located | undefined => fields?.get(key);

  const truth = get('truth') ? readSurveyTruth(reader, get('truth')!) : undefined;
  const samples = get('samples') ? readSurveySamples(reader, get('samples')!) : [];
  const description = {
    title: (reader.text(get('title'), { numbersAsText: true }) as string | undefined) ?? DEFAULT_SURVEY_TITLE,
    seed: readSeed(reader, get('seed')),
    lensingPerRedshift: reader.number(get('lensing_per_redshift'), { min: 0, max: 1 }) ?? DEFAULT_SURVEY_SCATTER.lensingPerRedshift,
    // Bulk flows reach ~1000 km/s; larger values point at a unit mistake (m/s), as in the run configuration.
    peculiarVelocityKmPerS: reader.number(get('peculiar_velocity_km_s'), { min: 0, max: 3000, fix: 'give the velocity dispersion in km/s, e.g. 250' })
      ?? DEFAULT_SURVEY_SCATTER.peculiarVelocityKmPerS,
    redshiftDriftMag: reader.number(get('redshift_drift_mag'), { min: 0 }) ?? DEFAULT_SURVEY_SCATTER.redshiftDriftMag,
    analysisSystematics: readAnalysisSystematics(reader, get('analysis_systematics')),
    output: readOutput(reader, get('output')),
    sourceFile: fileName,
  };
  const byPosition = (a: Issue, b: Issue): number => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0);
  const issues = [...reader.issues].sort(byPosition);
  const warnings = issues.filter((issue) => issue.severity === 'warning');
  if (warnings.length < issues.length || !truth) return { ok: false, issues };
  return { ok: true, value: { ...description, truth, samples }, warnings };
}

/** Seed: an integer or text; absent gives the default with a warning. */
function readSeed(reader: ConfigReader, at: Located | undefined): number | string {
  if (!at) {
    reader.reportAtPath('seed', 'config.no_seed', `no seed given: using ${DEFAULT_SEED}`, {
      severity: 'warning', fix: 'add "seed: <integer>" so that the same survey can be drawn again',
    });
    return DEFAULT_SEED;
  }
  if (at.node && isScalar(at.node) && typeof at.node.value === 'number') {
    return reader.number(at, { integer: true, min: Number.MIN_SAFE_INTEGER, max: Number.MAX_SAFE_INTEGER }) ?? DEFAULT_SEED;
  }
  return (reader.text(at) as string | undefined) ?? DEFAULT_SEED;
}

/**
 * Output folder (resolved against the survey file), plain, distinct file
 * names, and the form of the systematics file (the default name of
 * `covariance` follows the form).
 */
function readOutput(reader: ConfigReader, at: Located | undefined): SurveyOutput {
  const fields = reader.mapping(at, OUTPUT_KEYS);
  const systematicsForm = reader.choice(fields?.get('systematics_form'), SYSTEMATICS_FORMS) ?? DEFAULT_SURVEY_OUTPUT.systematicsForm;
  const defaults = { ...DEFAULT_SURVEY_OUTPUT, covariance: systematicsForm === 'modes' ? DEFAULT_SURVEY_OUTPUT.modesFile : DEFAULT_SURVEY_OUTPUT.covariance };
  const name = <K extends 'table' | 'covariance' | 'truth' | 'namedModes'>(key: K, yamlKey: string = key): (typeof defaults)[K] | string => {
    const value = reader.text(fields?.get(yamlKey));
    if (typeof value !== 'string') return defaults[key];
    if (!LABEL_PATTERN.test(value)) {
      reader.report(fields!.get(yamlKey)!, 'config.bad_file_name', `"${value}" is not a plain file name`, {
        expected: 'a file name of letters, digits, "_", "." or "-" (the folder goes in output.dir)', found: `"${value}"`,
        fix: 'put the folder in output.dir and only the file name here',
      });
      return defaults[key];
    }
    return value;
  };
  const output: SurveyOutput = {
    dir: resolveConfigPath(reader.fileName, reader.text(fields?.get('dir')) ?? DEFAULT_SURVEY_OUTPUT.dir),
    table: name('table'), covariance: name('covariance'), truth: name('truth'), systematicsForm, namedModes: name('namedModes', 'named_modes'),
  };
  const names = [output.table, output.covariance, output.truth, ...(output.namedModes === null ? [] : [output.namedModes])];
  if (new Set(names).size < names.length) {
    reader.report(at ?? { node: null, path: 'output', anchor: null }, 'config.duplicate_file_name', 'two output files have the same name', {
      expected: 'different file names', found: names.join(', '), fix: 'give the table, the covariance, the truth and the named-modes file different names',
    });
  }
  return output;
}

/** `analysis_systematics`: standard deviations of the host-mass split (dex) and of a coherent velocity (km/s), and its redshift limit. */
function readAnalysisSystematics(reader: ConfigReader, at: Located | undefined): SurveyAnalysisSystematics {
  const fields = reader.mapping(at, ANALYSIS_KEYS);
  return {
    hostMassSplitDex: reader.number(fields?.get('host_mass_split_dex'), { min: 0, max: 2 }) ?? DEFAULT_ANALYSIS_SYSTEMATICS.hostMassSplitDex,
    coherentVelocityKmPerS: reader.number(fields?.get('coherent_velocity_km_s'), { min: 0, max: 3000, fix: 'give the velocity in km/s, e.g. 100' })
      ?? DEFAULT_ANALYSIS_SYSTEMATICS.coherentVelocityKmPerS,
    coherentVelocityMaxRedshift: reader.number(fields?.get('coherent_velocity_max_redshift'), { min: 0, exclusiveMin: true, max: 10 })
      ?? DEFAULT_ANALYSIS_SYSTEMATICS.coherentVelocityMaxRedshift,
  };
}
