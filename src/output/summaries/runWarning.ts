/**
 * One warning about a run, as data: what kind it is, the parameter it
 * concerns and the numbers behind it, with its sentence for people. The same
 * object is printed on the terminal, stored in summary.json (`warnings`) and
 * shown in the report's top box.
 */
export interface RunWarning {
  /** Stable snake_case kind, e.g. `prior_edge`, `goodness_of_fit`, `fixed_parameter`. */
  code: string;
  /** Parameter (or derived quantity) the warning concerns, or null for the run as a whole. */
  parameter: string | null;
  /** The sentence printed and shown. */
  message: string;
  /** The numbers the sentence quotes, by name (units in the names, e.g. `prior_lower`, `p_value`). */
  numbers: Record<string, number>;
}

/**
 * A warning with the given code, parameter and numbers.
 * @param code the kind (snake_case).
 * @param parameter the parameter concerned, or null.
 * @param message the sentence.
 * @param numbers the numbers it quotes (default none).
 * @returns the warning object.
 * @example runWarning('stuck_walkers', null, '2 walkers are stuck', { walkers: 2 }).code // 'stuck_walkers'
 */
export function runWarning(code: string, parameter: string | null, message: string, numbers: Record<string, number> = {}): RunWarning {
  return { code, parameter, message, numbers };
}
