import { describe, expect, it } from 'vitest';
import { checkBlindingSupported } from '../../../src/pipeline/blinding/checkBlindingSupported.js';
import { isCandelaError } from '../../../src/errors.js';
import { VALID_MAGNITUDES, configOf, lineOf } from '../../config/configTextHelpers.js';

const blindedText = `${VALID_MAGNITUDES}blinding: { parameters: [omega_m] }\n`;

function issueOf(action: () => void) {
  try {
    action();
  } catch (error) {
    if (isCandelaError(error)) return error.issues[0];
    throw error;
  }
  return null;
}

describe('checkBlindingSupported', () => {
  it('accepts an ensemble fit, blinded or not', () => {
    expect(issueOf(() => checkBlindingSupported(configOf(blindedText).config, false))).toBeNull();
    expect(issueOf(() => checkBlindingSupported(configOf(VALID_MAGNITUDES).config, true))).toBeNull();
  });

  it('refuses nested sampling and cluster parts, pointing at the blinding key with the fix', () => {
    const nestedText = blindedText.replace('models:', 'sampler: { method: nested }\nmodels:');
    const nested = issueOf(() => checkBlindingSupported(configOf(nestedText).config, false));
    expect(nested).toMatchObject({ code: 'blinding.unsupported', file: 'run.yaml', path: 'blinding', line: lineOf(nestedText, 'blinding:'), found: 'sampler.method: nested' });
    expect(nested?.fix).toContain('remove the blinding block');
    const part = issueOf(() => checkBlindingSupported(configOf(blindedText).config, true));
    expect(part).toMatchObject({ code: 'blinding.unsupported', path: 'blinding', found: '--part with a blinding block' });
  });
});
