import { CandelaError } from '../errors.js';

/**
 * Boundaries on 2 ln B of the evidence scale of Kass & Raftery (1995,
 * J. Am. Stat. Assoc. 90, 773): below 2, 2 to 6, 6 to 10, above 10.
 * A value exactly on a boundary takes the stronger category.
 */
export const KASS_RAFTERY_BOUNDARIES = [2, 6, 10] as const;

/** How strongly the data prefer one model (candela's own words for the four Kass & Raftery bands). */
export type EvidenceStrength = 'negligible' | 'positive' | 'strong' | 'very strong';

/** A Bayes factor put into words. */
export interface BayesFactorReading {
  /** 2 ln B, the quantity the scale is defined on. */
  twiceLogBayesFactor: number;
  /** Band of |2 ln B|. */
  strength: EvidenceStrength;
  /** Which model the data prefer; 'neither' in the negligible band. */
  favours: 'model' | 'base' | 'neither';
  /** One sentence for tables and reports. */
  sentence: string;
}

/**
 * Reads a log Bayes factor ln B = ln Z_model - ln Z_base on the scale of Kass
 * & Raftery (1995): |2 ln B| below 2 is negligible, 2-6 positive, 6-10 strong,
 * 10 and above very strong, in either direction.
 *
 * Cost: O(1).
 * @param logBayesFactorValue ln B in nats (positive favours the model).
 * @param modelLabel Name of the model for the sentence.
 * @param baseLabel Name of the base model for the sentence.
 * @throws CandelaError `compare.invalid_argument` for NaN.
 * @example readBayesFactor(4, 'wCDM', 'LCDM').sentence // 'strong support for wCDM over LCDM (2 ln B = 8.00)'
 */
export function readBayesFactor(logBayesFactorValue: number, modelLabel = 'the model', baseLabel = 'the base model'): BayesFactorReading {
  if (Number.isNaN(logBayesFactorValue)) {
    throw new CandelaError({ code: 'compare.invalid_argument', message: 'a Bayes factor cannot be NaN', expected: 'a number', found: 'NaN' });
  }
  const twice = 2 * logBayesFactorValue;
  const size = Math.abs(twice);
  const [weakLimit, positiveLimit, strongLimit] = KASS_RAFTERY_BOUNDARIES;
  const strength: EvidenceStrength = size < weakLimit ? 'negligible' : size < positiveLimit ? 'positive' : size < strongLimit ? 'strong' : 'very strong';
  const favours = strength === 'negligible' ? 'neither' : twice > 0 ? 'model' : 'base';
  const shown = Number.isFinite(twice) ? twice.toFixed(2) : String(twice);
  const sentence =
    favours === 'neither'
      ? `no real preference between ${modelLabel} and ${baseLabel} (2 ln B = ${shown})`
      : favours === 'model'
        ? `${strength} support for ${modelLabel} over ${baseLabel} (2 ln B = ${shown})`
        : `${strength} support for ${baseLabel} over ${modelLabel} (2 ln B = ${shown})`;
  return { twiceLogBayesFactor: twice, strength, favours, sentence };
}
