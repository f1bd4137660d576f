/**
 * `candela check`: read and validate a configuration file, then read and
 * check every data, covariance and systematic-mode file it names (columns,
 * numbers, errors, covariance shape, symmetry and positive definiteness, mode
 * rows and columns), apply the cuts, build each model's likelihood, and
 * summarize what would run.
 */
import type { Issue } from '../../errors.js';
import { CandelaError } from '../../errors.js';
import { describeConfig, readConfigFile } from '../../config/index.js';
import type { CandelaConfig } from '../../config/index.js';
import { formatCutReport } from '../../data/index.js';
import { buildModel } from '../run/buildModel.js';
import { loadSupernovae } from '../run/loadSupernovae.js';

/** What checkConfiguration found. */
export interface ConfigurationCheck {
  config: CandelaConfig;
  /** What would run, one line per data set, model, sampler and output (describeConfig). */
  summaryLines: string[];
  /** Problems that do not stop a run (unused settings, no seed, ...). */
  warnings: Issue[];
}

/**
 * Reads and validates a configuration file, then its data (unless
 * `configOnly`): the cut report per data set and the likelihood each model
 * would use are added to the summary.
 * Cost: the file reads, and one covariance factorization per model.
 * @param path the configuration file; paths inside it resolve against its folder.
 * @throws CandelaError listing every problem, warnings included, when there is at least one error.
 * @example checkConfiguration('configs/jla.yaml').summaryLines[0] // 'title: JLA ... (file configs/jla.yaml)'
 */
export function checkConfiguration(path: string, options: { configOnly?: boolean } = {}): ConfigurationCheck {
  const result = readConfigFile(path);
  if (!result.ok) throw new CandelaError(result.issues);
  const config = result.value;
  const summaryLines = describeConfig(config);
  const warnings = [...result.warnings];
  if (!options.configOnly) {
    const data = loadSupernovae(config);
    warnings.push(...data.warnings);
    for (const { label, report } of data.cutReports) {
      summaryLines.push(`data set "${label}":`, ...formatCutReport(report).map((line) => `  ${line}`));
      for (const modes of data.systematicModeFiles.filter((entry) => entry.label === label)) {
        summaryLines.push(`  systematic modes ${modes.file}: ${modes.supernovae} supernovae x ${modes.modes} mode${modes.modes === 1 ? '' : 's'} (before cuts)`);
      }
    }
    config.models.forEach((model, index) => {
      const built = buildModel(config, index, data);
      summaryLines.push(`likelihood of model "${model.label}":`, ...(built.supernovae?.describe() ?? []).map((line) => `  ${line}`),
        ...built.probes.flatMap((probe) => probe.loaded.describe).map((line) => `  ${line}`));
    });
  }
  return { config, summaryLines, warnings };
}
