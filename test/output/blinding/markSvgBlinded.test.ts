import { describe, expect, it } from 'vitest';
import { markSvgBlinded, blindingNotice, BLINDED_MARK } from '../../../src/output/index.js';

const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="640" height="400" viewBox="0 0 640 400" role="img">\n<title>Triangle</title>\n<rect/>\n</svg>\n';

describe('markSvgBlinded', () => {
  it('puts the mark in the title and a stamp in the top-right corner, before the closing tag', () => {
    const marked = markSvgBlinded(svg, ['w0', 'wa']);
    expect(marked).toContain('<title>Triangle (BLINDED)</title>');
    expect(marked).toMatch(/<text class="blinding-stamp" x="636" [^>]*>BLINDED \(w0, wa: true value \+ secret offset\)<\/text>\n<\/svg>\n$/);
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
