import { CandelaError } from '../errors.js';
import { comparisonLatex } from './comparisonLatex.js';
import { comparisonMarkdown } from './comparisonMarkdown.js';
import { checkComparisonInput } from './checkComparisonInput.js';
import { deltaChiSquareSignificance, SIGNIFICANCE_CAUTION } from './deltaChiSquareSignificance.js';
import { devianceInformationCriterion } from './devianceInformationCriterion.js';
import { akaikeInformationCriterion, bayesianInformationCriterion } from './informationCriteria.js';
import { logBayesFactor } from './logBayesFactor.js';
import type { ComparisonOptions, ModelComparison, ModelComparisonReport, ModelComparisonRow, ModelFitRecord, NestedComparisonRow } from './modelComparison.js';
import { readBayesFactor } from './readBayesFactor.js';

function dicOf(record: ModelFitRecord): { dic: number; effectiveParameters: number } | null {
  if (record.devianceSamples === undefined || record.devianceAtPosteriorMean === undefined) return null;
  const result = devianceInformationCriterion(record.devianceSamples, record.devianceAtPosteriorMean, record.devianceWeights);
  return { dic: result.dic, effectiveParameters: result.effectiveParameters };
}

/**
 * Compares fitted models against a base model with information criteria and
 * Bayes factors, and renders the result as Markdown and LaTeX tables.
 *   AIC = -2 ln L_max + 2k (Akaike 1974), BIC = -2 ln L_max + k ln N (Schwarz 1978),
 *   DIC = D_bar + p_D (Spiegelhalter et al. 2002) when deviance draws are given,
 *   ln B = ln Z_model - ln Z_base with errors added in quadrature, read on the
 *   scale of Kass & Raftery (1995); when a model lacks an evidence but forms a
 *   nested pair with the base that carries a Savage-Dickey ratio (Dickey 1971;
 *   Trotta 2007), ln B = -ln B_01 from that ratio.
 * For each nested pair: delta chi2 = chi2(base) - chi2(extended) with
 * m = k_ext - k_base extra parameters, its p-value and two-sided Gaussian
 * equivalent (Wilks 1938; common practice), with a caution that this ignores priors.
 *
 * Cost: O(total deviance draws + models).
 * @param records One {@link ModelFitRecord} per model (numbers dimensionless, ln in nats).
 * @param options Base label and optional nested pairs.
 * @returns The JSON-ready comparison and its Markdown and LaTeX tables.
 * @throws CandelaError listing every input problem (`compare.invalid_record`, `compare.duplicate_label`,
 *   `compare.unknown_model`, `compare.different_data`, `compare.not_nested`, `compare.invalid_argument`).
 * @example compareModels([lcdm, wcdm], { baseLabel: 'LCDM', nestedPairs: [{ base: 'LCDM', extended: 'wCDM' }] }).markdown
 */
export function compareModels(records: readonly ModelFitRecord[], options: ComparisonOptions): ModelComparisonReport {
  const issues = checkComparisonInput(records, options);
  if (issues.length > 0) throw new CandelaError(issues);
  const base = records.find((record) => record.label === options.baseLabel) as ModelFitRecord;
  const baseAic = akaikeInformationCriterion(-2 * base.logLikelihoodMaximum, base.freeParameterCount);
  const baseBic = bayesianInformationCriterion(-2 * base.logLikelihoodMaximum, base.freeParameterCount, base.dataCount);
  const baseDic = dicOf(base);
  const pairs = options.nestedPairs ?? [];
  let usedSavageDickey = false;

  const rows: ModelComparisonRow[] = records.map((record) => {
    const isBase = record === base;
    const aic = akaikeInformationCriterion(-2 * record.logLikelihoodMaximum, record.freeParameterCount);
    const bic = bayesianInformationCriterion(-2 * record.logLikelihoodMaximum, record.freeParameterCount, record.dataCount);
    const dic = dicOf(record);
    let estimate: { logBayesFactor: number; error: number } | null = null;
    let source: ModelComparisonRow['bayesFactorSource'] = null;
    if (record.logZ !== undefined && base.logZ !== undefined) {
      estimate = logBayesFactor({ logZ: record.logZ, logZError: record.logZError ?? 0 }, { logZ: base.logZ, logZError: base.logZError ?? 0 });
      source = 'evidence';
    } else if (!isBase) {
      const pair = pairs.find((candidate) => candidate.base === base.label && candidate.extended === record.label && candidate.savageDickey);
      if (pair?.savageDickey) {
        estimate = { logBayesFactor: -pair.savageDickey.logBayesFactor, error: pair.savageDickey.logBayesFactorError };
        source = 'savage-dickey';
        usedSavageDickey = true;
      }
    }
    const reading = estimate && !isBase ? readBayesFactor(estimate.logBayesFactor, record.label, base.label) : null;
    return {
      label: record.label,
      isBase,
      freeParameterCount: record.freeParameterCount,
      dataCount: record.dataCount,
      chiSquareMinimum: record.chiSquareMinimum,
      logLikelihoodMaximum: record.logLikelihoodMaximum,
      aic,
      bic,
      dic: dic ? dic.dic : null,
      effectiveParameters: dic ? dic.effectiveParameters : null,
      deltaAic: aic - baseAic,
      deltaBic: bic - baseBic,
      deltaDic: dic && baseDic ? dic.dic - baseDic.dic : null,
      logZ: record.logZ ?? null,
      logZError: record.logZ !== undefined ? (record.logZError ?? 0) : null,
      logBayesFactor: estimate ? estimate.logBayesFactor : null,
      logBayesFactorError: estimate ? estimate.error : null,
      bayesFactorSource: source,
      strength: reading ? reading.strength : null,
      favours: reading ? reading.favours : null,
      reading: reading ? reading.sentence : null,
    };
  });

  const nested: NestedComparisonRow[] = pairs.map((pair) => {
    const simple = records.find((record) => record.label === pair.base) as ModelFitRecord;
    const extended = records.find((record) => record.label === pair.extended) as ModelFitRecord;
    const significance = deltaChiSquareSignificance(simple.chiSquareMinimum - extended.chiSquareMinimum, extended.freeParameterCount - simple.freeParameterCount);
    const sd = pair.savageDickey;
    return {
      base: simple.label,
      extended: extended.label,
      extraParameters: significance.extraParameters,
      deltaChiSquare: significance.deltaChiSquare,
      pValue: significance.pValue,
      logPValue: significance.logPValue,
      sigma: significance.sigma,
      savageDickeyLogBayesFactor: sd ? sd.logBayesFactor : null,
      savageDickeyError: sd ? sd.logBayesFactorError : null,
      savageDickeyReading: sd ? readBayesFactor(sd.logBayesFactor, simple.label, extended.label).sentence : null,
    };
  });

  const notes = [
    `Differences are each model minus ${base.label}; a negative delta AIC, BIC or DIC favours the model.`,
    'AIC = -2 ln L_max + 2k (Akaike 1974); BIC = -2 ln L_max + k ln N (Schwarz 1978); DIC = mean deviance + p_D (Spiegelhalter et al. 2002).',
    `ln B = ln Z(model) - ln Z(${base.label}); positive favours the model. Words follow the 2 ln B bands of Kass & Raftery (1995).`,
  ];
  if (usedSavageDickey) notes.push('Bayes factors marked as Savage-Dickey come from a posterior density ratio at the nested point (Dickey 1971), not from evidences.');
  if (nested.length > 0) notes.push(SIGNIFICANCE_CAUTION);
  const comparison: ModelComparison = { baseLabel: base.label, rows, nested, notes };
  return { comparison, markdown: comparisonMarkdown(comparison), latex: comparisonLatex(comparison) };
}
