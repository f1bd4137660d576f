// The check_every rule of the sampler block, and the resolved copy reading back.
import { describe, expect, it } from 'vitest';
import { parseConfigText, resolvedConfigToYaml } from '../../src/config/index.js';
import { VALID_MAGNITUDES, errorsOf } from './configTextHelpers.js';

function parsed(text: string) {
  const result = parseConfigText(text, 'run.yaml');
  if (!result.ok) throw new Error(result.issues.map((issue) => issue.message).join('; '));
  return result.value;
}

describe('readSampler: check_every and max_steps', () => {
  it('an unset check_every never exceeds max_steps (the default, 500, is lowered to a shorter max_steps)', () => {
    const config = parsed(`${VALID_MAGNITUDES}sampler:\n  max_steps: 400\n`);
    expect(config.sampler.maxSteps).toBe(400);
    expect(config.sampler.checkEvery).toBe(400);
  });

  it('an unset check_every keeps the default below max_steps', () => {
    expect(parsed(`${VALID_MAGNITUDES}sampler:\n  max_steps: 2000\n`).sampler.checkEvery).toBe(500);
  });

  it('the resolved copy of a max_steps: 400 configuration validates when read back, to the same sampler', () => {
    const config = parsed(`${VALID_MAGNITUDES}sampler:\n  max_steps: 400\n`);
    const again = parsed(resolvedConfigToYaml(config));
    expect(again.sampler).toEqual(config.sampler);
  });

  it('a check_every written larger than max_steps is still an error with a fix', () => {
    const issues = errorsOf(`${VALID_MAGNITUDES}sampler:\n  max_steps: 400\n  check_every: 500\n`);
    expect(issues.map((issue) => [issue.path, issue.fix])).toEqual([['sampler.check_every', 'lower check_every or raise max_steps']]);
  });
});
