/**
 * Range rules of numbers in the configuration, and their wording.
 */

/** Range rule of a number (all optional). */
export interface NumberRule {
  integer?: boolean;
  min?: number;
  max?: number;
  /** `min` itself is not allowed. */
  exclusiveMin?: boolean;
  exclusiveMax?: boolean;
  /** Fix to print instead of the generic one. */
  fix?: string;
}

/**
 * A number rule in words, for `expected` and the fix of a message.
 * @example numberRuleText({ integer: true, min: 2 }) // 'an integer >= 2'
 * @example numberRuleText({ min: 0, max: 1 }) // 'a number >= 0 and <= 1'
 */
export function numberRuleText(rule: NumberRule): string {
  const noun = rule.integer ? 'an integer' : 'a number';
  const low = rule.min === undefined ? '' : `${rule.exclusiveMin ? '>' : '>='} ${rule.min}`;
  const high = rule.max === undefined ? '' : `${rule.exclusiveMax ? '<' : '<='} ${rule.max}`;
  if (low && high) return `${noun} ${low} and ${high}`;
  return low || high ? `${noun} ${low || high}` : noun;
}
