import { describe, expect, it } from 'vitest';
import { markSvgBlinded, blindingNotice, BLINDED_MARK } from '../../../src/output/index.js';

const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="640" height="400" viewBox="0 0 640 400" role="img">\n<title>Triangle</title>\n<rect/>\n</svg>\n';

describe('markSvgBlinded', () => {
  it('adds a strip below the drawing with the mark, and the mark in the title', () => {
    const marked = markSvgBlinded(svg, ['w0', 'wa']);
    expect(marked).toContain('<title>Triangle (BLINDED)</title>');
    expect(marked).toContain('width="640" height="416" viewBox="0 0 640 416"');
    expect(marked).toMatch(/<g class="blinding-stamp"><rect x="0" y="400" width="640" height="16" fill="#ffffff"\/><text x="4" y="412" [^>]*>BLINDED \(w0, wa\): true value \+ secret offset<\/text><\/g>\n<\/svg>\n$/);
    expect(marked).not.toContain('textLength');
  });

  it('squeezes a stamp wider than the figure into its width', () => {
    const narrow = svg.replace('width="640"', 'width="120"').replace('0 0 640 400', '0 0 120 400');
    expect(markSvgBlinded(narrow, ['omega_m', 'w0', 'wa', 'h0'])).toContain('textLength="112" lengthAdjust="spacingAndGlyphs"');
  });

  it('leaves a document it cannot place a stamp in unchanged', () => {
    expect(markSvgBlinded('<g/>', ['w0'])).toBe('<g/>');
  });
});

describe('blindingNotice', () => {
  it('names the parameters and the way to unblind', () => {
    expect(blindingNotice(['w0'])).toMatch(/^BLINDED: w0 is shown as true value \+ a secret offset/);
    expect(blindingNotice(['w0', 'h0'])).toContain('w0, h0 are shown');
    expect(blindingNotice(['w0'])).toContain('candela unblind');
    expect(BLINDED_MARK).toBe('BLINDED');
  });
});
