import type { ForecastFacts, ForecastModelFacts } from './forecastFacts.js';

/** Significant digits of the errors, correlations and the figure of merit in the text report (two are what a forecast supports; three show the step check). */
const REPORT_DIGITS = 3;

/**
 * The forecast as text for the terminal: per model, a table of truth and
 * marginalized 1-sigma error, the fixed values and priors, the figure of
 * merit, the correlation matrix, the step check and the notes.
 * Cost O(models x P^2).
 * @param result the forecast (the pipeline's ForecastResult has this shape).
 * @returns the text, ending in a line break.
 * @throws nothing.
 * @example forecastText(result).split('\n')[0] // 'Fisher forecast: <survey title>'
 */
export function forecastText(result: ForecastFacts): string {
  const counts = Object.entries(result.samples).map(([label, count]) => `${label} ${count}`).join(', ');
  const lines = [
    `Fisher forecast: ${result.title}`,
    `  survey ${result.surveyFile}, seed ${result.seed}: ${result.supernovae} supernovae (${counts}), noise-free, at the truth`,
    `  parameters and priors: ${result.fitConfig ? `from ${result.fitConfig}` : 'default set (no --fit-config)'}`,
  ];
  for (const model of result.models) lines.push('', ...modelLines(model));
  lines.push('', 'Fisher matrix: Tegmark, Taylor & Heavens (1997); figure of merit: Albrecht et al. (2006).');
  return `${lines.join('\n')}\n`;
}

function modelLines(model: ForecastModelFacts): string[] {
  const names = model.parameters;
  const width = Math.max(9, ...names.map((name) => name.length)) + 2;
  const lines = [`model ${model.label} (dark energy ${model.darkEnergy}, ${model.flat ? 'flat' : 'free curvature'})`];
  lines.push(`  ${'parameter'.padEnd(width)}${'truth'.padStart(12)}${'1-sigma'.padStart(12)}`);
  names.forEach((name, i) => {
    lines.push(`  ${name.padEnd(width)}${compact(model.truth[i]).padStart(12)}${model.marginals.sigma[i].toPrecision(REPORT_DIGITS).padStart(12)}`);
  });
  const fixed = Object.entries(model.fixed).map(([name, value]) => `${name} = ${compact(value)}`).join(', ');
  lines.push(`  fixed: ${fixed || 'none'}`);
  lines.push(`  Gaussian priors added: ${model.priors.length ? model.priors.map((p) => `${p.name} (sd ${p.sd})`).join(', ') : 'none'}`);
  if (model.marginals.figureOfMerit !== null) {
    lines.push(`  figure of merit (w0, wa) = 1/sqrt(det Cov) = ${model.marginals.figureOfMerit.toPrecision(REPORT_DIGITS)}`);
  }
  if (names.length > 1) {
    lines.push('  correlations');
    lines.push(`    ${''.padEnd(width)}${names.map((name) => name.padStart(Math.max(8, name.length + 1))).join('')}`);
    names.forEach((row, i) => {
      const cells = names.map((name, j) => model.marginals.correlation[i * names.length + j].toFixed(2).padStart(Math.max(8, name.length + 1)));
      lines.push(`    ${row.padEnd(width)}${cells.join('')}`);
    });
  }
  lines.push(`  covariance information from: ${model.covarianceParameters.length ? model.covarianceParameters.join(', ') : 'none (the covariance does not follow the free parameters)'}`);
  lines.push(`  steps: ${model.stepFraction} of each conditional error; halving them changes the results by ${model.halvedStepChange.toExponential(1)} (relative)`);
  lines.push(`  chi^2 of the noise-free survey at the truth: ${Number(model.chiSquareAtTruth.toPrecision(REPORT_DIGITS))}`);
  for (const note of model.notes) lines.push(`  note: ${note}`);
  return lines;
}

function compact(value: number): string {
  return String(Number(value.toPrecision(6)));
}

