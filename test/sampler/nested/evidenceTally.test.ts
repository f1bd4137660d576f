import { describe, expect, it } from 'vitest';
import { addDeadPoint, createEvidenceTally } from '../../../src/sampler/nested/evidenceTally.js';

describe('addDeadPoint', () => {
  it('accumulates Z = sum w L and H = sum (w L / Z) ln(L / Z) (Skilling 2006, definitions of Z and H)', () => {
    const widths = [0.5, 0.3, 0.2];
    const likelihoods = [0.1, 2, 7];
    const tally = createEvidenceTally();
    widths.forEach((w, k) => addDeadPoint(tally, Math.log(w), Math.log(likelihoods[k])));
    // By hand: Z = 0.05 + 0.6 + 1.4 = 2.05.
    const evidence = 2.05;
    let information = 0;
    widths.forEach((w, k) => (information += ((w * likelihoods[k]) / evidence) * Math.log(likelihoods[k] / evidence)));
    expect(tally.logZ).toBeCloseTo(Math.log(evidence), 14);
    expect(tally.information).toBeCloseTo(information, 13);
  });

  it('ignores zero-likelihood points and starts from ln Z = -Infinity, H = 0', () => {
    const tally = createEvidenceTally();
    expect(tally).toEqual({ logZ: -Infinity, information: 0 });
    addDeadPoint(tally, Math.log(0.5), -Infinity);
    expect(tally).toEqual({ logZ: -Infinity, information: 0 });
    addDeadPoint(tally, Math.log(0.25), Math.log(4));
    expect(tally.logZ).toBeCloseTo(0, 15);
    // One point carrying all the posterior: H = ln(L / Z) = ln 4 (= -ln of its prior mass 1/4).
    expect(tally.information).toBeCloseTo(Math.log(4), 14);
  });
});
