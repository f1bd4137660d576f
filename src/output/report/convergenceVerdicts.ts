import type { ReportDiagnostics } from './reportInput.js';

/** The three convergence checks of one parameter. */
export interface ParameterVerdict {
  parameter: string;
  /** R-hat <= rHatMax. */
  rHatPass: boolean;
  /** ESS >= essMin. */
  essPass: boolean;
  /** chainLengthSteps >= tauMultiple * autocorrelation time. */
  lengthPass: boolean;
  /** Chain length in autocorrelation times (NaN-free: 0 when tau is not finite or not positive). */
  lengthInTaus: number;
  /** All three checks pass. */
  pass: boolean;
}

/** The verdicts of every parameter and of the run. */
export interface ConvergenceVerdicts {
  parameters: ParameterVerdict[];
  /** Every parameter passes every check (false for an empty list). */
  pass: boolean;
}

/**
 * Judges each parameter's convergence numbers: R-hat at most the maximum
 * (Vehtari, Gelman, Simpson, Carpenter & Bürkner 2021, "Rank-normalization,
 * folding, and localization: an improved R-hat", Bayesian Analysis 16, 667,
 * recommend 1.01), ESS at least the target (they recommend 400), and a chain
 * at least tauMultiple autocorrelation times long (50 is common practice for
 * affine-invariant ensemble samplers). A value
 * that is not a finite number fails its check.
 *
 * Cost: O(parameters).
 *
 * @param diagnostics numbers per parameter (R-hat dimensionless, ESS in draws, tau in steps), chain length (steps) and thresholds
 * @returns pass/fail per check and parameter, and overall
 * @example convergenceVerdicts({ rows: [{ parameter: 'w0', rHat: 1.004, ess: 900, autocorrelationTimeSteps: 40 }], chainLengthSteps: 2500, rHatMax: 1.01, essMin: 400, tauMultiple: 50 }).pass // true
 */
export function convergenceVerdicts(diagnostics: ReportDiagnostics): ConvergenceVerdicts {
  const parameters = diagnostics.rows.map((row) => {
    const tau = row.autocorrelationTimeSteps;
    const lengthInTaus = Number.isFinite(tau) && tau > 0 && Number.isFinite(diagnostics.chainLengthSteps) ? diagnostics.chainLengthSteps / tau : 0;
    const rHatPass = Number.isFinite(row.rHat) && row.rHat <= diagnostics.rHatMax;
    const essPass = Number.isFinite(row.ess) && row.ess >= diagnostics.essMin;
    const lengthPass = lengthInTaus > 0 && lengthInTaus >= diagnostics.tauMultiple;
    return { parameter: row.parameter, rHatPass, essPass, lengthPass, lengthInTaus, pass: rHatPass && essPass && lengthPass };
  });
  return { parameters, pass: parameters.length > 0 && parameters.every((verdict) => verdict.pass) };
}
