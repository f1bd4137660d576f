// Every kind of configuration problem is reported with file, line, key path
// and a fix. Expected lines come from the test's own YAML text (lineOf);
// columns are where the YAML node starts (counted by hand in the text).
import { describe, expect, it } from 'vitest';
import { parseConfigText } from '../../src/config/index.js';
import { formatIssue } from '../../src/errors.js';
import { VALID_LIGHT_CURVES, VALID_MAGNITUDES, errorsOf, expectLocated, lineOf, only } from './configTextHelpers.js';

describe('parseConfigText: unknown keys', () => {
  it('names the closest valid key for a misspelt key', () => {
    const text = `${VALID_MAGNITUDES}sampler:\n  walker: 32\n`;
    const issue = only(errorsOf(text), 'config.unknown_key');
    expect(issue).toMatchObject({ file: 'run.yaml', line: lineOf(text, 'walker: 32'), column: 3, path: 'sampler.walker' });
    expect(issue.fix).toBe('did you mean "walkers"?');
    expect(formatIssue(issue)).toContain(`run.yaml:${lineOf(text, 'walker: 32')}:3: error at sampler.walker: unknown key "walker"`);
  });

  it('suggests across case and spelling (colour -> color, maxSteps -> max_steps)', () => {
    const text = VALID_MAGNITUDES.replace('      magnitude_err: dmb', '      magnitude_err: dmb\n      colour: c') + 'sampler:\n  maxSteps: 10\n';
    const issues = errorsOf(text).filter((issue) => issue.code === 'config.unknown_key');
    expect(issues.map((issue) => [issue.path, issue.line, issue.fix])).toEqual([
      ['supernovae[0].columns.colour', lineOf(text, 'colour: c'), 'did you mean "color"?'],
      ['sampler.maxSteps', lineOf(text, 'maxSteps'), 'did you mean "max_steps"?'],
    ]);
  });

  it('says what to do when nothing is close', () => {
    const text = `${VALID_MAGNITUDES}banana: 3\n`;
    const issue = only(errorsOf(text), 'config.unknown_key');
    expect(issue).toMatchObject({ path: 'banana', line: lineOf(text, 'banana'), column: 1 });
    expect(issue.fix).toContain('remove "banana"');
    expect(issue.expected).toContain('supernovae');
  });

  it('names the closest parameter for an unknown parameter name', () => {
    const text = `${VALID_MAGNITUDES}parameters:\n  omega_mm: { prior: uniform, min: 0, max: 1 }\n`;
    const issue = only(errorsOf(text), 'config.unknown_key');
    expect(issue).toMatchObject({ path: 'parameters.omega_mm', line: lineOf(text, 'omega_mm'), column: 3 });
    expect(issue.message).toBe('unknown parameter "omega_mm"');
    expect(issue.fix).toBe('did you mean "omega_m"?');
  });
});

describe('parseConfigText: types, ranges and enums', () => {
  it('reports a wrong type with what was found', () => {
    const text = `${VALID_MAGNITUDES}sampler:\n  walkers: many\n`;
    const issue = only(errorsOf(text), 'config.wrong_type');
    expect(issue).toMatchObject({ path: 'sampler.walkers', line: lineOf(text, 'walkers: many'), column: 12, found: '"many"' });
    expect(issue.expected).toBe('an integer >= 2');
    expect(issue.fix).toBe('write an integer >= 2');
  });

  it('asks to remove quotes around a quoted number', () => {
    const text = `${VALID_MAGNITUDES}reference_h0: "70"\n`;
    const issue = only(errorsOf(text), 'config.wrong_type');
    expectLocated(issue, text, 'reference_h0', 'reference_h0');
    expect(issue.fix).toBe('remove the quotes around the number');
  });

  it('reports out-of-range numbers with the allowed range', () => {
    const text = `${VALID_MAGNITUDES}sampler:\n  ensembles: 0\n  max_rhat: 0.99\n  stretch_scale: 1\n`;
    const issues = errorsOf(text).filter((issue) => issue.code === 'config.out_of_range');
    expect(issues.map((issue) => [issue.path, issue.line, issue.expected, issue.found])).toEqual([
      ['sampler.ensembles', lineOf(text, 'ensembles: 0'), 'an integer >= 1', '0'],
      ['sampler.max_rhat', lineOf(text, 'max_rhat'), 'a number > 1', '0.99'],
      ['sampler.stretch_scale', lineOf(text, 'stretch_scale'), 'a number > 1', '1'],
    ]);
    expect(issues[1].fix).toContain('1.01');
  });

  it('rejects a non-integer walker count', () => {
    const text = `${VALID_MAGNITUDES}sampler: { walkers: 32.5 }\n`;
    const issue = only(errorsOf(text), 'config.out_of_range');
    expectLocated(issue, text, 'walkers: 32.5', 'sampler.walkers');
    expect(issue.found).toBe('32.5');
  });

  it('names the closest value of an unknown enum word', () => {
    const text = VALID_MAGNITUDES.replace('kind: magnitudes', 'kind: magnitude');
    const issue = only(errorsOf(text), 'config.unknown_value');
    expect(issue).toMatchObject({ path: 'supernovae[0].kind', line: lineOf(text, 'kind: magnitude'), column: 11, found: '"magnitude"' });
    expect(issue.fix).toBe('did you mean "magnitudes"?');
  });

  it('lists the choices when the enum word is far from all of them', () => {
    const text = VALID_MAGNITUDES.replace('dark_energy: lambda', 'dark_energy: quintessence');
    const issue = only(errorsOf(text), 'config.unknown_value');
    expectLocated(issue, text, 'quintessence', 'models[0].dark_energy');
    expect(issue.fix).toBe('write one of lambda, constant_w, cpl');
  });
});

describe('parseConfigText: missing keys and YAML syntax', () => {
  it('reports a missing required key at its parent', () => {
    const text = VALID_MAGNITUDES.replace('      file: table.txt\n', '      delimiter: whitespace\n');
    const issue = only(errorsOf(text), 'config.missing_key');
    expect(issue).toMatchObject({ path: 'supernovae[0].table.file', line: lineOf(text, 'delimiter: whitespace'), column: 7 });
    expect(issue.fix).toContain('add "file: ..."');
  });

  it('requires the columns of the data kind', () => {
    const text = VALID_MAGNITUDES.replace('      magnitude_err: dmb\n', '');
    // Reported at the columns mapping, whose first key is on the "id: name" line.
    expectLocated(only(errorsOf(text), 'config.missing_key'), text, 'id: name', 'supernovae[0].columns.magnitude_err');
  });

  it('requires supernovae even in an empty file', () => {
    const issue = only(errorsOf(''), 'config.missing_key');
    expect(issue).toMatchObject({ path: 'supernovae', line: 1, column: 1 });
  });

  it('reports YAML syntax errors with their position and stops there', () => {
    const text = `${VALID_MAGNITUDES}sampler: { walkers: 32\noutput:\n  dir: out\n`;
    const issues = errorsOf(text);
    expect(issues.length).toBeGreaterThan(0);
    expect(issues.every((issue) => issue.code === 'config.yaml_syntax')).toBe(true);
    expect(issues[0].line).toBeGreaterThanOrEqual(lineOf(text, 'sampler: {'));
    expect(issues[0].fix).toBeTruthy();
  });

  it('reports a duplicated key as a syntax error', () => {
    const text = `${VALID_MAGNITUDES}seed: 8\n`;
    const issue = errorsOf(text)[0];
    expect(issue).toMatchObject({ code: 'config.yaml_syntax', line: lineOf(text, 'seed: 8') });
    expect(issue.fix).toBe('keep only one of the two entries with this key');
  });
});

describe('parseConfigText: impossible priors', () => {
  const withParameters = (block: string): string => `${VALID_LIGHT_CURVES}parameters:\n${block}`;

  it.each([
    ['min >= max', '  omega_m: { prior: uniform, min: 1, max: 0 }\n', 'min < max'],
    ['sd <= 0', '  beta: { prior: gaussian, mean: 3.1, sd: 0 }\n', 'sd > 0'],
    ['log_uniform with min <= 0', '  sigma_int: { prior: log_uniform, min: 0, max: 0.5 }\n', 'min > 0'],
    ['truncated gaussian with min >= max', '  alpha: { prior: truncated_gaussian, mean: 0.1, sd: 0.1, min: 0.3, max: 0.2 }\n', 'min < max'],
    ['truncated gaussian far from its interval', '  alpha: { prior: truncated_gaussian, mean: 14, sd: 0.1, min: 0, max: 0.5 }\n', 'an interval within 10 sd of the mean'],
    ['bounds outside the physical range', '  sigma_int: { prior: uniform, min: -0.1, max: 0.5 }\n', 'bounds >= 0'],
  ])('rejects %s', (_, block, expected) => {
    const text = withParameters(block);
    const issue = only(errorsOf(text), 'config.bad_prior');
    expect(issue.line).toBe(lineOf(text, block.trim().slice(0, 12)));
    expect(issue.path).toBe(`parameters.${block.trim().split(':')[0]}`);
    expect(issue.expected).toBe(expected);
    expect(issue.fix).toBeTruthy();
  });

  it('rejects a fixed value outside the physical range', () => {
    const text = withParameters('  sigma_int: { fixed: -0.1 }\n');
    const issue = only(errorsOf(text), 'config.unphysical_value');
    expect(issue).toMatchObject({ path: 'parameters.sigma_int.fixed', expected: '>= 0', found: '-0.1', line: lineOf(text, 'fixed: -0.1') });
  });

  it('rejects a parameter both fixed and with a prior', () => {
    const text = withParameters('  beta: { prior: uniform, min: 0, max: 5, fixed: 3 }\n');
    const issue = only(errorsOf(text), 'config.fixed_and_prior');
    expectLocated(issue, text, 'fixed: 3', 'parameters.beta.fixed');
    expect(issue.fix).toContain('remove fixed');
  });

  it('rejects settings of another prior kind and missing settings', () => {
    const text = withParameters('  beta: { prior: uniform, min: 0, mean: 3 }\n');
    const issues = errorsOf(text);
    expectLocated(only(issues, 'config.key_not_for_prior'), text, 'mean: 3', 'parameters.beta.mean');
    expectLocated(only(issues, 'config.missing_key'), text, 'beta:', 'parameters.beta.max');
  });

  it('asks for { fixed: value } when a bare number is given', () => {
    const text = withParameters('  alpha: 0.14\n');
    const issue = only(errorsOf(text), 'config.wrong_type');
    expectLocated(issue, text, 'alpha: 0.14', 'parameters.alpha');
    expect(issue.fix).toBe('write { fixed: 0.14 }');
  });

  it('rejects omega_k as a sampled parameter (it is derived)', () => {
    const text = withParameters('  omega_k: { prior: uniform, min: -1, max: 1 }\n');
    const issue = only(errorsOf(text), 'config.derived_parameter');
    expectLocated(issue, text, 'omega_k', 'parameters.omega_k');
    expect(issue.fix).toContain('curvature: free');
  });
});

describe('parseConfigText: cross-field rules', () => {
  it('rejects sampling h0 without calibrators, explaining the degeneracy with the offset', () => {
    const text = `${VALID_MAGNITUDES}parameters:\n  h0: { prior: uniform, min: 50, max: 100 }\n`;
    const issue = only(errorsOf(text), 'config.h0_degenerate');
    expect(issue).toMatchObject({ path: 'parameters.h0', line: lineOf(text, 'h0: {'), column: 3 });
    expect(issue.message).toContain('abs_mag - 5 log10(h0)');
    expect(issue.fix).toContain('calibrator_mu');
  });

  it('accepts sampling h0 when a calibrator column is mapped', () => {
    const text = VALID_MAGNITUDES.replace('      magnitude_err: dmb', '      magnitude_err: dmb\n      calibrator_mu: CEPH') +
      'parameters:\n  h0: { prior: uniform, min: 50, max: 100 }\n';
    expect(parseConfigText(text, 'run.yaml').ok).toBe(true);
  });

  it('rejects alpha, beta and mass_step priors for kind magnitudes, naming each', () => {
    const text = `${VALID_MAGNITUDES}parameters:\n  alpha: { prior: uniform, min: 0, max: 1 }\n  beta: { prior: uniform, min: 0, max: 5 }\n` +
      '  mass_step: { prior: uniform, min: -0.2, max: 0.2 }\n';
    const issues = errorsOf(text).filter((issue) => issue.code === 'config.parameter_not_for_kind');
    expect(issues.map((issue) => [issue.path, issue.line])).toEqual([
      ['parameters.alpha', lineOf(text, 'alpha:')], ['parameters.beta', lineOf(text, 'beta:')], ['parameters.mass_step', lineOf(text, 'mass_step:')],
    ]);
    expect(issues[0].message).toContain('alpha does not apply');
    expect(issues.every((issue) => issue.fix?.includes('kind light_curves'))).toBe(true);
  });

  it('rejects a 3N x 3N covariance on data of kind magnitudes', () => {
    const text = VALID_MAGNITUDES.replace('    columns:', '    covariances:\n      - file: c.txt\n        applies_to: light_curve_parameters\n    columns:');
    const issue = only(errorsOf(text), 'config.covariance_needs_light_curves');
    expectLocated(issue, text, 'applies_to: light', 'supernovae[0].covariances[0].applies_to');
    expect(issue.fix).toContain('kind: light_curves');
  });

  it('rejects light-curve columns for kind magnitudes', () => {
    const text = VALID_MAGNITUDES.replace('      magnitude_err: dmb', '      magnitude_err: dmb\n      x1: x1');
    const issue = only(errorsOf(text), 'config.field_not_for_kind');
    expectLocated(issue, text, 'x1: x1', 'supernovae[0].columns.x1');
    expect(issue.fix).toContain('kind: light_curves');
  });

  it('requires twice as many walkers as free parameters, per model', () => {
    // light_curves, global scatter, cpl + free curvature: omega_m, omega_de, w0, wa, alpha, beta, mass_step, sigma_int = 8 free.
    const text = `${VALID_LIGHT_CURVES.replace('{ label: flat_lcdm, dark_energy: lambda }', '{ label: big, dark_energy: cpl, curvature: free }')}` +
      'sampler:\n  walkers: 14\n';
    const issue = only(errorsOf(text), 'config.too_few_walkers');
    expect(issue).toMatchObject({ path: 'sampler.walkers', line: lineOf(text, 'walkers: 14'), expected: 'walkers >= 16', found: '14' });
    expect(issue.message).toContain('model "big" has 8 free parameters');
  });

  it('requires host masses when the host-mass step is on', () => {
    const text = VALID_LIGHT_CURVES.replace('      host_log_mass: mass\n', '');
    const issue = only(errorsOf(text), 'config.missing_column');
    // The path is absent from the file: reported at its nearest ancestor, the columns key.
    expectLocated(issue, text, 'columns:', 'supernovae[0].columns.host_log_mass');
    expect(issue.fix).toContain('host_mass_step.enabled: false');
  });

  it('requires frozen_at with alpha_beta_covariance: frozen', () => {
    const text = `${VALID_LIGHT_CURVES}standardization:\n  alpha_beta_covariance: frozen\n`;
    const issue = only(errorsOf(text), 'config.missing_key');
    expectLocated(issue, text, 'alpha_beta_covariance', 'standardization.frozen_at');
    expect(issue.fix).toContain('frozen_at: { alpha:');
  });

  it('rejects contour pairs naming no parameter of any model', () => {
    const text = `${VALID_MAGNITUDES}output:\n  contour_pairs: [[omega_m, omega_mm]]\n`;
    const issue = only(errorsOf(text), 'config.unknown_parameter');
    expectLocated(issue, text, 'contour_pairs', 'output.contour_pairs[0][1]');
    expect(issue.fix).toBe('did you mean "omega_m"?');
  });
});

describe('parseConfigText: all problems at once', () => {
  it('reports every error of a file in one pass, in file order', () => {
    const text = `seed: 3
supernovae:
  - label: a b
    kind: light_curve
    table: { file: t.txt, delimiter: semicolon }
    columns: { id: name, z: zcmb }
standardization:
  offset: marginalise
models:
  - dark_energy: cpl
    curvature: open
parameters:
  sigma_int: { prior: log_uniform, min: -1, max: 1 }
sampler:
  walkers: -4
`;
    const issues = errorsOf(text);
    expect(issues.map((issue) => [issue.line, issue.path])).toEqual([
      [3, 'supernovae[0].label'],
      [4, 'supernovae[0].kind'],
      [5, 'supernovae[0].table.delimiter'],
      [8, 'standardization.offset'],
      [11, 'models[0].curvature'],
      [13, 'parameters.sigma_int'],
      [15, 'sampler.walkers'],
    ]);
    for (const issue of issues) {
      expect(issue.file).toBe('run.yaml');
      expect(issue.fix, issue.path).toBeTruthy();
    }
    expect(issues[3].fix).toBe('did you mean "marginalize"?');
  });

  it('keeps warnings next to errors but does not fail on warnings alone', () => {
    const noSeed = VALID_MAGNITUDES.replace('seed: 7\n', '') + 'parameters:\n  wa: { prior: uniform, min: -1, max: 1 }\n';
    const result = parseConfigText(noSeed, 'run.yaml');
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.warnings.map((w) => w.code).sort()).toEqual(['config.no_seed', 'config.unused_parameter']);
  });
});
